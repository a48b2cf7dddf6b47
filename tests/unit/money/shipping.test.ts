// Check values: [SUG] product rule — Getterline's own default rate table (house setting), figures invented.
import { describe, expect, it } from "vitest";
import { DEFAULT_SHIPPING_TABLE, shippingQuote, validateShippingTable, type ShippingTable } from "@/lib/money/shipping";

describe("shippingQuote", () => {
  it("prices by the first band at or above the weight, plus handling [SUG] house table", () => {
    expect(validateShippingTable(DEFAULT_SHIPPING_TABLE)).toEqual([]);
    expect(shippingQuote(DEFAULT_SHIPPING_TABLE, 500, "home")).toEqual({
      kind: "rate",
      cents: 1_200,
      bandUpToGrams: 500,
    });
    expect(shippingQuote(DEFAULT_SHIPPING_TABLE, 501, "home")).toEqual({
      kind: "rate",
      cents: 1_700,
      bandUpToGrams: 2_000,
    });
    expect(shippingQuote(DEFAULT_SHIPPING_TABLE, 4_200, "far")).toEqual({
      kind: "rate",
      cents: 9_200,
      bandUpToGrams: 5_000,
    });
  });

  it("asks for a manual quote when over weight or to an unknown zone", () => {
    expect(shippingQuote(DEFAULT_SHIPPING_TABLE, 20_001, "home")).toEqual({
      kind: "quote-needed",
      reason: "over-weight",
    });
    expect(shippingQuote(DEFAULT_SHIPPING_TABLE, 100, "moon")).toEqual({
      kind: "quote-needed",
      reason: "unknown-zone",
    });
  });

  it("rejects bad weights and bad tables", () => {
    expect(() => shippingQuote(DEFAULT_SHIPPING_TABLE, 0, "home")).toThrow(RangeError);
    expect(() => shippingQuote(DEFAULT_SHIPPING_TABLE, 10.5, "home")).toThrow(RangeError);
    const broken: ShippingTable = {
      zones: ["home"],
      handlingCents: 0,
      bands: [
        { upToGrams: 1_000, ratesCents: { home: 500 } },
        { upToGrams: 900, ratesCents: { home: 9.5 } },
      ],
    };
    expect(validateShippingTable(broken)).toHaveLength(2);
    expect(() => shippingQuote(broken, 100, "home")).toThrow(/invalid shipping table/);
  });
});
