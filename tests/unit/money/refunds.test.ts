// Check values: [SUG] product rule — partial refunds; worked example:.
import { describe, expect, it } from "vitest";
import {
  lotValueCents,
  setDefectClaim,
  validateManifest,
  valueClaimItems,
  type ManifestLine,
  type MatchedSetLine,
} from "@/lib/money/refund-claims";
import {
  figuresAfterRefunds,
  settleLotRejection,
  settlePartialRefund,
  type RefundSettlement,
  type SaleFigures,
} from "@/lib/money/refunds";

// Demo lot (scenario: the Voss estate box). V_lot = $2,000 as in.
const kestrelLine: ManifestLine = { lineId: "6sn7gt-kestrel-nos", kind: "singles", quantity: 8, unitValueCents: 5_000 };
const mixedLine: ManifestLine = { lineId: "mixed-receiving", kind: "singles", quantity: 100, unitValueCents: 1_600 };
const LOT: ManifestLine[] = [kestrelLine, mixedLine];

//: hammer $1,000, premium 15 % = $150; commission at a flat 20 % = $200
const SALE: SaleFigures = { hammerCents: 100_000, premiumCents: 15_000, commissionCents: 20_000 };

function expectReconciles(s: RefundSettlement): void {
  expect(s.buyerRefundCents).toBe(s.hammerRefundCents + s.premiumRefundCents);
  expect(s.consignorChangeCents).toBe(-s.hammerRefundCents + s.commissionReductionCents);
  expect(s.houseChangeCents).toBe(-s.premiumRefundCents - s.commissionReductionCents);
  expect(s.consignorChangeCents + s.houseChangeCents).toBe(-s.buyerRefundCents);
  if (s.items.length > 0) {
    const total = (pick: (i: RefundSettlement["items"][number]) => number) => s.items.reduce((a, i) => a + pick(i), 0);
    expect(total((i) => i.hammerRefundCents)).toBe(s.hammerRefundCents);
    expect(total((i) => i.premiumRefundCents)).toBe(s.premiumRefundCents);
    expect(total((i) => i.commissionReductionCents)).toBe(s.commissionReductionCents);
  }
}

describe("manifest", () => {
  it("V_lot is the sum of line values; a matched set is one line", () => {
    const quad: MatchedSetLine = {
      lineId: "quad",
      kind: "matched-set",
      tubeCount: 4,
      setValueCents: 20_000,
      singleValueCents: 4_000,
    };
    expect(lotValueCents(LOT)).toBe(200_000); //: V_lot $2,000
    expect(lotValueCents([...LOT, quad])).toBe(220_000);
    expect(validateManifest(LOT)).toEqual([]);
    expect(validateManifest([kestrelLine, kestrelLine])).toContain('duplicate line id "6sn7gt-kestrel-nos"');
    expect(validateManifest([{ ...quad, tubeCount: 1 }]).length).toBeGreaterThan(0);
  });
});

describe("settlePartialRefund — worked example [SUG]", () => {
  // Eight tubes listed as Kestrel-made turn out Pellham-made: described $400, actual $100.
  const claim = [
    { kind: "price-adjustment" as const, lineId: kestrelLine.lineId, count: 8, actualUnitValueCents: 1_250 },
  ];
  const s = settlePartialRefund(SALE, LOT, claim);

  it("refunds $150 hammer + $22.50 premium", () => {
    expect(s.claimValueCents).toBe(30_000); // W = 400 − 100
    expect(s.hammerRefundCents).toBe(15_000); // 1,000 × 300 / 2,000
    expect(s.premiumRefundCents).toBe(2_250); // 150 × 300 / 2,000
    expect(s.buyerRefundCents).toBe(17_250);
  });

  it("with a 20 % commission the consignor loses $120 and the house gives back $30 + $22.50", () => {
    expect(s.commissionReductionCents).toBe(3_000);
    expect(s.consignorChangeCents).toBe(-12_000);
    expect(s.houseChangeCents).toBe(-5_250);
    expectReconciles(s);
  });

  it("20 % of V_lot misdescribed does not allow rejecting the lot (threshold 25 %)", () => {
    expect(s.misdescribedValueCents).toBe(40_000);
    expect(s.buyerMayRejectLot).toBe(false);
  });
});

describe("matched sets", () => {
  const quad: MatchedSetLine = {
    lineId: "el34-quad",
    kind: "matched-set",
    tubeCount: 4,
    setValueCents: 20_000,
    singleValueCents: 4_000,
  };
  const lines: ManifestLine[] = [quad, { lineId: "rest", kind: "singles", quantity: 30, unitValueCents: 6_000 }];

  it("a bad tube in a quad costs the set value minus the good tubes as singles, not a quarter [SUG]", () => {
    const claim = setDefectClaim(quad, 3);
    expect(claim).toEqual({ kind: "set-adjustment", lineId: "el34-quad", actualSetValueCents: 12_000 });
    const [valued] = valueClaimItems(lines, [claim]);
    expect(valued.refundValueCents).toBe(8_000); // 200 − 3 × 40 = $80, not 200 / 4 = $50
    const s = settlePartialRefund({ hammerCents: 100_000, premiumCents: 10_000, commissionCents: 15_000 }, lines, [
      claim,
    ]);
    expect(s.hammerRefundCents).toBe(4_000); // 1,000 × 80 / 2,000
    expectReconciles(s);
  });

  it("never values a defect below zero and refuses impossible counts", () => {
    const cheapSet: MatchedSetLine = { ...quad, setValueCents: 10_000 };
    expect(setDefectClaim(cheapSet, 3)).toMatchObject({ actualSetValueCents: 10_000 }); // 3 × 40 > 100 → W = 0
    expect(() => setDefectClaim(quad, 4)).toThrow(RangeError);
  });

  it("a set is returned whole and cannot take per-tube claims", () => {
    expect(valueClaimItems(lines, [{ kind: "return", lineId: "el34-quad" }])[0].refundValueCents).toBe(20_000);
    expect(() => valueClaimItems(lines, [{ kind: "return", lineId: "el34-quad", count: 1 }])).toThrow(/returned whole/);
    expect(() =>
      valueClaimItems(lines, [{ kind: "price-adjustment", lineId: "el34-quad", count: 1, actualUnitValueCents: 0 }]),
    ).toThrow(/one line/);
  });
});

describe("returns, shortfalls and the rejection threshold", () => {
  it("return refund = hammer × V_returned / V_lot", () => {
    const s = settlePartialRefund(SALE, LOT, [{ kind: "return", lineId: "mixed-receiving", count: 10 }]);
    expect(s.hammerRefundCents).toBe(8_000); // 1,000 × 160 / 2,000
    expect(s.premiumRefundCents).toBe(1_200);
    expect(s.commissionReductionCents).toBe(1_600);
    expectReconciles(s);
  });

  it("rejection needs MORE than 25 % of V_lot misdescribed [SUG]", () => {
    // V_lot = 10 × $50 + 100 × $15 = $2,000; the whole first line ($500) is exactly 25 %
    const lines: ManifestLine[] = [
      { ...kestrelLine, quantity: 10 },
      { ...mixedLine, quantity: 100, unitValueCents: 1_500 },
    ];
    const allTen = {
      kind: "price-adjustment" as const,
      lineId: kestrelLine.lineId,
      count: 10,
      actualUnitValueCents: 0,
    };
    const atThreshold = settlePartialRefund(SALE, lines, [allTen]);
    expect(atThreshold.misdescribedValueCents).toBe(50_000);
    expect(atThreshold.buyerMayRejectLot).toBe(false);
    // one more missing tube ($15) tips it over
    const above = settlePartialRefund(SALE, lines, [
      allTen,
      { kind: "shortfall", lineId: "mixed-receiving", count: 1 },
    ]);
    expect(above.misdescribedValueCents).toBe(51_500);
    expect(above.buyerMayRejectLot).toBe(true);
    // a stricter house threshold (20 %) lets the §9.22 lot (20 % + 1 tube) be rejected
    const strict = settlePartialRefund(
      SALE,
      LOT,
      [
        { kind: "price-adjustment", lineId: kestrelLine.lineId, count: 8, actualUnitValueCents: 1_250 },
        { kind: "shortfall", lineId: "mixed-receiving", count: 1 },
      ],
      { rejectThresholdBp: 2_000 },
    );
    expect(strict.buyerMayRejectLot).toBe(true);
  });

  it("refuses claims that do not fit the manifest", () => {
    expect(() => settlePartialRefund(SALE, LOT, [{ kind: "return", lineId: "nope", count: 1 }])).toThrow(
      /unknown line/,
    );
    expect(() => settlePartialRefund(SALE, LOT, [{ kind: "shortfall", lineId: kestrelLine.lineId, count: 9 }])).toThrow(
      /more tubes/,
    );
    expect(() =>
      settlePartialRefund(SALE, LOT, [
        { kind: "return", lineId: kestrelLine.lineId, count: 5 },
        { kind: "shortfall", lineId: kestrelLine.lineId, count: 4 },
      ]),
    ).toThrow(/more tubes/);
    expect(() =>
      settlePartialRefund(SALE, LOT, [
        { kind: "price-adjustment", lineId: kestrelLine.lineId, count: 1, actualUnitValueCents: 6_000 },
      ]),
    ).toThrow(/exceeds the described/);
    expect(() => settlePartialRefund({ ...SALE, hammerCents: 10.5 }, LOT, [])).toThrow(RangeError);
  });
});

describe("rounding and cumulative settlement", () => {
  const thirds: ManifestLine[] = ["a", "b", "c"].map((id) => ({
    lineId: id,
    kind: "singles",
    quantity: 1,
    unitValueCents: 1,
  }));
  const sale: SaleFigures = { hammerCents: 100_000, premiumCents: 10_001, commissionCents: 20_000 };

  it("refunding one line at a time adds up exactly to refunding all at once", () => {
    const steps: RefundSettlement[] = [];
    const settled: { kind: "return"; lineId: string; count: number }[] = [];
    for (const id of ["a", "b", "c"]) {
      const item = { kind: "return" as const, lineId: id, count: 1 };
      steps.push(settlePartialRefund(sale, thirds, [item], { priorItems: settled }));
      settled.push(item);
    }
    // 100,000 / 3: cumulative 33,333 → 66,667 → 100,000, so steps 33,333 + 33,334 + 33,333
    expect(steps.map((s) => s.hammerRefundCents)).toEqual([33_333, 33_334, 33_333]);
    expect(steps.reduce((a, s) => a + s.hammerRefundCents, 0)).toBe(sale.hammerCents);
    expect(steps.reduce((a, s) => a + s.premiumRefundCents, 0)).toBe(sale.premiumCents);
    expect(steps.reduce((a, s) => a + s.commissionReductionCents, 0)).toBe(sale.commissionCents);
    steps.forEach(expectReconciles);
    expect(figuresAfterRefunds(sale, steps)).toEqual({ hammerCents: 0, premiumCents: 0, commissionCents: 0 });
  });

  it("splits a settlement over its items by largest remainder", () => {
    const s = settlePartialRefund(sale, thirds, [
      { kind: "return", lineId: "a", count: 1 },
      { kind: "return", lineId: "b", count: 1 },
    ]);
    expect(s.hammerRefundCents).toBe(66_667); // 100,000 × 2 / 3 = 66,666.67 → half-up
    expect(s.items.map((i) => i.hammerRefundCents)).toEqual([33_334, 33_333]);
    expectReconciles(s);
  });
});

describe("settleLotRejection", () => {
  it("returns everything still unrefunded; with the §9.22 partial refund it completes a full refund", () => {
    const claim = [
      { kind: "price-adjustment" as const, lineId: kestrelLine.lineId, count: 8, actualUnitValueCents: 1_250 },
    ];
    const partial = settlePartialRefund(SALE, LOT, claim);
    const rest = settleLotRejection(SALE, LOT, claim);
    expect(rest.hammerRefundCents).toBe(85_000);
    expect(rest.premiumRefundCents).toBe(12_750);
    expect(rest.commissionReductionCents).toBe(17_000);
    expectReconciles(rest);
    expect(figuresAfterRefunds(SALE, [partial, rest])).toEqual({ hammerCents: 0, premiumCents: 0, commissionCents: 0 });
  });

  it("without earlier refunds gives back hammer + premium and the whole commission", () => {
    const full = settleLotRejection(SALE, LOT);
    expect(full.buyerRefundCents).toBe(115_000);
    expect(full.consignorChangeCents).toBe(-80_000);
    expect(full.houseChangeCents).toBe(-35_000);
  });
});
