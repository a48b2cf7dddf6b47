// The settings form's percent and dollar inputs, converted exactly to the API's basis points and cents.
// Check values: 1 % = 100 bp and $1 = 100 cents (definitions of the basis point and the cent) [SUG form units].
import { describe, expect, it } from "vitest";
import { bpToPercentText, centsToDollarText, dollarsToCents, percentToBp } from "@/lib/money/form-units";

describe("percent ↔ basis points [SUG] (1 % = 100 bp)", () => {
  it("converts typed percentages exactly", () => {
    expect(percentToBp("12.5")).toEqual({ ok: true, value: 1250 });
    expect(percentToBp(" 12.5 % ")).toEqual({ ok: true, value: 1250 });
    expect(percentToBp("0.01")).toEqual({ ok: true, value: 1 });
    expect(percentToBp("100")).toEqual({ ok: true, value: 10_000 });
    // 0.29 × 100 is 28.999999999999996 in floating point; the text conversion gives 29.
    expect(percentToBp("0.29")).toEqual({ ok: true, value: 29 });
  });
  it("refuses more decimals than a basis point holds, signs and words", () => {
    expect(percentToBp("12.345")).toEqual({ ok: false, error: expect.stringMatching(/two decimals/) });
    expect(percentToBp("-1")).toMatchObject({ ok: false });
    expect(percentToBp("ten")).toMatchObject({ ok: false });
    expect(percentToBp("")).toMatchObject({ ok: false });
    expect(percentToBp("1,000")).toMatchObject({ ok: false });
  });
  it("shows basis points as the percentage the staff typed", () => {
    expect(bpToPercentText(1250)).toBe("12.5");
    expect(bpToPercentText(1000)).toBe("10");
    expect(bpToPercentText(1)).toBe("0.01");
    for (const bp of [0, 1, 99, 1250, 1234, 10_000])
      expect(percentToBp(bpToPercentText(bp))).toEqual({ ok: true, value: bp });
  });
});

describe("dollars ↔ cents [SUG] ($1 = 100 cents)", () => {
  it("converts typed dollar amounts exactly", () => {
    expect(dollarsToCents("$1,234.56")).toEqual({ ok: true, value: 123_456 });
    expect(dollarsToCents("1234.56")).toEqual({ ok: true, value: 123_456 });
    expect(dollarsToCents("7")).toEqual({ ok: true, value: 700 });
    expect(dollarsToCents("0.1")).toEqual({ ok: true, value: 10 });
  });
  it("refuses fractions of a cent, bad grouping and negatives", () => {
    expect(dollarsToCents("1.005")).toEqual({ ok: false, error: expect.stringMatching(/two decimals/) });
    expect(dollarsToCents("1,23.00")).toMatchObject({ ok: false });
    expect(dollarsToCents("-5")).toMatchObject({ ok: false });
    expect(dollarsToCents("$")).toMatchObject({ ok: false });
  });
  it("shows cents as dollars with two places, and back", () => {
    expect(centsToDollarText(123_456)).toBe("1234.56");
    expect(centsToDollarText(700)).toBe("7.00");
    for (const c of [0, 1, 99, 100, 123_456])
      expect(dollarsToCents(centsToDollarText(c))).toEqual({ ok: true, value: c });
  });
});
