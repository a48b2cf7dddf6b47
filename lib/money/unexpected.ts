/**
 * A successful charge an invoice does not owe, and why: our own product words [SUG]. Such a charge is
 * refunded in full as soon as the processor reports it (lib/services/unexpected-charges.ts).
 */
export type UnexpectedWhy = "second-payment" | "wrong-amount" | "invoice-closed";

export const UNEXPECTED_WHY_WORDS: Record<UnexpectedWhy, string> = {
  "second-payment": "a second payment for an invoice already paid",
  "wrong-amount": "a payment of another amount than the invoice's",
  "invoice-closed": "a payment for an invoice that was closed and replaced",
};
