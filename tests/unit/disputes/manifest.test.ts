// Check values: [SUG] "Partial refunds" (manifest lines with reference values V;
// price adjustment refund = hammer × (V_described − V_actual)/V_lot; premium refunded and
// commission reduced pro rata; "a matched set is one line: a bad tube in a quad costs the
// set value minus the good tubes' value as singles, not a quarter"); worked example.
// Set prices ($200 quad, $40 singles) are invented inputs; the outputs follow the §8 rule.
// Item names and makers are invented demo names (scenario.md).
import { describe, expect, it } from "vitest";
import {
  buildManifest,
  claimsFromRulings,
  defaultLineValues,
  undisputedShare,
  type LineValue,
  type ManifestItem,
  type Ruling,
} from "@/lib/disputes/manifest";
import { lotValueCents, valueClaimItems } from "@/lib/money/refund-claims";
import { settlePartialRefund, type RefundSettlement, type SaleFigures } from "@/lib/money/refunds";

// A demo lot: 8 × 12AX7 listed as Kestrel-made (line 1), a matched quad of EL34 (line 2),
// and 28 mixed receiving tubes (line 3).
const KESTREL_12AX7: ManifestItem = { id: "item-kestrel", position: 1, quantity: 8, soldAsSet: false };
const EL34_QUAD: ManifestItem = { id: "item-quad", position: 2, quantity: 4, soldAsSet: true };
const MIXED: ManifestItem = { id: "item-mixed", position: 3, quantity: 28, soldAsSet: false };
const ITEMS: ManifestItem[] = [KESTREL_12AX7, EL34_QUAD, MIXED];

// Mediator's values: $50 a tube as described; quad $200 as a set, $40 a tube alone; $50 a mixed tube.
// V_lot = 8 × 50 + 200 + 28 × 50 = $2,000, as in.
const VALUES: LineValue[] = [
  { itemId: "item-kestrel", valueCents: 5_000 },
  { itemId: "item-quad", valueCents: 20_000, singleValueCents: 4_000 },
  { itemId: "item-mixed", valueCents: 5_000 },
];

//: hammer $1,000, premium 15 % = $150; commission a flat 20 % = $200 (our input).
const SALE: SaleFigures = { hammerCents: 100_000, premiumCents: 15_000, commissionCents: 20_000 };

function expectReconciles(s: RefundSettlement): void {
  // [SUG]: premium refunded and commission reduced pro rata; money moved is exact cents.
  for (const v of [
    s.hammerRefundCents,
    s.premiumRefundCents,
    s.commissionReductionCents,
    s.buyerRefundCents,
    s.consignorChangeCents,
    s.houseChangeCents,
  ]) {
    expect(Number.isInteger(v)).toBe(true);
  }
  expect(s.buyerRefundCents).toBe(s.hammerRefundCents + s.premiumRefundCents);
  expect(s.consignorChangeCents + s.houseChangeCents).toBe(-s.buyerRefundCents);
}

describe("buildManifest: one line per item, a matched set is one line [SUG]", () => {
  it("singles and a matched set, with line ids from the item position", () => {
    const lines = buildManifest(ITEMS, VALUES);
    expect(lines).toEqual([
      { lineId: "line-1", kind: "singles", quantity: 8, unitValueCents: 5_000 },
      { lineId: "line-2", kind: "matched-set", tubeCount: 4, setValueCents: 20_000, singleValueCents: 4_000 },
      { lineId: "line-3", kind: "singles", quantity: 28, unitValueCents: 5_000 },
    ]);
    expect(lotValueCents(lines)).toBe(200_000); //: V_lot $2,000
  });

  it("a set without a single value takes its per-tube share, rounded down", () => {
    const [line] = buildManifest([EL34_QUAD], [{ itemId: "item-quad", valueCents: 20_001 }]);
    expect(line).toMatchObject({ kind: "matched-set", setValueCents: 20_001, singleValueCents: 5_000 }); // ⌊20,001 / 4⌋
  });

  it("a 'set' of one tube is a singles line (a set has at least 2 tubes) [SUG]", () => {
    const [line] = buildManifest(
      [{ id: "lone", position: 9, quantity: 1, soldAsSet: true }],
      [{ itemId: "lone", valueCents: 4_000 }],
    );
    expect(line).toEqual({ lineId: "line-9", kind: "singles", quantity: 1, unitValueCents: 4_000 });
  });

  it("an item with no reference value → RangeError naming the line", () => {
    expect(() => buildManifest(ITEMS, VALUES.slice(0, 2))).toThrow(RangeError);
    expect(() => buildManifest(ITEMS, VALUES.slice(0, 2))).toThrow("line 3 has no reference value");
  });
});

describe("defaultLineValues: every tube weighs the same until the mediator enters trade values [SUG]", () => {
  it("equal value per tube; a set's value = per-tube × n, its single value = per-tube", () => {
    // 8 + 4 + 28 = 40 tubes; $1,000 ÷ 40 = $25 a tube
    expect(defaultLineValues(ITEMS, 100_000)).toEqual([
      { itemId: "item-kestrel", valueCents: 2_500 },
      { itemId: "item-quad", valueCents: 10_000, singleValueCents: 2_500 },
      { itemId: "item-mixed", valueCents: 2_500 },
    ]);
  });

  it("per-tube share is rounded to whole cents", () => {
    // $1,000 ÷ 24 tubes = 4,166.67 cents → 4,167
    const items: ManifestItem[] = [{ ...KESTREL_12AX7 }, { ...EL34_QUAD }, { ...MIXED, quantity: 12 }];
    const values = defaultLineValues(items, 100_000);
    expect(values[0].valueCents).toBe(4_167);
    expect(values[1]).toEqual({ itemId: "item-quad", valueCents: 16_668, singleValueCents: 4_167 });
  });

  it("never a zero value, so V_lot stays above zero even at a zero hammer", () => {
    expect(defaultLineValues([MIXED], 0)).toEqual([{ itemId: "item-mixed", valueCents: 1 }]);
  });

  it("with default values a set carries no set premium: one bad tube of the quad costs one share", () => {
    // set 4p − 3 good × p = p: the §8 set rule only bites once the mediator enters set and single values
    const lines = buildManifest(ITEMS, defaultLineValues(ITEMS, 100_000));
    const claims = claimsFromRulings(ITEMS, lines, [{ itemId: "item-quad", upheld: true, tubes: 1 }]);
    expect(valueClaimItems(lines, claims)[0].refundValueCents).toBe(2_500);
  });
});

describe("claimsFromRulings: one claim item per upheld ruling", () => {
  const lines = buildManifest(ITEMS, VALUES);

  it("singles → price adjustment with the tube count and their worth as delivered", () => {
    const claims = claimsFromRulings(ITEMS, lines, [
      { itemId: "item-kestrel", upheld: true, tubes: 8, worthCents: 1_250 },
    ]);
    expect(claims).toEqual([{ kind: "price-adjustment", lineId: "line-1", count: 8, actualUnitValueCents: 1_250 }]);
  });

  it("singles with no worth given → worth nothing as delivered", () => {
    expect(claimsFromRulings(ITEMS, lines, [{ itemId: "item-mixed", upheld: true, tubes: 2 }])).toEqual([
      { kind: "price-adjustment", lineId: "line-3", count: 2, actualUnitValueCents: 0 },
    ]);
  });

  it("a set with its worth given → set adjustment at that worth", () => {
    expect(
      claimsFromRulings(ITEMS, lines, [{ itemId: "item-quad", upheld: true, tubes: 1, worthCents: 15_000 }]),
    ).toEqual([{ kind: "set-adjustment", lineId: "line-2", actualSetValueCents: 15_000 }]);
  });

  it("a set with one bad tube and no worth → the good tubes as singles (setDefectClaim) [SUG]", () => {
    const claims = claimsFromRulings(ITEMS, lines, [{ itemId: "item-quad", upheld: true, tubes: 1 }]);
    expect(claims).toEqual([{ kind: "set-adjustment", lineId: "line-2", actualSetValueCents: 12_000 }]); // 3 × $40
  });

  it("a set with every tube bad and no worth → worth nothing", () => {
    expect(claimsFromRulings(ITEMS, lines, [{ itemId: "item-quad", upheld: true, tubes: 4 }])).toEqual([
      { kind: "set-adjustment", lineId: "line-2", actualSetValueCents: 0 },
    ]);
  });

  it("rulings not upheld, or upholding no tubes, make no claim", () => {
    const rulings: Ruling[] = [
      { itemId: "item-kestrel", upheld: false, tubes: 8, worthCents: 1_250 },
      { itemId: "item-mixed", upheld: true, tubes: 0 },
    ];
    expect(claimsFromRulings(ITEMS, lines, rulings)).toEqual([]);
  });

  it("an item outside the lot, or more bad tubes than the set holds → RangeError", () => {
    expect(() => claimsFromRulings(ITEMS, lines, [{ itemId: "stranger", upheld: true, tubes: 1 }])).toThrow(RangeError);
    expect(() => claimsFromRulings(ITEMS, lines, [{ itemId: "item-quad", upheld: true, tubes: 5 }])).toThrow(
      "the set has 4 tubes",
    );
  });
});

describe("settling the rulings with lib/money [SUG] partial refunds", () => {
  const lines = buildManifest(ITEMS, VALUES);

  it("one bad tube in a $200 quad with $40 singles: W = $80, not a quarter ($50) [SUG]", () => {
    const claims = claimsFromRulings(ITEMS, lines, [{ itemId: "item-quad", upheld: true, tubes: 1 }]);
    const s = settlePartialRefund(SALE, lines, claims);
    expect(s.claimValueCents).toBe(8_000); // 200 − 3 × 40 = $80
    expect(s.claimValueCents).not.toBe(5_000); // 200 ÷ 4 = $50 would be the wrong rule
    expect(s.hammerRefundCents).toBe(4_000); // $1,000 × 80 / 2,000
    expect(s.premiumRefundCents).toBe(600); // $150 × 80 / 2,000
    expect(s.commissionReductionCents).toBe(800); // $200 × 80 / 2,000
    expect(s.buyerRefundCents).toBe(4_600); // hammer refund + premium refund
    expect(s.consignorChangeCents).toBe(-3_200); // −40 + 8
    expect(s.houseChangeCents).toBe(-1_400); // −6 − 8
    expectReconciles(s);
  });

  it("the demo story: eight tubes listed Kestrel-made prove Pellham-made, $50 → $12.50 each [SUG]", () => {
    const claims = claimsFromRulings(ITEMS, lines, [
      { itemId: "item-kestrel", upheld: true, tubes: 8, worthCents: 1_250 },
    ]);
    const s = settlePartialRefund(SALE, lines, claims);
    expect(s.claimValueCents).toBe(30_000); // described $400 − actual $100
    expect(s.hammerRefundCents).toBe(15_000); //: refund 150
    expect(s.premiumRefundCents).toBe(2_250); //: + 22.50 premium
    expect(s.buyerRefundCents).toBe(17_250);
    expect(s.commissionReductionCents).toBe(3_000); // 20 % commission, pro rata
    expect(s.consignorChangeCents).toBe(-12_000); //: "loses 150 less its commission"
    expectReconciles(s);
  });

  it("both rulings at once add up, and the per-item split sums to the totals", () => {
    const claims = claimsFromRulings(ITEMS, lines, [
      { itemId: "item-kestrel", upheld: true, tubes: 8, worthCents: 1_250 },
      { itemId: "item-quad", upheld: true, tubes: 1 },
    ]);
    const s = settlePartialRefund(SALE, lines, claims);
    expect(s.claimValueCents).toBe(38_000); // 300 + 80
    expect(s.hammerRefundCents).toBe(19_000);
    expect(s.premiumRefundCents).toBe(2_850);
    expect(s.buyerRefundCents).toBe(21_850);
    expect(s.items.map((i) => i.hammerRefundCents)).toEqual([15_000, 4_000]);
    expectReconciles(s);
  });

  it("odd sale figures still move whole cents, rounded half-up once [SUG] lib/money/refunds.ts", () => {
    // hammer $1,234.57, premium $148.15, commission $246.91; W / V_lot = 80 / 2,000 = 4 %
    const sale: SaleFigures = { hammerCents: 123_457, premiumCents: 14_815, commissionCents: 24_691 };
    const claims = claimsFromRulings(ITEMS, lines, [{ itemId: "item-quad", upheld: true, tubes: 1 }]);
    const s = settlePartialRefund(sale, lines, claims);
    expect(s.hammerRefundCents).toBe(4_938); // 4,938.28
    expect(s.premiumRefundCents).toBe(593); // 592.6
    expect(s.commissionReductionCents).toBe(988); // 987.64
    expect(s.buyerRefundCents).toBe(5_531);
    expect(s.consignorChangeCents).toBe(-3_950);
    expect(s.houseChangeCents).toBe(-1_581);
    expectReconciles(s);
  });
});

describe("undisputedShare: release what a claim cannot touch, hold the rest [SUG] 'release the undisputed share and hold the rest'", () => {
  it("a claim on 3 of the 8 line-1 tubes holds 3 × $50 = $150 of V_lot $2,000 (7.5 %) and releases the rest", () => {
    const { held, undisputed } = undisputedShare(SALE, ITEMS, VALUES, [{ itemId: "item-kestrel", tubes: 3 }]);
    // hammer $1,000 × 7.5 % = $75; premium $150 × 7.5 % = $11.25; commission $200 × 7.5 % = $15 (the worked example's inputs [SUG]).
    expect(held).toEqual({ hammerCents: 7_500, premiumCents: 1_125, commissionCents: 1_500 });
    expect(undisputed).toEqual({ hammerCents: 92_500, premiumCents: 13_875, commissionCents: 18_500 });
  });

  it("one tube claimed in the matched quad holds the whole set's value, $200 (a set is one line)", () => {
    const { held } = undisputedShare(SALE, ITEMS, VALUES, [{ itemId: "item-quad", tubes: 1 }]);
    expect(held.hammerCents).toBe(10_000); // $1,000 × 200/2,000
  });

  it("any later partial refund on the same values fits inside what is held", () => {
    const claimed = [
      { itemId: "item-kestrel", tubes: 3 },
      { itemId: "item-quad", tubes: 1 },
    ];
    const { held } = undisputedShare(SALE, ITEMS, VALUES, claimed);
    const lines = buildManifest(ITEMS, VALUES);
    for (const worth of [0, 1, 999, 2_500, 4_999]) {
      const s = settlePartialRefund(
        SALE,
        lines,
        claimsFromRulings(ITEMS, lines, [
          { itemId: "item-kestrel", upheld: true, tubes: 3, worthCents: worth },
          { itemId: "item-quad", upheld: true, tubes: 1 },
        ]),
      );
      expect(s.hammerRefundCents).toBeLessThanOrEqual(held.hammerCents);
      expect(s.premiumRefundCents).toBeLessThanOrEqual(held.premiumCents);
      expect(s.commissionReductionCents).toBeLessThanOrEqual(held.commissionCents);
    }
  });
});
