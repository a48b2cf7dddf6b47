// Check values: [SUG] our own return rules (lib/money/return-refund.ts): shipping and tax follow returned goods,
// split by the largest-remainder method (the Hamilton method, as in ./apportion.test.ts); postage repaid up to a cap,
// borne by the consignor. Double-entry: every entry set balances (debits = credits).
import { describe, expect, it } from "vitest";
import { accountBalances, assertBalanced } from "@/lib/money/ledger";
import {
  MAX_RETURN_POSTAGE_CENTS,
  repayablePostage,
  returnedCharges,
  returnPostageEntries,
  returnRefundEntries,
} from "@/lib/money/return-refund";

describe("returnedCharges [SUG]", () => {
  it("a full return refunds the invoice's shipping and tax in full", () => {
    expect(
      returnedCharges({ shippingCents: 1_235, taxCents: 801 }, { returnedValueCents: 2_700, lotValueCents: 2_700 }),
    ).toEqual({
      shippingCents: 1_235,
      taxCents: 801,
    });
  });

  it("worked example: a quarter of the lot returned → shipping 309 of 1,235 cents, tax 200 of 801 cents", () => {
    // 1,235 × 1/4 = 308.75 → floor 308, kept 926.25 → floor 926; one cent left goes to the larger remainder (.75) → 309.
    // 801 × 1/4 = 200.25 → 200, kept 600.75 → 601 (the larger remainder takes the cent).
    const r = returnedCharges(
      { shippingCents: 1_235, taxCents: 801 },
      { returnedValueCents: 25_000, lotValueCents: 100_000 },
    );
    expect(r).toEqual({ shippingCents: 309, taxCents: 200 });
    // The kept share is what is left, so returned + kept = charged.
    expect(1_235 - r.shippingCents).toBe(926);
    expect(801 - r.taxCents).toBe(601);
  });

  it("nothing returned refunds nothing; more than the lot is refused", () => {
    expect(
      returnedCharges({ shippingCents: 500, taxCents: 40 }, { returnedValueCents: 0, lotValueCents: 900 }),
    ).toEqual({
      shippingCents: 0,
      taxCents: 0,
    });
    expect(() =>
      returnedCharges({ shippingCents: 500, taxCents: 40 }, { returnedValueCents: 901, lotValueCents: 900 }),
    ).toThrow(RangeError);
  });
});

describe("return postage [SUG]", () => {
  it("repays what the buyer paid, up to the $150.00 cap", () => {
    expect(MAX_RETURN_POSTAGE_CENTS).toBe(15_000);
    expect(repayablePostage(1_840)).toBe(1_840);
    expect(repayablePostage(20_000)).toBe(15_000);
    expect(() => repayablePostage(-1)).toThrow(RangeError);
    expect(() => repayablePostage(12.5)).toThrow(RangeError);
  });
});

describe("ledger entries for a returned lot", () => {
  it("the card refund empties escrow and the shipping and tax owed onward, out of cash, balanced", () => {
    const entries = returnRefundEntries({ heldCents: 3_105, shippingCents: 1_235, taxCents: 801 });
    expect(assertBalanced(entries)).toBe(5_141);
    const b = accountBalances([entries]);
    expect(b["escrow-held"]).toBe(3_105);
    expect(b["shipping-payable"]).toBe(1_235);
    expect(b["tax-payable"]).toBe(801);
    expect(b.cash).toBe(-5_141);
  });

  it("postage is charged to the consignor and paid out of cash", () => {
    const b = accountBalances([returnPostageEntries(1_840)]);
    expect(b["consignor-payable"]).toBe(1_840);
    expect(b.cash).toBe(-1_840);
  });

  it("zero shipping and tax leave those accounts untouched", () => {
    const entries = returnRefundEntries({ heldCents: 3_105, shippingCents: 0, taxCents: 0 });
    expect(entries.map((e) => e.account).sort()).toEqual(["cash", "escrow-held"]);
  });
});
