import { z } from "zod";
import { COLUMN_LENGTHS } from "./columns";
import { lineText, multilineText } from "./text";
import { BASE_FAMILY_LABELS } from "../valves/designation/base-families";
import type { BaseFamily } from "../valves/index-types";
import { VALVE_KINDS, type ValveKind } from "../valves/reference-row";
import { parseRowSource } from "../valves/sources";

/** A designation as typed (normalised later by the decoder); bounded so a 10 KB string is a 400. */
export const DesignationParam = z
  .string()
  .trim()
  .min(1, "Enter a designation")
  .max(40, "A designation is at most 40 characters");

/** GET /api/valves/date-codes/{code}?type=… */
export const DateCodeQuery = z.object({
  code: z.string().trim().min(1, "Enter a code").max(24, "A date code is at most 24 characters"),
  type: z.string().trim().max(40, "A designation is at most 40 characters").optional(),
  endOfProduction: z.coerce.number().int().min(1930).max(2030).optional(),
});
export type DateCodeQueryInput = z.infer<typeof DateCodeQuery>;

const positive = z.number().finite().positive().max(1_000_000);

/** Correction of a reference row by the house (PATCH /api/valves/types/{designation}). */
export const ReferenceEditSchema = z.object({
  reason: multilineText().trim().min(5, "Say why (at least 5 characters)").max(500),
  source: z
    .string()
    .trim()
    .max(40)
    .refine((v) => parseRowSource(v) !== undefined, "Use a tag from the sources list, e.g. REG MEM, EU-DS ✓, CTP, MEM"),
  heaterVolts: positive.nullable(),
  heaterAmps: positive.nullable(),
  introducedYear: z.number().int().min(1900).max(2030).nullable(),
  plateVolts: positive.nullable(),
  gridVolts: z.number().finite().min(-500).max(0).nullable(),
  screenVolts: positive.nullable(),
  mu: positive.nullable(),
  gmMicromho: positive.nullable(),
  plateCurrentMa: positive.nullable(),
  rpOhms: positive.nullable(),
  note: multilineText().trim().max(500),
});
export type ReferenceEditInput = z.infer<typeof ReferenceEditSchema>;

/** Recording that a row was checked against a data sheet (POST /api/valves/types/{designation}/verify). */
export const ReferenceVerifySchema = z.object({
  against: lineText().trim().min(3, "Name the data sheet or handbook page").max(200),
});

/** The house adds a type (POST /api/valves/types). Figures may be left empty: never invent one to fill a column. */
export const ReferenceAddSchema = z
  .object({
    designation: DesignationParam.max(
      COLUMN_LENGTHS.valve_types.designation,
      `A reference designation is at most ${COLUMN_LENGTHS.valve_types.designation} characters`,
    ),
    aliases: z
      .string()
      .trim()
      .max(400)
      .refine(
        (v) => v.split(/[;,]/).every((a) => a.trim().length <= COLUMN_LENGTHS.valve_types.alias),
        `Each alias is at most ${COLUMN_LENGTHS.valve_types.alias} characters`,
      ),
    kind: z.enum(VALVE_KINDS as [ValveKind, ...ValveKind[]]),
    base: z.enum(Object.keys(BASE_FAMILY_LABELS) as [BaseFamily, ...BaseFamily[]]),
    coldCathode: z.boolean(),
    heaterVolts: positive.nullable(),
    heaterAmps: positive.nullable(),
    source: z
      .string()
      .trim()
      .max(COLUMN_LENGTHS.valve_types.source)
      .refine(
        (v) => parseRowSource(v) !== undefined,
        "Use a tag from the sources list, e.g. REG MEM, EU-DS ✓, CTP, MEM",
      ),
    note: multilineText().trim().max(500),
    reason: multilineText().trim().min(5, "Say why (at least 5 characters)").max(500),
  })
  .refine((v) => (v.heaterVolts === null) === (v.heaterAmps === null), {
    message: "Give heater volts and amps together, or neither",
    path: ["heaterAmps"],
  });
export type ReferenceAddInput = z.infer<typeof ReferenceAddSchema>;

/** Retiring a type (POST /api/valves/types/{designation}/retire). */
export const ReferenceRetireSchema = z.object({
  reason: multilineText().trim().min(5, "Say why (at least 5 characters)").max(500),
  retired: z.boolean(),
});

/** CSV import of the reference table (POST /api/valves/types/import): preview first, then apply. */
export const ReferenceImportSchema = z.object({
  csv: z
    .string()
    .min(1, "Paste or choose a CSV file")
    .max(2 * 1024 * 1024, "At most 2 MB"),
  apply: z.boolean(),
  reason: multilineText().trim().min(5, "Say why (at least 5 characters)").max(500),
});

/** Most tubes one grading request may carry; a bigger batch is split by the caller. */
export const MAX_GRADE_TUBES = 20_000;

const Reading = z.number().finite().positive().max(100_000);

/** POST /api/valves/grade */
export const GradeRequestSchema = z.object({
  measure: z.enum(["gm", "emission", "plate-current"]).default("gm"),
  chartNewValue: Reading.optional(),
  thresholds: z
    .object({
      strongMinPct: z.number().min(1).max(500),
      goodMinPct: z.number().min(1).max(500),
      fairMinPct: z.number().min(1).max(500),
      rejectBelowPct: z.number().min(0).max(500),
      sectionBalanceMaxSpreadPct: z.number().min(0.1).max(100),
    })
    .partial()
    .optional(),
  tolerancePct: z.number().gt(0).lt(100).default(5),
  onPlateCurrent: z.boolean().default(false),
  tubes: z
    .array(
      z.object({
        id: z.string().trim().min(1).max(64),
        sections: z.array(Reading).max(4, "At most 4 sections per tube"),
        chartNewValue: Reading.optional(),
        plateCurrentMa: Reading.optional(),
        shorts: z.boolean().optional(),
        leakage: z.boolean().optional(),
        gas: z.boolean().optional(),
        vacuumLoss: z.boolean().optional(),
        openHeater: z.boolean().optional(),
      }),
    )
    .min(1, "Send at least one tube")
    .max(MAX_GRADE_TUBES, `At most ${MAX_GRADE_TUBES.toLocaleString("en")} tubes per request`)
    .refine((ts) => new Set(ts.map((t) => t.id)).size === ts.length, "Tube ids must be unique"),
});
export type GradeRequest = z.infer<typeof GradeRequestSchema>;
