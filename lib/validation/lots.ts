import { z } from "zod";
import { centsColumn, COLUMN_LENGTHS, multilineColumn, textColumn } from "./columns";
import { lineText, multilineText } from "./text";

const text = textColumn;
const longText = multilineColumn;
const ITEM = COLUMN_LENGTHS.lot_items;

export const TESTER_KIND_VALUES = ["untested", "mutual-conductance", "emission", "curve-tracer", "other"] as const;
export const CONDITION_VALUES = ["new-in-box", "new-old-stock", "used"] as const;
export const BASIS_VALUES = ["source-code-confirmed", "construction-matched", "unconfirmed"] as const;
export const HAZARD_VALUES = ["beryllium-oxide", "radioactive", "mercury-vapour", "glass"] as const;

/** The lot's own details: shared by the consignor's form and POST/PATCH /api/lots. */
export const LotDetailsSchema = z.object({
  title: lineText().trim().min(3, "Give the lot a title of at least 3 characters").max(140),
  provenance: longText(4000),
  shippingOrigin: text(140),
  testerKind: z.enum(TESTER_KIND_VALUES, { message: "Choose how the tubes were tested" }),
  testerNotes: longText(500),
});
export type LotDetailsInput = z.infer<typeof LotDetailsSchema>;

const reading = z.number().finite().positive("Readings are positive numbers").max(100_000);

/** One tester run on one tube of an item. */
export const ReadingSchema = z.object({
  tubeNo: z.number().int().min(1).max(10_000),
  measure: z.enum(["gm", "emission", "plate-current"]),
  sections: z.array(reading).max(4),
  chartNewValue: reading.optional(),
  plateCurrentMa: reading.optional(),
  shorts: z.boolean().optional(),
  leakage: z.boolean().optional(),
  gas: z.boolean().optional(),
});
export type ReadingInput = z.infer<typeof ReadingSchema>;

/** One line of a lot: shared by the item form, the grid and POST/PATCH /api/lots/:id/items. */
export const ItemSchema = z
  .object({
    designation: textColumn(ITEM.designation).min(1, "Enter the designation as printed"),
    quantity: z.number().int("Whole tubes only").min(1, "At least 1").max(10_000),
    labelBrand: text(ITEM.label_brand),
    makerName: text(ITEM.maker_name).nullable(),
    makerBasis: z.enum(BASIS_VALUES),
    sourceCode: text(ITEM.source_code).nullable(),
    dateCode: text(ITEM.date_code).nullable(),
    features: z
      .record(z.string().max(40), z.string().max(80))
      .refine((f) => Object.keys(f).length <= 30, "At most 30 features"),
    condition: z.enum(CONDITION_VALUES, { message: "Choose the condition" }),
    vacuumLoss: z.boolean(),
    /** Listed as one matched set (pair, quad…): refunds treat it as one line. */
    soldAsSet: z.boolean().optional(),
    defects: z.array(text(ITEM.defect)).max(10),
    hazards: z.array(z.enum(HAZARD_VALUES)).max(4),
    readings: z.array(ReadingSchema).max(500),
    notes: multilineColumn(ITEM.notes),
  })
  .refine((i) => i.readings.every((r) => r.sections.length > 0 || r.shorts || r.leakage || r.gas), {
    message: "Each reading needs a section value, or a short, leakage or gas failure",
    path: ["readings"],
  })
  .refine((i) => i.readings.every((r) => r.tubeNo <= i.quantity), {
    message: "A reading names a tube number above the quantity",
    path: ["readings"],
  })
  .refine((i) => !i.soldAsSet || i.quantity >= 2, {
    message: "A matched set has at least 2 tubes",
    path: ["soldAsSet"],
  })
  .refine((i) => i.makerBasis === "unconfirmed" || Boolean(i.makerName), {
    message: "Name the maker, or mark it unconfirmed",
    path: ["makerName"],
  })
  .refine((i) => i.makerBasis !== "source-code-confirmed" || Boolean(i.sourceCode), {
    message: "A source-code confirmation needs the source code",
    path: ["sourceCode"],
  });
export type ItemInput = z.infer<typeof ItemSchema>;

/** A new line before anything is filled in: the item form's starting values, and the base of demo items. */
export const BLANK_ITEM: ItemInput = {
  designation: "",
  quantity: 1,
  labelBrand: "",
  makerName: null,
  makerBasis: "unconfirmed",
  sourceCode: null,
  dateCode: null,
  features: {},
  condition: "used",
  vacuumLoss: false,
  defects: [],
  hazards: [],
  readings: [],
  notes: "",
};

/** Blank section boxes in a form arrive as undefined: the form drops them before checking. */
export function withoutBlankSections(values: ItemInput): ItemInput {
  return {
    ...values,
    readings: values.readings.map((r) => ({
      ...r,
      sections: r.sections.filter((x) => typeof x === "number" && !Number.isNaN(x)),
    })),
  };
}

/** The house's decision on a submitted lot. Money in cents. */
export const ReviewDecisionSchema = z.discriminatedUnion("action", [
  z.object({
    action: z.literal("request-changes"),
    comment: multilineText().trim().min(5, "Say what needs changing").max(4000),
  }),
  z
    .object({
      action: z.literal("approve"),
      comment: text(4000),
      estimateLowCents: centsColumn(),
      estimateHighCents: centsColumn(),
      reserveCents: centsColumn(),
      reserveAgreed: z.literal(true, { message: "Approve only with a reserve the consignor has agreed" }),
    })
    .refine((d) => d.estimateHighCents >= d.estimateLowCents, {
      message: "The high estimate is below the low",
      path: ["estimateHighCents"],
    })
    .refine((d) => d.reserveCents <= d.estimateLowCents, {
      message: "By convention the reserve is at most the low estimate",
      path: ["reserveCents"],
    }),
  z.object({
    action: z.literal("decline"),
    comment: multilineText().trim().min(5, "Say why the lot is declined").max(4000),
  }),
]);
export type ReviewDecision = z.infer<typeof ReviewDecisionSchema>;

/** A correction after approval: visible and dated on the lot page. */
export const AmendmentSchema = z.object({
  itemId: z.uuid().nullable(),
  description: multilineText().trim().min(5, "Describe the correction").max(2000),
  quantity: z.number().int().min(1).max(10_000).optional(),
  vacuumLoss: z.boolean().optional(),
  condition: z.enum(CONDITION_VALUES).optional(),
  notes: longText(1000).optional(),
});
export type AmendmentInput = z.infer<typeof AmendmentSchema>;
