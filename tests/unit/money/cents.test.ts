// Check values: [SUG] product rule — integer cents, two decimals at most, half-up rounding by default.
import { describe, expect, it } from "vitest";
import {
  assertCents,
  divideRounded,
  formatCents,
  MoneyParseError,
  mulDivCents,
  parseMoneyToCents,
  percentOfCents,
} from "@/lib/money/cents";

describe("assertCents", () => {
  it("accepts whole cents and rejects fractions, NaN and unsafe integers", () => {
    expect(assertCents(12_345)).toBe(12_345);
    expect(() => assertCents(1.5)).toThrow(RangeError);
    expect(() => assertCents(Number.NaN)).toThrow(RangeError);
    expect(() => assertCents(2 ** 53)).toThrow(RangeError);
  });

  it("rejects negatives unless allowed", () => {
    expect(() => assertCents(-1)).toThrow(/negative/);
    expect(assertCents(-1, "change", { allowNegative: true })).toBe(-1);
  });
});

/** The refusal code for `text`, or "accepted". */
function parseCode(text: string): string {
  try {
    parseMoneyToCents(text);
    return "accepted";
  } catch (error) {
    return error instanceof MoneyParseError ? error.code : "other-error";
  }
}

describe("parseMoneyToCents", () => {
  it("parses decimal text without floating point", () => {
    expect(parseMoneyToCents("123.45")).toBe(12_345); // worked example: $123.45 = 12,345 cents [SUG] product rule
    expect(parseMoneyToCents("0.10")).toBe(10);
    expect(parseMoneyToCents("7")).toBe(700);
    expect(parseMoneyToCents("1.5")).toBe(150);
    expect(parseMoneyToCents(" 1,234.56 ")).toBe(123_456);
    // 0.1 + 0.2 style drift must not appear: 1.15 is exactly 115 cents
    expect(parseMoneyToCents("1.15")).toBe(115);
  });

  it("rejects three decimals instead of rounding", () => {
    expect(() => parseMoneyToCents("123.456")).toThrow(MoneyParseError);
    expect(parseCode("1.005")).toBe("too-many-decimals");
    expect(parseCode("1.5.0")).toBe("format");
  });

  it("rejects negatives unless allowed, and malformed text", () => {
    expect(() => parseMoneyToCents("-5.00")).toThrow(/negative/);
    expect(parseMoneyToCents("-5.00", { allowNegative: true })).toBe(-500);
    for (const bad of ["", "abc", "$5", "1e3", "5.", ".5", "1,23.00", "12,3456"]) {
      expect(() => parseMoneyToCents(bad), bad).toThrow(MoneyParseError);
    }
    expect(() => parseMoneyToCents("99999999999999999")).toThrow(/too large/);
  });
});

describe("formatCents", () => {
  it("formats with the currency symbol", () => {
    expect(formatCents(12_345, "USD")).toBe("$123.45"); // worked example: 12,345 cents shown as $123.45 [SUG]
    expect(formatCents(5, "USD")).toBe("$0.05");
    expect(formatCents(-250, "USD")).toBe("-$2.50");
    expect(formatCents(123_456_789, "USD")).toBe("$1,234,567.89");
  });

  it("refuses non-integer cents and currencies without two minor digits", () => {
    expect(() => formatCents(1.5, "USD")).toThrow(RangeError);
    expect(() => formatCents(100, "JPY")).toThrow(/two minor digits/);
  });
});

describe("rounding", () => {
  it("half-up rounds halves away from zero; half-even to the even cent", () => {
    expect(divideRounded(5n, 2n, "half-up")).toBe(3n);
    expect(divideRounded(-5n, 2n, "half-up")).toBe(-3n);
    expect(divideRounded(5n, 2n, "half-even")).toBe(2n);
    expect(divideRounded(7n, 2n, "half-even")).toBe(4n);
    expect(divideRounded(7n, 3n)).toBe(2n);
  });

  it("percentOfCents uses basis points and one rounding", () => {
    expect(percentOfCents(100_000, 1_500)).toBe(15_000); // 15 % of $1,000 = $150
    expect(percentOfCents(15_000, 1_500)).toBe(2_250); // 15 % of $150 = $22.50
    expect(percentOfCents(10, 1_250)).toBe(1); // 1.25 ¢ → 1 ¢
    expect(percentOfCents(50, 1_000, "half-up")).toBe(5);
    expect(percentOfCents(5, 1_000, "half-up")).toBe(1); // 0.5 ¢ → 1 ¢ half-up
    expect(percentOfCents(5, 1_000, "half-even")).toBe(0); // 0.5 ¢ → 0 ¢ banker's
    expect(() => percentOfCents(100, 10_001)).toThrow(RangeError);
    expect(() => percentOfCents(100, 12.5)).toThrow(RangeError);
  });

  it("mulDivCents stays exact beyond float precision", () => {
    // 9,007,199,254,740,991 × 3 ÷ 3 would lose digits in floating point
    expect(mulDivCents(Number.MAX_SAFE_INTEGER, 3, 3)).toBe(Number.MAX_SAFE_INTEGER);
    expect(mulDivCents(100_000, 300, 2_000)).toBe(15_000);
    expect(() => mulDivCents(100, 1, 0)).toThrow(RangeError);
  });
});
