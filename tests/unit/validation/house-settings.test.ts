// Check values: [SUG] our product rules for house settings; [PG-INT] integer column range; [CTP] fee practice.
import { describe, expect, it } from "vitest";
import { fieldsFromIssues } from "@/lib/api/errors";
import { DEFAULT_INCREMENT_LADDER } from "@/lib/auction/increments";
import { DEFAULT_FEE_SCHEDULE } from "@/lib/money/fees";
import { settingsChanges } from "@/lib/validation/house-settings-diff";
import {
  HouseSettingsChangeSchema,
  HouseSettingsSchema,
  INITIAL_HOUSE_SETTINGS,
  MAX_COLUMN_CENTS,
  type HouseSettings,
} from "@/lib/validation/house-settings";

const clone = (): HouseSettings => structuredClone(INITIAL_HOUSE_SETTINGS);
const fieldsOf = (raw: unknown) => {
  const r = HouseSettingsSchema.safeParse(raw);
  return r.success ? {} : fieldsFromIssues(r.error.issues);
};

describe("house settings schema", () => {
  it("accepts version 1, which equals the constants the exchange ran on [SUG]", () => {
    expect(HouseSettingsSchema.parse(INITIAL_HOUSE_SETTINGS)).toEqual(INITIAL_HOUSE_SETTINGS);
    expect(INITIAL_HOUSE_SETTINGS.buyersPremiumBp).toBe(1_000); // [SUG] 10 % default premium
    expect(INITIAL_HOUSE_SETTINGS.commissionTiers).toEqual(DEFAULT_FEE_SCHEDULE.commissionTiers); // [SUG] 20/15/10 %
    expect(INITIAL_HOUSE_SETTINGS.incrementLadder).toEqual(DEFAULT_INCREMENT_LADDER); // [CTP] 1-2-5 steps
    expect(INITIAL_HOUSE_SETTINGS.payment).toEqual({ dueDays: 7, reminderDaysBefore: 2 }); // [SUG]
    expect(INITIAL_HOUSE_SETTINGS.tax.rules).toEqual([]); // [SUG] no tax until the house configures a rule
  });

  it("refuses a negative premium and one above 100 %, per field [SUG]", () => {
    expect(fieldsOf({ ...clone(), buyersPremiumBp: -1 })).toEqual({
      buyersPremiumBp: "Buyer's premium cannot be negative",
    });
    expect(fieldsOf({ ...clone(), buyersPremiumBp: 10_001 })["buyersPremiumBp"]).toMatch(/0 % and 100 %/);
    expect(fieldsOf({ ...clone(), buyersPremiumBp: 12.5 })["buyersPremiumBp"]).toMatch(/whole basis points/);
  });

  it("refuses overlapping or descending tiers and an open tier before the last [SUG]", () => {
    const s = clone();
    s.commissionTiers = [
      { upToCents: 50_000, rateBp: 2_000 },
      { upToCents: 40_000, rateBp: 1_500 }, // overlaps the tier before
      { upToCents: null, rateBp: 1_000 },
    ];
    expect(fieldsOf(s)).toEqual({
      "commissionTiers.1.upToCents": "Tiers must ascend without overlapping the tier before",
    });
    s.commissionTiers = [
      { upToCents: null, rateBp: 2_000 },
      { upToCents: 40_000, rateBp: 1_500 },
    ];
    const f = fieldsOf(s);
    expect(f["commissionTiers.0.upToCents"]).toBe("Only the last tier is open-ended");
    expect(f["commissionTiers.1.upToCents"]).toBe("The last tier has no ceiling");
  });

  it("keeps cents inside the integer column and positive increments [PG-INT] 2,147,483,647", () => {
    expect(MAX_COLUMN_CENTS).toBe(2_147_483_647); // [PG-INT]
    expect(fieldsOf({ ...clone(), buyersPremiumBp: 10_001 })["buyersPremiumBp"]).toMatch(/between 0 % and 100 %/);
    const big = clone();
    big.shipping.handlingCents = MAX_COLUMN_CENTS + 1;
    expect(fieldsOf(big)["shipping.handlingCents"]).toMatch(/largest amount/);
    // A document from before the lot fee was dropped still reads (unknown keys are ignored).
    expect(HouseSettingsSchema.parse({ ...clone(), lotFeeCents: 0 })).not.toHaveProperty("lotFeeCents");
    const s = clone();
    s.incrementLadder = [{ fromCents: 0, incrementCents: 0 }];
    expect(fieldsOf(s)["incrementLadder.0.incrementCents"]).toMatch(/at least 1 cent/);
    s.incrementLadder = [
      { fromCents: 100, incrementCents: 100 },
      { fromCents: 50, incrementCents: 100 },
    ];
    expect(fieldsOf(s)).toMatchObject({
      "incrementLadder.0.fromCents": "The first rung starts at 0",
      "incrementLadder.1.fromCents": "Rungs must ascend",
    });
  });

  it("checks shipping zones are listed and priced, and one tax rule per place [SUG]", () => {
    const s = clone();
    s.shipping.otherZone = "moon";
    s.shipping.bands[0] = { upToGrams: 500, ratesCents: { home: 900, near: 1_900 } }; // no "far"
    s.tax.rules = [
      { country: "US", region: "", rateBp: 600, taxHammer: true, taxPremium: true, taxShipping: false },
      { country: "US", region: "", rateBp: 700, taxHammer: true, taxPremium: true, taxShipping: false },
    ];
    const f = fieldsOf(s);
    expect(f["shipping.otherZone"]).toBe("Choose one of the listed zones");
    expect(f["shipping.bands.0.ratesCents.far"]).toBe('No rate for zone "far"');
    expect(f["tax.rules.1.region"]).toBe("This country and region already has a rule");
  });

  it("needs a reason with every change [SUG]", () => {
    const r = HouseSettingsChangeSchema.safeParse({ settings: clone(), reason: " " });
    expect(r.success).toBe(false);
    expect(fieldsFromIssues(r.error!.issues)).toEqual({
      reason: "Say why the settings change (at least 5 characters)",
    });
  });
});

describe("settings changes for the history", () => {
  it("lists each changed figure once, and nothing for equal documents [SUG]", () => {
    const a = clone();
    const b = clone();
    expect(settingsChanges(a, b)).toEqual([]);
    b.buyersPremiumBp = 1_500;
    b.payment.dueDays = 10;
    expect(settingsChanges(a, b)).toEqual(["Buyer's premium (bp): 1000 → 1500", "Payment terms · due (days): 7 → 10"]);
    const c = clone();
    c.shipping.groups = [{ name: "North", zone: "near", countries: ["US", "CA"] }];
    expect(settingsChanges(a, c)).toEqual([
      "Shipping · groups 1 countries 1: — → US",
      "Shipping · groups 1 countries 2: — → CA",
      "Shipping · groups 1 name: — → North",
      "Shipping · groups 1 zone: — → near",
    ]);
  });
});
