import { z } from "zod";
import { lineText, multilineText } from "./text";

/** A tube put on the unconfirmed shelf: shared by the shelf form and POST /api/shelf. */
export const ShelfTubeSchema = z.object({
  designation: z.string().trim().min(1, "Enter the designation").max(40),
  labelBrand: lineText().trim().max(120),
  sourceCode: z.string().trim().max(16).nullable(),
  dateCode: z.string().trim().max(16).nullable(),
  features: z
    .record(z.string().max(40), z.string().max(80))
    .refine((f) => Object.keys(f).length <= 30, "At most 30 features"),
  notes: multilineText().trim().max(2000),
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
