// Check values: [CTP] fee practice; [SUG] default tiers and rounding; worked example:.
import { describe, expect, it } from "vitest";
import {
  buyersPremiumCents,
  DEFAULT_COMMISSION_TIERS,
  DEFAULT_FEE_SCHEDULE,
  invoiceFor,
  payoutFor,
  sellersCommissionCents,
  validateCommissionTiers,
  type FeeSchedule,
} from "@/lib/money/fees";

const FLAT_20: FeeSchedule["commissionTiers"] = [{ upToCents: null, rateBp: 2_000 }];

describe("buyer's premium", () => {
  it("is a basis-point share of hammer, rounded half-up", () => {
    expect(buyersPremiumCents(100_000, 1_500)).toBe(15_000); //: 15 % of $1,000 = $150
    expect(buyersPremiumCents(1_005, 1_000)).toBe(101); // 100.5 ¢ → 101 ¢ (half-up)
    expect(() => buyersPremiumCents(-1, 1_000)).toThrow(RangeError);
  });
});

describe("seller's commission (marginal tiers)", () => {
  it("charges each slice its own rate [SUG] default tiers 20/15/10 % at $500 and $2,500", () => {
    expect(sellersCommissionCents(40_000)).toBe(8_000); // $400 × 20 % = $80
    expect(sellersCommissionCents(50_000)).toBe(10_000); // exactly at the first ceiling: $100
    expect(sellersCommissionCents(100_000)).toBe(17_500); // $100 + 15 % × $500 = $175
    expect(sellersCommissionCents(250_000)).toBe(40_000); // $100 + 15 % × $2,000 = $400
    expect(sellersCommissionCents(300_000)).toBe(45_000); // $400 + 10 % × $500 = $450
  });

  it("rounds the exact sum once", () => {
    // 50,001 ¢: 50,000 × 20 % + 1 × 15 % = 10,000.15 → 10,000
    expect(sellersCommissionCents(50_001)).toBe(10_000);
    // 50,004 ¢: 10,000 + 0.60 → 10,001 (half-up of .6)
    expect(sellersCommissionCents(50_004)).toBe(10_001);
  });

  it("a flat 20 % table is one open tier", () => {
    expect(sellersCommissionCents(100_000, FLAT_20)).toBe(20_000); // with a 20 % commission
  });

  it("validates tier tables", () => {
    expect(validateCommissionTiers(DEFAULT_COMMISSION_TIERS)).toEqual([]);
    expect(validateCommissionTiers([])).not.toEqual([]);
    expect(validateCommissionTiers([{ upToCents: 100, rateBp: 1_000 }])).toContain(
      "the last tier must have no ceiling (upToCents: null)",
    );
    expect(
      validateCommissionTiers([
        { upToCents: 500, rateBp: 1_000 },
        { upToCents: 400, rateBp: 1_000 },
        { upToCents: null, rateBp: 1_000 },
      ]).length,
    ).toBe(1);
    expect(() => sellersCommissionCents(100, [{ upToCents: null, rateBp: 20_000 }])).toThrow(/invalid/);
  });
});

describe("invoiceFor", () => {
  it("adds premium and shipping; no tax by default", () => {
    const schedule: FeeSchedule = { ...DEFAULT_FEE_SCHEDULE, buyersPremiumBp: 1_500 };
    const invoice = invoiceFor({ hammerCents: 100_000, shippingCents: 4_000 }, schedule);
    expect(invoice).toEqual({
      hammerCents: 100_000,
      premiumCents: 15_000,
      shippingCents: 4_000,
      taxableCents: 115_000,
      taxCents: 0,
      totalCents: 119_000,
    });
  });

  it("taxes only the configured base", () => {
    const base: FeeSchedule = { ...DEFAULT_FEE_SCHEDULE, buyersPremiumBp: 1_500, taxRateBp: 800 };
    const withPremium = invoiceFor({ hammerCents: 100_000, shippingCents: 4_000 }, base);
    expect(withPremium.taxCents).toBe(9_200); // 8 % × $1,150
    const hammerOnly = invoiceFor(
      { hammerCents: 100_000, shippingCents: 4_000 },
      { ...base, taxBase: { hammer: true, premium: false, shipping: false } },
    );
    expect(hammerOnly.taxCents).toBe(8_000);
    expect(hammerOnly.totalCents).toBe(100_000 + 15_000 + 4_000 + 8_000);
    const everything = invoiceFor(
      { hammerCents: 100_000, shippingCents: 4_000 },
      { ...base, taxBase: { hammer: true, premium: true, shipping: true } },
    );
    expect(everything.taxableCents).toBe(119_000);
    expect(everything.taxCents).toBe(9_520);
  });
});

describe("payoutFor", () => {
  it("payout = hammer − commission − fees − refunds [CTP]", () => {
    // with a 20 % commission: consignor loses $120 net of commission
    expect(payoutFor({ hammerCents: 100_000, commissionCents: 20_000, refundsCents: 12_000 }).payoutCents).toBe(68_000);
    expect(payoutFor({ hammerCents: 100_000, commissionCents: 17_500, feesCents: 500 }).payoutCents).toBe(82_000);
  });

  it("does not clamp: a negative payout is a debt", () => {
    expect(payoutFor({ hammerCents: 1_000, commissionCents: 200, feesCents: 1_500 }).payoutCents).toBe(-700);
    expect(() => payoutFor({ hammerCents: 1_000.5, commissionCents: 0 })).toThrow(RangeError);
  });
});
