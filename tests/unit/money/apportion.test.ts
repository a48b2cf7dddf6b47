// Check values: [SUG] product rule — exact apportionment by the largest remainder method, ties in list order.
import { describe, expect, it } from "vitest";
import { apportionCents } from "@/lib/money/apportion";

describe("apportionCents (largest remainder)", () => {
  it("always sums to the total", () => {
    expect(apportionCents(100, [1, 1, 1])).toEqual([34, 33, 33]);
    expect(apportionCents(2_250, [30_000])).toEqual([2_250]);
    const parts = apportionCents(1_001, [3, 7, 11, 13]);
    expect(parts.reduce((a, b) => a + b, 0)).toBe(1_001);
  });

  it("gives leftover cents to the largest remainders, ties in list order", () => {
    // 10 over 1:2:3:4 → 1, 2, 3, 4 exactly
    expect(apportionCents(10, [1, 2, 3, 4])).toEqual([1, 2, 3, 4]);
    // 5 over 3:3:1 → quotas 2.142, 2.142, 0.714 → floors 2,2,0; leftover 1 to the largest remainder (index 2)
    expect(apportionCents(5, [3, 3, 1])).toEqual([2, 2, 1]);
    // 1 over 1:1 → tie goes to the first
    expect(apportionCents(1, [1, 1])).toEqual([1, 0]);
  });

  it("splits negative totals symmetrically and skips zero weights", () => {
    expect(apportionCents(-100, [1, 1, 1])).toEqual([-34, -33, -33]);
    expect(apportionCents(7, [0, 1])).toEqual([0, 7]);
  });

  it("rejects empty or all-zero weights and bad amounts", () => {
    expect(() => apportionCents(5, [])).toThrow(RangeError);
    expect(() => apportionCents(5, [0, 0])).toThrow(RangeError);
    expect(() => apportionCents(5, [-1, 2])).toThrow(RangeError);
    expect(() => apportionCents(5.5, [1])).toThrow(RangeError);
  });
});
