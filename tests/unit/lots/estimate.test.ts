import { describe, expect, it } from "vitest";
import { estimateLot, percentile, type ComparableSale } from "@/lib/lots/estimate";

// The estimate rule is ours [SUG]: 25th–75th percentile per tube (linear
// interpolation, rank h = (n − 1)·p), rounded half up to cents, × tubes.

const sale = (
  typeFamily: string,
  condition: ComparableSale["condition"],
  pricePerTubeCents: number,
  soldAt = "2026-03-01",
): ComparableSale => ({
  typeFamily,
  condition,
  pricePerTubeCents,
  soldAt,
});

describe("percentile", () => {
  it("interpolates between order statistics", () => {
    const prices = [1200, 1500, 1800, 2600];
    expect(percentile(prices, 0.25)).toBe(1425); // h = 0.75: 1200 + 0.75 × 300
    expect(percentile(prices, 0.75)).toBe(2000); // h = 2.25: 1800 + 0.25 × 800
    expect(percentile(prices, 0.5)).toBe(1650);
    expect(percentile([700], 0.25)).toBe(700);
    expect(Number.isNaN(percentile([], 0.5))).toBe(true);
    expect(() => percentile(prices, 1.5)).toThrow(RangeError);
  });
});

describe("estimateLot", () => {
  it("works the example: six used 12AX7s against four used sales", () => {
    const comparables = [
      sale("12AX7", "used", 2600),
      sale("12AX7", "used", 1200),
      sale("12AX7", "used", 1800),
      sale("12AX7", "used", 1500),
      sale("12AX7", "new-in-box", 9000), // another condition: not used while used sales exist
      sale("EL34", "used", 5000), // another family
    ];
    const est = estimateLot(
      [{ familyKey: "12AX7", familyLabel: "12AX7 family", condition: "used", tubes: 6 }],
      comparables,
    );
    expect(est).toMatchObject({ kind: "range", lowCents: 8550, highCents: 12000 }); // 6 × 1425, 6 × 2000
    if (est.kind !== "range") throw new Error("expected a range");
    expect(est.parts[0]).toMatchObject({
      comparablesUsed: 4,
      conditionFallback: false,
      lowPerTubeCents: 1425,
      highPerTubeCents: 2000,
    });
  });

  it("rounds per tube to whole cents before multiplying", () => {
    const est = estimateLot(
      [{ familyKey: "6V6", familyLabel: "6V6 family", condition: "used", tubes: 3 }],
      [sale("6V6", "used", 1000), sale("6V6", "used", 1001)],
    );
    // 1000.25 → 1000, 1000.75 → 1001 (half up); × 3
    expect(est).toMatchObject({ kind: "range", lowCents: 3000, highCents: 3003 });
  });

  it("falls back to the family in any condition, lists families without comparables, and sums", () => {
    const est = estimateLot(
      [
        { familyKey: "12AX7", familyLabel: "12AX7 family", condition: "new-old-stock", tubes: 2 },
        { familyKey: "6SN7GT", familyLabel: "6SN7GT family", condition: "used", tubes: 4 },
        { familyKey: "KT88", familyLabel: "KT88 family", condition: "used", tubes: 1 },
      ],
      [sale("12AX7", "used", 1000), sale("12AX7", "used", 3000), sale("KT88", "used", 8000)],
    );
    if (est.kind !== "range") throw new Error("expected a range");
    expect(est.parts[0]).toMatchObject({ conditionFallback: true, lowPerTubeCents: 1500, highPerTubeCents: 2500 });
    expect(est.lowCents).toBe(2 * 1500 + 8000);
    expect(est.highCents).toBe(2 * 2500 + 8000);
    expect(est.familiesWithoutComparables).toEqual([{ familyKey: "6SN7GT", familyLabel: "6SN7GT family", tubes: 4 }]);
  });

  it("says 'no comparables yet' when no family has any, and honours the since date", () => {
    const groups = [{ familyKey: "EL84", familyLabel: "EL84 family", condition: "used" as const, tubes: 4 }];
    expect(estimateLot(groups, [])).toMatchObject({ kind: "none", text: "no comparables yet" });
    expect(estimateLot(groups, [sale("EL84", "used", 1500, "2019-05-01")], { since: "2024-01-01" })).toMatchObject({
      kind: "none",
    });
    expect(estimateLot(groups, [sale("EL84", "used", 1500, "2025-05-01")], { since: "2024-01-01" })).toMatchObject({
      kind: "range",
      lowCents: 6000,
    });
  });

  it("ignores prices that are not integer cents", () => {
    const est = estimateLot(
      [{ familyKey: "EL84", familyLabel: "EL84 family", condition: "used", tubes: 1 }],
      [sale("EL84", "used", 12.5), sale("EL84", "used", -100)],
    );
    expect(est.kind).toBe("none");
  });
});
