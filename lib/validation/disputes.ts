import { z } from "zod";
import { lineText, multilineText } from "./text";
import { DISPUTE_REASONS, OUTCOMES, REMEDIES, STANCES } from "../disputes/rules";
import { MAX_RETURN_POSTAGE_CENTS } from "../money/return-refund";
import { ReadingSchema } from "./lots";

const text = (max: number) => lineText().trim().max(max, `At most ${max} characters`);
const code = text(16).nullable().optional();
const cents = z.number().int("Whole cents only").min(0, "Not below zero").max(100_000_000, "Too large");

/** What the buyer reports about one item of the lot. */
export const ClaimedItemSchema = z.object({
  itemId: z.uuid("Choose an item of this lot"),
  tubes: z.number().int("Whole tubes only").min(1, "At least one tube").max(10_000),
  sourceCode: code,
  dateCode: code,
  designationSeen: text(40).nullable().optional(),
  tubesReceived: z.number().int().min(0).max(10_000).nullable().optional(),
  vacuumLoss: z.boolean().optional(),
  features: z
    .record(z.string().max(40), z.string().max(80))
    .refine((f) => Object.keys(f).length <= 30, "At most 30 features")
    .default({}),
  readings: z.array(ReadingSchema).max(100).default([]),
  note: multilineText().trim().max(1000, "At most 1000 characters").optional(),
});
export type ClaimedItemInput = z.infer<typeof ClaimedItemSchema>;

/** The buyer's claim: shared by the claim form and POST /api/invoices/:id/dispute. */
export const OpenDisputeSchema = z.object({
  reason: z.enum(DISPUTE_REASONS, { message: "Choose what is wrong" }),
  remedy: z.enum(REMEDIES, { message: "Choose what you ask for" }),
  statement: multilineText()
    .trim()
    .min(20, "Describe the problem in at least 20 characters")
    .max(4000, "At most 4,000 characters"),
  items: z
    .array(ClaimedItemSchema)
    .min(1, "Name at least one item the claim covers")
    .max(200)
    .refine((items) => new Set(items.map((i) => i.itemId)).size === items.length, "Each item once"),
});
export type OpenDisputeInput = z.infer<typeof OpenDisputeSchema>;

/** A message in a case's conversation; the consignor's first message may carry their stance. */
export const DisputeMessageSchema = z.object({
  body: multilineText().trim().min(2, "Write a message").max(4000, "At most 4,000 characters"),
  stance: z.enum(STANCES).optional(),
  clientKey: z.string().min(8).max(64).optional(),
});
export type DisputeMessageInput = z.infer<typeof DisputeMessageSchema>;

const LineValueSchema = z.object({
  itemId: z.uuid(),
  valueCents: cents.min(1, "A line's value must be above zero"),
  singleValueCents: cents.optional(),
});
const RulingSchema = z.object({
  itemId: z.uuid(),
  upheld: z.boolean(),
  tubes: z.number().int().min(0).max(10_000),
  worthCents: cents.optional(),
});
const reasons = z
  .string()
  .trim()
  .min(20, "Give the reasons in at least 20 characters: both parties receive them")
  .max(8000);

/** The mediator's decision: shared by the workspace form and POST /api/disputes/:id/decision. */
export const DecisionSchema = z.discriminatedUnion("outcome", [
  z.object({ outcome: z.literal(OUTCOMES[0]), reasons }),
  z
    .object({
      outcome: z.literal(OUTCOMES[1]),
      reasons,
      lines: z.array(LineValueSchema).min(1).max(500),
      rulings: z.array(RulingSchema).min(1).max(200),
    })
    .refine((d) => d.rulings.some((r) => r.upheld && r.tubes > 0), {
      message: "Uphold at least one item, or dismiss the claim",
      path: ["rulings"],
    }),
  z.object({ outcome: z.literal(OUTCOMES[2]), reasons }),
]);
export type DecisionInput = z.infer<typeof DecisionSchema>;

/** The buyer's return shipment. */
export const ReturnShipmentSchema = z.object({
  carrier: lineText().trim().min(2, "Name the carrier").max(60),
  tracking: z
    .string()
    .trim()
    .min(4, "Enter the tracking number")
    .max(80)
    .regex(/^[A-Za-z0-9 -]+$/, "Letters, digits, spaces and hyphens only"),
  /** Postage the buyer paid to send the lot back, whole cents, repaid up to the house's cap [SUG]. */
  postageCents: z
    .number({ message: "Enter the postage as an amount, e.g. 18.40" })
    .int("Whole cents only")
    .min(0, "Not below zero")
    .max(
      MAX_RETURN_POSTAGE_CENTS,
      `At most $${(MAX_RETURN_POSTAGE_CENTS / 100).toFixed(2)} is repaid for return postage`,
    )
    .optional(),
  /** The carrier's receipt or label reference for that postage. */
  postageReceipt: text(80).optional(),
});
export type ReturnShipmentInput = z.infer<typeof ReturnShipmentSchema>;

/** The mediator's values and rulings, to see the refund before deciding. */
export const RefundPreviewSchema = z.object({
  lines: z.array(LineValueSchema).min(1).max(500),
  rulings: z.array(RulingSchema).min(1).max(200),
});
export type RefundPreviewInput = z.infer<typeof RefundPreviewSchema>;

/** The mediator's line values, for releasing the undisputed share while a claim is open. */
export const LineValuesSchema = z.object({ lines: z.array(LineValueSchema).min(1).max(500) });
export type LineValuesInput = z.infer<typeof LineValuesSchema>;
