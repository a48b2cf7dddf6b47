/**
 * What a buyer gets back beyond hammer and premium when goods go back to the
 * consignor under an upheld claim [SUG: our own rules]:
 * - Shipping and tax follow the goods. A full return refunds the invoice's
 *   shipping and tax in full; a partial return refunds the returned share of
 *   each, split from the whole by largest remainder (./apportion), so the
 *   returned and kept shares always add back to what was charged.
 * - Return postage the buyer paid is repaid, up to a cap, and borne by the
 *   consignor, as the hammer refund is (their listing sent the goods back).
 * Ledger: the card refund returns held escrow plus the shipping and tax still
 * owed onward (shipping-payable, tax-payable); the postage is charged to the
 * consignor (consignor-payable) and paid out of cash.
 */
import { apportionCents } from "./apportion";
import { assertCents } from "./cents";
import { entriesFrom, type LedgerEntry } from "./ledger";

/** The most return postage the house repays on one claim: $150.00 [SUG]. */
export const MAX_RETURN_POSTAGE_CENTS = 15_000;

/** The shipping and tax refunded with returned goods. */
export interface ReturnedCharges {
  shippingCents: number;
  taxCents: number;
}

/**
 * The returned share of an invoice's shipping and tax. `returned` is the
 * reference value of the goods sent back and `lot` the whole lot's (the same
 * line values the refund uses); equal values mean a full return.
 * Worked example [SUG]: shipping $12.35, tax $8.01, a quarter of the lot
 * returned ($250 of $1,000) → shipping 309 cents, tax 200 cents (the parts
 * kept are 926 and 601 cents; each pair adds back to the whole).
 */
export function returnedCharges(
  invoice: ReturnedCharges,
  share: { returnedValueCents: number; lotValueCents: number },
): ReturnedCharges {
  const shipping = assertCents(invoice.shippingCents, "shippingCents");
  const tax = assertCents(invoice.taxCents, "taxCents");
  const returned = assertCents(share.returnedValueCents, "returnedValueCents");
  const lot = assertCents(share.lotValueCents, "lotValueCents");
  if (lot <= 0) throw new RangeError("lotValueCents must be above zero");
  if (returned > lot) throw new RangeError("the returned value exceeds the lot's value");
  if (returned === lot) return { shippingCents: shipping, taxCents: tax };
  if (returned === 0) return { shippingCents: 0, taxCents: 0 };
  const weights = [returned, lot - returned];
  return { shippingCents: apportionCents(shipping, weights)[0]!, taxCents: apportionCents(tax, weights)[0]! };
}

/** The postage to repay: what the buyer paid, never above the cap (and never negative). */
export function repayablePostage(paidCents: number): number {
  return Math.min(assertCents(paidCents, "postageCents"), MAX_RETURN_POSTAGE_CENTS);
}

/**
 * The card refund of returned goods while the payment is still held:
 * hammer + premium out of escrow, shipping and tax out of what was owed onward.
 */
export function returnRefundEntries(refund: { heldCents: number } & ReturnedCharges): LedgerEntry[] {
  const held = assertCents(refund.heldCents, "heldCents");
  const total = held + refund.shippingCents + refund.taxCents;
  return entriesFrom([
    ["escrow-held", held],
    ["shipping-payable", assertCents(refund.shippingCents, "shippingCents")],
    ["tax-payable", assertCents(refund.taxCents, "taxCents")],
    ["cash", -total],
  ]);
}

/** Return postage repaid to the buyer, charged to the consignor. */
export function returnPostageEntries(postageCents: number): LedgerEntry[] {
  const postage = assertCents(postageCents, "postageCents");
  return entriesFrom([
    ["consignor-payable", postage],
    ["cash", -postage],
  ]);
}
