import { z } from "zod";

/**
 * The card form on the payment page. The number and code go straight to the
 * payment processor and are never stored or logged by Getterline.
 */
export const CardPaymentSchema = z.object({
  number: z.string().transform((s) => s.replace(/[\s-]/g, "")).pipe(z.string().regex(/^\d{12,19}$/, "Enter the card number")),
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
