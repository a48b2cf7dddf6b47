/**
 * The house settings: every figure that prices or times a sale, held as one versioned document. One schema is
 * shared by the settings form (zodResolver) and PUT /api/house/settings; a sale freezes the version in force when it
 * is scheduled (lib/services/house-settings.ts). Defaults are today's built-in constants, so version 1 changes nothing;
 * versions kept before the house's own details were added get the initial ones (migration 20261203002300).
 */
import { z } from "zod";
import { DEFAULT_INCREMENT_LADDER } from "../auction/increments";
import { DEFAULT_SOFT_CLOSE } from "../auction/soft-close";
import { DISPUTE_SETTINGS } from "../disputes/rules";
import { DEFAULT_FEE_SCHEDULE } from "../money/fees";
import { DEFAULT_INSPECTION_SETTINGS } from "../money/inspection";
import { TESTER_VARIATION_PCT } from "../disputes/verdicts";
import { DEFAULT_SHIPPING_TABLE } from "../money/shipping";
import { HouseDetailsSchema, INITIAL_HOUSE_DETAILS } from "./house-details";

/** Largest amount an integer (int4) cents column holds: 2^31 − 1 [PostgreSQL integer type]. */
export const MAX_COLUMN_CENTS = 2_147_483_647;
/** Largest configurable increment, ceiling or rate, cents ($1,000,000): far above any lot, far below the column. */
const MAX_SETTING_CENTS = 100_000_000;

const cents = (what: string, max = MAX_SETTING_CENTS) =>
  z
    .number({ message: `${what}: give a number of cents` })
    .int(`${what}: whole cents only`)
    .min(0, `${what} cannot be negative`)
    .max(Math.min(max, MAX_COLUMN_CENTS), `${what} is above the largest amount the house allows`);
const basisPoints = (what: string) =>
  z
    .number({ message: `${what}: give a rate` })
    .int(`${what}: whole basis points only (1 % = 100)`)
    .min(0, `${what} cannot be negative`)
    .max(10_000, `${what} must be between 0 % and 100 %`);
const whole = (what: string, min: number, max: number) =>
  z
    .number({ message: `${what}: give a number` })
    .int(`${what}: a whole number`)
    .min(min, `${what}: at least ${min}`)
    .max(max, `${what}: at most ${max}`);
const zoneId = z
  .string()
  .trim()
  .regex(/^[a-z][a-z0-9-]{0,23}$/, "Zone names: lower-case letters, digits and hyphens, up to 24");
const countryCode = z
  .string()
  .trim()
  .regex(/^[A-Z]{2}$/, "A two-letter country code (ISO 3166-1)");

const CommissionTierSchema = z.object({
  upToCents: cents("Tier ceiling").min(1, "Tier ceiling must be above 0").nullable(),
  rateBp: basisPoints("Commission rate"),
});
const LadderRungSchema = z.object({
  fromCents: cents("Rung start"),
  incrementCents: cents("Increment").min(1, "Increment must be at least 1 cent"),
});
const ShippingBandSchema = z.object({
  upToGrams: whole("Band weight (g)", 1, 1_000_000),
  ratesCents: z.record(zoneId, cents("Shipping rate", 10_000_000)),
});
const ZoneGroupSchema = z.object({
  name: z.string().trim().min(1, "Name the group").max(60),
  zone: zoneId,
  countries: z.array(countryCode).min(2, "A group joins at least two countries").max(300),
});
const TaxRuleSchema = z.object({
  country: countryCode,
  /** Region (state, province) as written on addresses; empty = the whole country. */
  region: z.string().trim().max(60),
  rateBp: basisPoints("Tax rate"),
  taxHammer: z.boolean(),
  taxPremium: z.boolean(),
  taxShipping: z.boolean(),
});

/** The settings document (without the reason that accompanies a change). */
export const HouseSettingsSchema = z
  .object({
    buyersPremiumBp: basisPoints("Buyer's premium"),
    commissionTiers: z.array(CommissionTierSchema).min(1, "At least one tier").max(10),
    incrementLadder: z.array(LadderRungSchema).min(1, "At least one rung").max(30),
    softClose: z.object({
      windowSeconds: whole("Late-bid window (s)", 30, 1_800),
      maxExtensions: whole("Extension cap", 1, 1_000).nullable(),
    }),
    inspection: z.object({
      baseDays: whole("Inspection days", 1, 60),
      tubesPerExtraDay: whole("Tubes per extra day", 1, 10_000),
      maxDays: whole("Longest inspection (days)", 1, 90),
    }),
    claims: z.object({
      breakageClaimHours: whole("Breakage claim window (h)", 1, 720),
      answerBusinessDays: whole("Consignor answer (business days)", 1, 30),
      returnShipDays: whole("Return shipping (days)", 1, 60),
      receiptConfirmDays: whole("Receipt confirmation (days)", 1, 60),
      extraReviewAfterUpheld: whole("Extra review after upheld claims", 1, 100),
      testerTolerancePct: whole("Tester tolerance (%)", 0, 50),
    }),
    payment: z.object({
      dueDays: whole("Payment due (days)", 1, 60),
      reminderDaysBefore: whole("Reminder (days before due)", 0, 30),
    }),
    shipping: z.object({
      gramsPerTube: whole("Packed grams per tube", 1, 5_000),
      handlingCents: cents("Handling", 1_000_000),
      zones: z.array(zoneId).min(1, "At least one zone").max(12),
      sameCountryZone: zoneId,
      otherZone: zoneId,
      groups: z.array(ZoneGroupSchema).max(20),
      bands: z.array(ShippingBandSchema).min(1, "At least one weight band").max(20),
    }),
    tax: z.object({ rules: z.array(TaxRuleSchema).max(200) }),
    /** The house's trading name, postal address and paperwork e-mail, printed as the sender on its papers. */
    house: HouseDetailsSchema,
  })
  .superRefine((s, ctx) => {
    const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });
    // Commission tiers: ascending, non-overlapping ceilings; only the last is open-ended.
    let floor = 0;
    s.commissionTiers.forEach((t, i) => {
      const last = i === s.commissionTiers.length - 1;
      if (last && t.upToCents !== null) issue(["commissionTiers", i, "upToCents"], "The last tier has no ceiling");
      if (!last && t.upToCents === null) issue(["commissionTiers", i, "upToCents"], "Only the last tier is open-ended");
      if (t.upToCents !== null) {
        if (t.upToCents <= floor)
          issue(["commissionTiers", i, "upToCents"], "Tiers must ascend without overlapping the tier before");
        else floor = t.upToCents;
      }
    });
    // Increment ladder: from 0, strictly ascending.
    s.incrementLadder.forEach((r, i) => {
      if (i === 0 && r.fromCents !== 0) issue(["incrementLadder", 0, "fromCents"], "The first rung starts at 0");
      if (i > 0 && r.fromCents <= s.incrementLadder[i - 1]!.fromCents)
        issue(["incrementLadder", i, "fromCents"], "Rungs must ascend");
    });
    if (s.inspection.maxDays < s.inspection.baseDays)
      issue(["inspection", "maxDays"], "The longest period cannot be shorter than the base period");
    if (s.payment.reminderDaysBefore >= s.payment.dueDays)
      issue(["payment", "reminderDaysBefore"], "The reminder must come before the due date");
    // Shipping: zones unique, the named zones exist, bands ascend and price every zone.
    const zones = new Set(s.shipping.zones);
    if (zones.size !== s.shipping.zones.length) issue(["shipping", "zones"], "Each zone is listed once");
    for (const key of ["sameCountryZone", "otherZone"] as const)
      if (!zones.has(s.shipping[key])) issue(["shipping", key], "Choose one of the listed zones");
    s.shipping.groups.forEach((g, i) => {
      if (!zones.has(g.zone)) issue(["shipping", "groups", i, "zone"], "Choose one of the listed zones");
    });
    s.shipping.bands.forEach((b, i) => {
      if (i > 0 && b.upToGrams <= s.shipping.bands[i - 1]!.upToGrams)
        issue(["shipping", "bands", i, "upToGrams"], "Weight bands must ascend");
      for (const z of zones)
        if (b.ratesCents[z] === undefined) issue(["shipping", "bands", i, "ratesCents", z], `No rate for zone "${z}"`);
      for (const z of Object.keys(b.ratesCents))
        if (!zones.has(z)) issue(["shipping", "bands", i, "ratesCents", z], `"${z}" is not a listed zone`);
    });
    // Tax: one rule per country and region.
    const seen = new Set<string>();
    s.tax.rules.forEach((r, i) => {
      const key = `${r.country}/${r.region.toLowerCase()}`;
      if (seen.has(key)) issue(["tax", "rules", i, "region"], "This country and region already has a rule");
      seen.add(key);
    });
  });
export type HouseSettings = z.infer<typeof HouseSettingsSchema>;

/** PUT /api/house/settings: the whole document plus the reason kept with the new version. */
export const HouseSettingsChangeSchema = z.object({
  settings: HouseSettingsSchema,
  reason: z.string().trim().min(5, "Say why the settings change (at least 5 characters)").max(500),
});
export type HouseSettingsChange = z.infer<typeof HouseSettingsChangeSchema>;

/** Version 1: exactly the constants the exchange ran on before settings were editable [SUG house figures]. */
export const INITIAL_HOUSE_SETTINGS: HouseSettings = {
  buyersPremiumBp: DEFAULT_FEE_SCHEDULE.buyersPremiumBp,
  commissionTiers: DEFAULT_FEE_SCHEDULE.commissionTiers.map((t) => ({ ...t })),
  incrementLadder: DEFAULT_INCREMENT_LADDER.map((r) => ({ ...r })),
  softClose: { ...DEFAULT_SOFT_CLOSE },
  inspection: {
    baseDays: DEFAULT_INSPECTION_SETTINGS.baseDays,
    tubesPerExtraDay: DEFAULT_INSPECTION_SETTINGS.tubesPerExtraDay,
    maxDays: DEFAULT_INSPECTION_SETTINGS.maxDays,
  },
  claims: {
    breakageClaimHours: DISPUTE_SETTINGS.breakageClaimHours,
    answerBusinessDays: DISPUTE_SETTINGS.answerBusinessDays,
    returnShipDays: DISPUTE_SETTINGS.returnShipDays,
    receiptConfirmDays: DISPUTE_SETTINGS.receiptConfirmDays,
    extraReviewAfterUpheld: DISPUTE_SETTINGS.extraReviewAfterUpheld,
    // The points a buyer's reading may fall below the listed band before a claim weighs against the listing:
    // the generous end of the 10–15 testers differ by [CTP], as the weighing has always used.
    testerTolerancePct: TESTER_VARIATION_PCT,
  },
  payment: { dueDays: 7, reminderDaysBefore: 2 },
  shipping: {
    gramsPerTube: 60,
    handlingCents: DEFAULT_SHIPPING_TABLE.handlingCents,
    zones: [...DEFAULT_SHIPPING_TABLE.zones],
    sameCountryZone: "home",
    otherZone: "far",
    groups: [],
    bands: DEFAULT_SHIPPING_TABLE.bands.map((b) => ({ upToGrams: b.upToGrams, ratesCents: { ...b.ratesCents } })),
  },
  tax: { rules: [] },
  house: structuredClone(INITIAL_HOUSE_DETAILS),
};
