import { z } from "zod";

/**
 * The card form on the payment page. The number and code go straight to the
 * payment processor and are never stored or logged by Getterline.
 */
export const CardPaymentSchema = z.object({
  number: z
    .string()
    .transform((s) => s.replace(/[\s-]/g, ""))
    .pipe(z.string().regex(/^\d{12,19}$/, "Enter the card number")),
  expMonth: z.coerce.number().int().min(1, "Month 1–12").max(12, "Month 1–12"),
  expYear: z.coerce.number().int().min(2024, "Enter the year, e.g. 2029").max(2100),
  cvc: z.string().regex(/^\d{3,4}$/, "3 or 4 digits"),
  /** Set by the page once per attempt, so a retried request charges once. */
  attemptKey: z.string().min(8).max(80),
});
export type CardPayment = z.infer<typeof CardPaymentSchema>;

export const ShipmentSchema = z.object({
  carrier: z.string().trim().min(2, "Name the carrier").max(60),
  tracking: z.string().trim().min(4, "Enter the tracking number").max(80),
});

/**
 * What we read of a processor event (it is signed, but its contents are another system's: an event from
 * another integration on the same processor account is signed just the same).
 */
export const ProcessorEventSchema = z.object({
  id: z.string().min(1).max(64),
  type: z.string().min(1).max(64),
  data: z.object({ object: z.record(z.string(), z.unknown()) }),
});

/** The payment intent an event carries: only the fields we use, each checked. */
export const ProcessorIntentSchema = z.object({
  id: z.string().regex(/^pi_[A-Za-z0-9_]{1,60}$/, "not a payment intent id"),
  object: z.literal("payment_intent"),
  amount: z.number().int().min(0).max(99_999_999),
  latest_charge: z.union([z.string().max(64), z.object({ id: z.string().max(64) }), z.null()]).optional(),
  last_payment_error: z.object({ message: z.string().optional() }).nullable().optional(),
  metadata: z.record(z.string(), z.string()).default({}),
});
export type ProcessorIntent = z.infer<typeof ProcessorIntentSchema>;

/** The metadata our own payments carry; anything else is not ours. */
export const OurPaymentMetadataSchema = z.object({ invoice_id: z.uuid() });
