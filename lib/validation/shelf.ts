import { z } from "zod";
import { COLUMN_LENGTHS, multilineColumn, textColumn } from "./columns";

const SHELF = COLUMN_LENGTHS.shelf_tubes;

/** A tube put on the unconfirmed shelf: shared by the shelf form and POST /api/shelf. */
export const ShelfTubeSchema = z.object({
  designation: textColumn(SHELF.designation).min(1, "Enter the designation"),
  labelBrand: textColumn(SHELF.label_brand),
  sourceCode: textColumn(SHELF.source_code).nullable(),
  dateCode: textColumn(SHELF.date_code).nullable(),
  features: z
    .record(z.string().max(40), z.string().max(80))
    .refine((f) => Object.keys(f).length <= 30, "At most 30 features"),
  notes: multilineColumn(SHELF.notes),
  /** Set by the form once per submission, so a retried request adds nothing. */
  clientKey: z.string().trim().min(8).max(64).nullable(),
});
export type ShelfTubeInput = z.infer<typeof ShelfTubeSchema>;

/** POST /api/valves/attribution: construction features in, ranked makers out. */
export const AttributionQuerySchema = z.object({
  features: z
    .record(z.string().max(40), z.union([z.string().max(80), z.number(), z.boolean()]))
    .refine((f) => Object.keys(f).length <= 30, "At most 30 features"),
  designation: z.string().trim().max(40).optional(),
  year: z.number().int().min(1900).max(2030).optional(),
});
export type AttributionQuery = z.infer<typeof AttributionQuerySchema>;
