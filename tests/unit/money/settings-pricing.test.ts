// Check values: [SUG] our zone, tax and rounding rules; [ISO-3166] country codes; worked examples beside each figure.
import { describe, expect, it } from "vitest";
import { addressBlock, AddressSchema } from "@/lib/validation/address";
import { lotShippingCents, priceSoldLot, shippingZone, taxRuleFor } from "@/lib/money/settings-pricing";
import { INITIAL_HOUSE_SETTINGS, type HouseSettings } from "@/lib/validation/house-settings";

const withGroupAndTax = (): HouseSettings => {
  const s = structuredClone(INITIAL_HOUSE_SETTINGS);
  s.shipping.groups = [{ name: "Northern neighbours", zone: "near", countries: ["US", "CA", "MX"] }];
  s.tax.rules = [
    { country: "CA", region: "", rateBp: 500, taxHammer: true, taxPremium: true, taxShipping: true },
    { country: "CA", region: "Ontario", rateBp: 1_300, taxHammer: true, taxPremium: true, taxShipping: false },
  ];
  return s;
};

describe("shipping zone from origin to destination [SUG]", () => {
  const s = withGroupAndTax().shipping;
  it("same country → home; one group → its zone; else the other zone; no address → home", () => {
    expect(shippingZone(s, { country: "US" }, { country: "us" })).toBe("home");
    expect(shippingZone(s, { country: "US" }, { country: "CA" })).toBe("near");
    expect(shippingZone(s, { country: "US" }, { country: "DE" })).toBe("far"); // [ISO-3166] DE = Germany
    expect(shippingZone(s, null, { country: "DE" })).toBe("home");
    expect(shippingZone(s, { country: "US" }, undefined)).toBe("home");
  });

  it("prices a lot by packed weight and zone, in parcels no heavier than the top band (default table) [SUG]", () => {
    // 12 tubes × 60 g = 720 g → the 2,000 g band: home $14 + $3 handling; far $52 + $3.
    expect(lotShippingCents(s, 12, "home")).toBe(1_700);
    expect(lotShippingCents(s, 12, "far")).toBe(5_500);
    // 400 tubes × 60 g = 24,000 g → 20,000 g parcel ($52 + $3) + 4,000 g parcel ($22 + $3) = $80 home.
    expect(lotShippingCents(s, 400, "home")).toBe(8_000);
  });
});

describe("tax by destination [SUG]", () => {
  const s = withGroupAndTax();
  it("a country-and-region rule wins over the country's; no rule or no address → none", () => {
    expect(taxRuleFor(s.tax, { country: "CA", region: "ontario" })?.rateBp).toBe(1_300);
    expect(taxRuleFor(s.tax, { country: "CA", region: "Yukon" })?.rateBp).toBe(500);
    expect(taxRuleFor(s.tax, { country: "US", region: "Ohio" })).toBeNull();
    expect(taxRuleFor(s.tax, null)).toBeNull();
  });

  it("rounds tax once per invoice, half-up, on the parts the rule names [SUG] worked example", () => {
    // Hammer $123.45, premium 10 % = $12.345 → $12.35 (half-up); 12 tubes to CA from US = zone near: $32 + $3.
    // Ontario 13 % on hammer + premium: 13 % × $135.80 = $17.654 → $17.65; shipping untaxed by that rule.
    const inv = priceSoldLot(
      { hammerCents: 12_345, tubes: 12, origin: { country: "US" }, destination: { country: "CA", region: "Ontario" } },
      s,
    );
    expect(inv).toMatchObject({ premiumCents: 1_235, zone: "near", shippingCents: 3_500, taxBp: 1_300 });
    expect(inv.taxableCents).toBe(13_580);
    expect(inv.taxCents).toBe(1_765);
    expect(inv.totalCents).toBe(12_345 + 1_235 + 3_500 + 1_765);
    // Elsewhere in CA: 5 % on hammer + premium + shipping = 5 % × $170.80 = $8.54.
    const yukon = priceSoldLot(
      { hammerCents: 12_345, tubes: 12, origin: { country: "US" }, destination: { country: "CA", region: "Yukon" } },
      s,
    );
    expect(yukon.taxCents).toBe(854);
  });

  it("with version 1 and no addresses, prices exactly as before: no tax, home shipping [SUG]", () => {
    const inv = priceSoldLot(
      { hammerCents: 100_000, tubes: 12, origin: null, destination: null },
      INITIAL_HOUSE_SETTINGS,
    );
    // $1,000 hammer, 10 % premium $100, shipping $17, commission 20 % × 500 + 15 % × 500 = $175.
    expect(inv).toMatchObject({ premiumCents: 10_000, shippingCents: 1_700, taxCents: 0, totalCents: 111_700 });
    expect(inv.commissionCents).toBe(17_500);
  });
});

describe("addresses", () => {
  const ok = {
    name: "Ada Bench",
    line1: "4 Filament Row",
    line2: "",
    city: "Kingston",
    region: "Ontario",
    postalCode: "K7L 3N6",
    country: "ca",
  };
  it("takes ISO 3166-1 alpha-2 codes only, from the package's list [ISO-3166]", () => {
    expect(AddressSchema.parse(ok).country).toBe("CA");
    expect(AddressSchema.safeParse({ ...ok, country: "XX" }).success).toBe(false); // not assigned
    expect(AddressSchema.safeParse({ ...ok, country: "CAN" }).success).toBe(false); // alpha-3 refused here
  });
  it("bounds lines and postal codes [SUG]", () => {
    expect(AddressSchema.safeParse({ ...ok, postalCode: "K7L 3N6 000000000" }).success).toBe(false); // 17 chars
    expect(AddressSchema.safeParse({ ...ok, postalCode: "K7L<3N6" }).success).toBe(false);
    expect(AddressSchema.safeParse({ ...ok, line1: "x".repeat(121) }).success).toBe(false);
  });
  it("prints as a name and lines, the country spelled out [ISO-3166]", () => {
    expect(addressBlock(AddressSchema.parse(ok))).toEqual({
      name: "Ada Bench",
      lines: ["4 Filament Row", "Kingston, Ontario, K7L 3N6", "Canada"],
    });
    expect(addressBlock(null)).toBeNull();
  });
});
