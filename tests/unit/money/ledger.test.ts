// Check values: [SUG] product rule — our own chart of accounts; worked example: through the books.
import { describe, expect, it } from "vitest";
import { invoiceFor, payoutFor, DEFAULT_FEE_SCHEDULE } from "@/lib/money/fees";
import {
  accountBalances,
  assertBalanced,
  entriesFrom,
  escrowReleasedEntries,
  invoiceIssuedEntries,
  paymentCapturedEntries,
  payoutSentEntries,
  refundEntries,
  unexpectedChargeReceivedEntries,
  unexpectedChargeRefundedEntries,
  type LedgerEntry,
} from "@/lib/money/ledger";
import { figuresAfterRefunds, settlePartialRefund, type SaleFigures } from "@/lib/money/refunds";
import type { ManifestLine } from "@/lib/money/refund-claims";

//: hammer $1,000, premium 15 %, commission 20 % (flat), shipping $40 (our own figure)
const invoice = invoiceFor(
  { hammerCents: 100_000, shippingCents: 4_000 },
  { ...DEFAULT_FEE_SCHEDULE, buyersPremiumBp: 1_500 },
);
const SALE: SaleFigures = { hammerCents: 100_000, premiumCents: 15_000, commissionCents: 20_000 };
const LOT: ManifestLine[] = [
  { lineId: "kestrel-labelled", kind: "singles", quantity: 8, unitValueCents: 5_000 },
  { lineId: "mixed", kind: "singles", quantity: 100, unitValueCents: 1_600 },
];
const refund = settlePartialRefund(SALE, LOT, [
  { kind: "price-adjustment", lineId: "kestrel-labelled", count: 8, actualUnitValueCents: 1_250 },
]);

describe("assertBalanced", () => {
  it("returns the total of a balanced set", () => {
    expect(
      assertBalanced([
        { account: "cash", debitCents: 500 },
        { account: "escrow-held", creditCents: 500 },
      ]),
    ).toBe(500);
  });

  it("rejects unbalanced, empty, zero, negative, fractional and two-sided entries", () => {
    expect(() =>
      assertBalanced([
        { account: "cash", debitCents: 500 },
        { account: "escrow-held", creditCents: 499 },
      ]),
    ).toThrow(/unbalanced/);
    expect(() => assertBalanced([])).toThrow(RangeError);
    expect(() =>
      assertBalanced([
        { account: "cash", debitCents: 0 },
        { account: "escrow-held", creditCents: 0 },
      ]),
    ).toThrow(/zero/);
    expect(() =>
      assertBalanced([
        { account: "cash", debitCents: -5 },
        { account: "escrow-held", debitCents: 5 },
      ]),
    ).toThrow(RangeError);
    expect(() =>
      assertBalanced([
        { account: "cash", debitCents: 1.5 },
        { account: "escrow-held", creditCents: 1.5 },
      ]),
    ).toThrow(RangeError);
    const twoSided = { account: "cash", debitCents: 5, creditCents: 5 } as unknown as LedgerEntry;
    expect(() => assertBalanced([twoSided])).toThrow(/exactly one/);
  });

  it("entriesFrom drops zero lines and refuses signed amounts that do not net to zero", () => {
    expect(
      entriesFrom([
        ["cash", 10],
        ["tax-payable", 0],
        ["escrow-held", -10],
      ]),
    ).toHaveLength(2);
    expect(() =>
      entriesFrom([
        ["cash", 10],
        ["escrow-held", -9],
      ]),
    ).toThrow(/unbalanced/);
  });
});

describe("builders each return a balanced set", () => {
  it.each([
    ["invoice issued", () => invoiceIssuedEntries(invoice), 119_000],
    ["payment captured", () => paymentCapturedEntries(invoice, 3_500), 119_000 + 115_000],
    ["escrow released", () => escrowReleasedEntries({ ...SALE, feesCents: 500 }), 115_000],
    ["payout sent", () => payoutSentEntries(68_000), 68_000],
    ["refund while held", () => refundEntries(refund, "held"), 17_250],
    ["refund after release", () => refundEntries(refund, "released"), 17_250],
    ["unexpected charge received", () => unexpectedChargeReceivedEntries(119_000, 3_481), 119_000],
    ["unexpected charge refunded", () => unexpectedChargeRefundedEntries(119_000), 119_000],
  ] as const)("%s", (_name, build, total) => {
    expect(assertBalanced(build())).toBe(total);
  });
});

describe("a charge the buyer did not owe, through the books [SUG]", () => {
  it("received then refunded in full: the buyer is owed nothing, and cash is down by exactly the processor's kept fee", () => {
    // Processor practice (its published refund terms, from memory): a refund does not return the processing fee.
    const b = accountBalances([unexpectedChargeReceivedEntries(5_000, 175), unexpectedChargeRefundedEntries(5_000)]);
    expect(b["unexpected-charges-payable"]).toBe(0);
    expect(b.cash).toBe(-175);
    expect(b["processor-fees"]).toBe(175);
    expect(b["escrow-held"]).toBe(0);
  });
});

describe("the §9.22 worked example through the books", () => {
  it("refund while held: escrow returns $172.50, release pays $680 to the consignor [SUG]", () => {
    const remaining = figuresAfterRefunds(SALE, [refund]);
    expect(remaining).toEqual({ hammerCents: 85_000, premiumCents: 12_750, commissionCents: 17_000 });
    const payout = payoutFor({
      hammerCents: 100_000,
      commissionCents: 20_000,
      refundsCents: -refund.consignorChangeCents,
    });
    expect(payout.payoutCents).toBe(68_000); // 1,000 − 200 − 120
    const sets = [
      invoiceIssuedEntries(invoice),
      paymentCapturedEntries(invoice, 3_500),
      refundEntries(refund, "held"),
      escrowReleasedEntries(remaining),
      payoutSentEntries(payout.payoutCents),
    ];
    sets.forEach((set) => assertBalanced(set));
    const b = accountBalances(sets);
    expect(b["escrow-held"]).toBe(0);
    expect(b["buyer-receivable"]).toBe(0);
    expect(b["awaiting-payment"]).toBe(0);
    expect(b["consignor-payable"]).toBe(0);
    expect(b["house-revenue-premium"]).toBe(-12_750); // $150 − $22.50
    expect(b["house-revenue-commission"]).toBe(-17_000); // $200 − $30
    expect(b["shipping-payable"]).toBe(-4_000);
    expect(b["processor-fees"]).toBe(3_500);
    expect(b.cash).toBe(119_000 - 3_500 - 17_250 - 68_000);
    expect(Object.values(b).reduce((a, v) => a + v, 0)).toBe(0);
  });

  it("refund after release lands on the same net position for house and consignor", () => {
    const sets = [
      invoiceIssuedEntries(invoice),
      paymentCapturedEntries(invoice, 3_500),
      escrowReleasedEntries(SALE),
      refundEntries(refund, "released"),
    ];
    const b = accountBalances(sets);
    expect(b["consignor-payable"]).toBe(-68_000); // $800 owed − $120 refund share
    expect(b["refunds-paid"]).toBe(5_250); // $30 commission + $22.50 premium given back
    const houseNet = -(b["house-revenue-premium"] + b["house-revenue-commission"] + b["refunds-paid"]);
    expect(houseNet).toBe(12_750 + 17_000);
    expect(b["escrow-held"]).toBe(0);
  });
});
