import { z } from "zod";
import { SORTS } from "../catalogue/cursor";
import { BASIS_VALUES, CONDITION_VALUES } from "./lots";

/** Sale status as the catalogue shows it. */
export const CATALOGUE_STATUSES = ["approved", "upcoming", "live", "sold"] as const;
export type CatalogueStatus = (typeof CATALOGUE_STATUSES)[number];
export const GRADE_BANDS = ["strong", "good", "fair", "weak"] as const;
export const HAZARD_FILTERS = ["beryllium-oxide", "radioactive", "mercury-vapour", "glass", "none"] as const;
export const SET_FILTERS = ["pairs", "quads"] as const;
export const RECORD_FILTERS = ["clean"] as const;

/** Most a catalogue search may be: longer text is refused, not cut short. */
export const MAX_QUERY_LENGTH = 120;
/** Most a whole search address may be (every filter and the cursor included). */
export const MAX_QUERY_STRING = 2_000;
const CONTROL = /[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069]/;

const many = <T extends readonly [string, ...string[]]>(values: T) =>
  z.array(z.enum(values)).max(values.length).default([]);
const cents = z.coerce.number().int("Whole cents").min(0).max(100_000_000);

/**
 * One catalogue search, as in the page's address and `GET /api/catalogue` (shared). Repeated parameters
 * (`family=12AX7&family=6SN7GT`) mean any of them. Unknown parameters are refused, so a typo is told, not
 * ignored.
 */
export const CatalogueQuerySchema = z
  .object({
    q: z
      .string()
      .trim()
      .max(MAX_QUERY_LENGTH, `Search for at most ${MAX_QUERY_LENGTH} characters`)
      .refine((s) => !CONTROL.test(s), "The search has control characters in it")
      .default(""),
    family: z.array(z.string().trim().min(1).max(40)).max(20).default([]),
    condition: many(CONDITION_VALUES),
    basis: many(BASIS_VALUES),
    tested: z.enum(["yes", "no"]).optional(),
    grade: many(GRADE_BANDS),
    noVacuumLoss: z.enum(["1"]).optional(),
    sets: many(SET_FILTERS),
    hazard: many(HAZARD_FILTERS),
    status: many(CATALOGUE_STATUSES),
    estMinCents: cents.optional(),
    estMaxCents: cents.optional(),
    record: z.enum(RECORD_FILTERS).optional(),
    sort: z.enum(SORTS).optional(),
    cursor: z.string().max(400).optional(),
    limit: z.coerce.number().int().min(1).max(60).default(24),
  })
  .strict();
export type CatalogueQuery = z.infer<typeof CatalogueQuerySchema>;

const MULTI = new Set(["family", "condition", "basis", "grade", "sets", "hazard", "status"]);

/** Reads URL search parameters into the shape the schema checks (repeated names become lists). */
export function searchParamsToObject(
  params: URLSearchParams | Record<string, string | string[] | undefined>,
): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const entries: [string, string][] =
    params instanceof URLSearchParams
      ? [...params.entries()]
      : Object.entries(params).flatMap(([k, v]) =>
          v === undefined
            ? []
            : Array.isArray(v)
              ? v.map((x) => [k, x] as [string, string])
              : [[k, v] as [string, string]],
        );
  for (const [k, v] of entries) {
    if (MULTI.has(k)) out[k] = [...((out[k] as string[] | undefined) ?? []), v];
    else if (k in out)
      out[k] = [out[k] as string, v]; // a single-valued name given twice: the schema refuses it
    else out[k] = v;
  }
  return out;
}

/** Back to an address: the page's links and the "more" link keep every filter. */
export function queryToSearchParams(q: Partial<CatalogueQuery>): URLSearchParams {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(q)) {
    if (v === undefined || v === "" || (k === "limit" && v === 24)) continue;
    if (Array.isArray(v)) for (const x of v) p.append(k, String(x));
    else p.set(k, String(v));
  }
  return p;
}
