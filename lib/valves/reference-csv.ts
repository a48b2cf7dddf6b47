// The house's reference table as CSV: one row per type, our own column names.
// Parsing checks every line and reports errors by line number; applying is
// the service's job (all or nothing, unchanged rows skipped, so importing the
// same file twice changes nothing).

import { parse } from "csv-parse/sync";
import { z } from "zod";
import { COLUMN_LENGTHS } from "../validation/columns";
import { BASE_FAMILY_LABELS } from "./designation/base-families";
import { normaliseDesignation } from "./designation/normalise";
import type { BaseFamily } from "./index-types";
import {
  VALVE_KINDS,
  type NominalCharacteristics,
  type ReferenceHeater,
  type ReferenceType,
  type ValveKind,
} from "./reference-row";
import { parseRowSource } from "./sources";

/** Columns, in file order. */
export const REFERENCE_CSV_COLUMNS = [
  "designation",
  "aliases",
  "kind",
  "base",
  "heater_volts",
  "heater_amps",
  "parallel_volts",
  "parallel_amps",
  "filament",
  "cold_cathode",
  "plate_volts",
  "grid_volts",
  "screen_volts",
  "mu",
  "gm_umho",
  "plate_ma",
  "rp_ohms",
  "source",
  "verified_against",
  "verified_by",
  "verified_on",
  "note",
] as const;

const num = z
  .union([z.literal(""), z.coerce.number().finite().min(-1000).max(1_000_000)])
  .transform((v) => (v === "" ? undefined : v));
const yesNo = z.enum(["", "yes", "no"]).transform((v) => v === "yes");
const text = (max: number) => z.string().trim().max(max);
/** What the valve_types table holds: a longer value is refused here by column, never cut short or a database error. */
const HELD = COLUMN_LENGTHS.valve_types;
const tooLong = (max: number) => `is longer than ${max} characters (the reference table holds at most ${max})`;

/** One CSV line as validated fields. */
export const ReferenceCsvLine = z.object({
  designation: z.string().trim().min(1, "is required").max(HELD.designation, tooLong(HELD.designation)),
  aliases: text(400),
  kind: z.enum(VALVE_KINDS as [ValveKind, ...ValveKind[]], { message: "is not a kind we use" }),
  base: z.enum(Object.keys(BASE_FAMILY_LABELS) as [BaseFamily, ...BaseFamily[]], {
    message: "is not a base family we use",
  }),
  heater_volts: num,
  heater_amps: num,
  parallel_volts: num,
  parallel_amps: num,
  filament: yesNo,
  cold_cathode: yesNo,
  plate_volts: num,
  grid_volts: num,
  screen_volts: num,
  mu: num,
  gm_umho: num,
  plate_ma: num,
  rp_ohms: num,
  source: z
    .string()
    .trim()
    .max(HELD.source, tooLong(HELD.source))
    .refine(
      (s) => parseRowSource(s) !== undefined,
      "must be a tag from the sources list, e.g. REG MEM, EU-DS ✓, CTP, MEM",
    ),
  verified_against: text(200),
  verified_by: text(120),
  verified_on: z.union([z.literal(""), z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "must be a date (YYYY-MM-DD)")]),
  note: text(500),
});

/** A line's error, in words for the house. */
export interface ReferenceCsvError {
  line: number;
  column?: string;
  message: string;
}

/** What a parsed line stands for: the row, and its line number. */
export interface ReferenceCsvRow {
  line: number;
  row: ReferenceType;
}

const key = (v: string) => {
  const n = normaliseDesignation(v);
  return n.ok ? n.value : undefined;
};

function toRow(
  l: z.infer<typeof ReferenceCsvLine>,
  line: number,
  errors: ReferenceCsvError[],
): ReferenceType | undefined {
  const designation = key(l.designation);
  if (!designation)
    return void errors.push({
      line,
      column: "designation",
      message: `"${l.designation}" cannot be read as a designation`,
    });
  const aliases: string[] = [];
  for (const a of l.aliases
    .split(";")
    .map((s) => s.trim())
    .filter(Boolean)) {
    if (a.length > HELD.alias) {
      errors.push({ line, column: "aliases", message: `"${a}" ${tooLong(HELD.alias)}` });
      continue;
    }
    const k = key(a);
    if (!k) errors.push({ line, column: "aliases", message: `"${a}" cannot be read as a designation` });
    else if (k !== designation && !aliases.includes(k)) aliases.push(k);
  }
  let heater: ReferenceHeater | null | undefined;
  if (l.cold_cathode) heater = null;
  else if (l.heater_volts !== undefined && l.heater_amps !== undefined) {
    heater = {
      volts: l.heater_volts,
      amps: l.heater_amps,
      ...(l.filament ? { filament: true } : {}),
      ...(l.parallel_volts !== undefined && l.parallel_amps !== undefined
        ? { tapped: { volts: l.parallel_volts, amps: l.parallel_amps } }
        : {}),
    };
  } else if (l.heater_volts !== undefined || l.heater_amps !== undefined) {
    errors.push({ line, column: "heater_amps", message: "give heater volts and amps together, or neither" });
  }
  const characteristics: NominalCharacteristics | undefined =
    l.plate_volts === undefined
      ? undefined
      : {
          kind: "amplifier",
          plateVolts: l.plate_volts,
          ...(l.grid_volts !== undefined ? { gridVolts: l.grid_volts } : {}),
          ...(l.screen_volts !== undefined ? { screenVolts: l.screen_volts } : {}),
          ...(l.mu !== undefined ? { mu: l.mu } : {}),
          ...(l.gm_umho !== undefined ? { gmMicromho: l.gm_umho } : {}),
          ...(l.plate_ma !== undefined ? { plateCurrentMa: l.plate_ma } : {}),
          ...(l.rp_ohms !== undefined ? { rpOhms: l.rp_ohms } : {}),
        };
  const verified = [l.verified_against, l.verified_by, l.verified_on];
  if (verified.some(Boolean) && !verified.every(Boolean))
    errors.push({
      line,
      column: "verified_against",
      message: "a check needs the data sheet, who checked and the date",
    });
  return {
    designation,
    aliases,
    kind: l.kind,
    base: l.base,
    ...(heater !== undefined ? { heater } : {}),
    ...(characteristics ? { characteristics } : {}),
    hazards: [],
    source: l.source,
    ...(verified.every(Boolean)
      ? { verification: { against: l.verified_against, by: l.verified_by, on: l.verified_on } }
      : {}),
    ...(l.note ? { note: l.note } : {}),
  };
}

/**
 * Reads a reference CSV: a header naming the columns (any order; designation,
 * kind, base and source required), one type per line. Returns the rows, or
 * every error with its line number (line 1 is the header). A designation or
 * alias may appear once in a file. `columns` lists the header, so that an
 * import can keep what a file leaves out.
 */
export function parseReferenceCsv(
  csv: string,
  maxRows = 5000,
): { rows: ReferenceCsvRow[]; errors: ReferenceCsvError[]; columns: string[] } {
  const errors: ReferenceCsvError[] = [];
  let records: string[][];
  try {
    records = parse(csv, { bom: true, skip_empty_lines: true, relax_column_count: true, trim: true }) as string[][];
  } catch (e) {
    return {
      rows: [],
      columns: [],
      errors: [
        {
          line: (e as { lines?: number }).lines ?? 1,
          message: `Not readable as CSV: ${(e as Error).message.slice(0, 200)}`,
        },
      ],
    };
  }
  if (records.length === 0) return { rows: [], columns: [], errors: [{ line: 1, message: "The file is empty" }] };
  const header = records[0]!.map((h) => h.toLowerCase());
  const unknown = header.filter((h) => !(REFERENCE_CSV_COLUMNS as readonly string[]).includes(h));
  if (unknown.length) errors.push({ line: 1, message: `Unknown column(s): ${unknown.join(", ")}` });
  for (const need of ["designation", "kind", "base", "source"])
    if (!header.includes(need)) errors.push({ line: 1, column: need, message: "column is missing" });
  if (records.length - 1 > maxRows) errors.push({ line: 1, message: `At most ${maxRows} rows per file` });
  if (errors.length) return { rows: [], errors, columns: header };
  const rows: ReferenceCsvRow[] = [];
  const seen = new Map<string, number>();
  records.slice(1).forEach((cells, i) => {
    const line = i + 2;
    const fields = Object.fromEntries(REFERENCE_CSV_COLUMNS.map((c) => [c, cells[header.indexOf(c)] ?? ""]));
    const parsed = ReferenceCsvLine.safeParse(fields);
    if (!parsed.success) {
      for (const issue of parsed.error.issues)
        errors.push({ line, column: String(issue.path[0] ?? ""), message: issue.message });
      return;
    }
    const row = toRow(parsed.data, line, errors);
    if (!row) return;
    for (const name of [row.designation, ...row.aliases]) {
      const prev = seen.get(name);
      if (prev !== undefined)
        errors.push({ line, column: "designation", message: `${name} already appears on line ${prev}` });
      else seen.set(name, line);
    }
    rows.push({ line, row });
  });
  return { rows: errors.length ? [] : rows, errors, columns: header };
}

const csvCell = (v: string | number | undefined | null): string => {
  const s = v === undefined || v === null ? "" : String(v);
  return /[",\n\r]/.test(s) || (/^[=+\-@]/.test(s) && Number.isNaN(Number(s))) ? `"${s.replace(/"/g, '""')}"` : s;
};

/** The rows as CSV with REFERENCE_CSV_COLUMNS; parseReferenceCsv reads it back to the same rows (hazards aside). */
export function referenceCsv(rows: readonly ReferenceType[]): string {
  const lines = [REFERENCE_CSV_COLUMNS.join(",")];
  for (const r of rows) {
    const a = r.characteristics?.kind === "amplifier" ? r.characteristics : undefined;
    const v = r.verification;
    lines.push(
      [
        r.designation,
        r.aliases.join(";"),
        r.kind,
        r.base,
        r.heater?.volts,
        r.heater?.amps,
        r.heater?.tapped?.volts,
        r.heater?.tapped?.amps,
        r.heater?.filament ? "yes" : "",
        r.heater === null ? "yes" : "",
        a?.plateVolts,
        a?.gridVolts,
        a?.screenVolts,
        a?.mu,
        a?.gmMicromho,
        a?.plateCurrentMa,
        a?.rpOhms,
        r.source,
        v?.against,
        v?.by,
        v?.on,
        r.note,
      ]
        .map(csvCell)
        .join(","),
    );
  }
  return `${lines.join("\n")}\n`;
}
