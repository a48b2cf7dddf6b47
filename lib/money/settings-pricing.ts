/**
 * An invoice priced by one frozen settings version: premium and commission from its tiers, shipping by zone from the
 * lot's origin to the buyer's address over its weight bands, and tax by the destination's rule. Pure: plain data in,
 * integer cents out.
 *
 * Rounding [SUG, our product rule]: each figure is rounded once, half-up, to the cent — premium on the hammer,
 * commission on the exact tiered sum, tax on the taxable total of the whole invoice (never per line).
 */
import { DEFAULT_ROUNDING } from "./cents";
import { invoiceFor, sellersCommissionCents, type FeeSchedule, type InvoiceBreakdown } from "./fees";
import { shippingQuote, type ShippingTable } from "./shipping";
import type { HouseSettings } from "../validation/house-settings";

/** Where a parcel leaves from or goes to: only the country and region matter for pricing. */
export type Place = { country: string; region?: string } | null | undefined;

type Shipping = HouseSettings["shipping"];
type TaxRule = HouseSettings["tax"]["rules"][number];

/**
 * The zone from origin to destination [SUG]: the same country → `sameCountryZone`; both countries in one group →
 * that group's zone (the first group that holds both); otherwise `otherZone`. Without both addresses the parcel is
 * priced as domestic (`sameCountryZone`), which is how the house priced every parcel before addresses were kept.
 */
export function shippingZone(shipping: Shipping, origin: Place, destination: Place): string {
  if (!origin || !destination) return shipping.sameCountryZone;
  const from = origin.country.toUpperCase();
  const to = destination.country.toUpperCase();
  if (from === to) return shipping.sameCountryZone;
  const group = shipping.groups.find((g) => g.countries.includes(from) && g.countries.includes(to));
  return group?.zone ?? shipping.otherZone;
}

/** The settings' bands as a rate table for {@link shippingQuote}. */
export function shippingTableOf(shipping: Shipping): ShippingTable {
  return { zones: shipping.zones, bands: shipping.bands, handlingCents: shipping.handlingCents };
}

/**
 * Shipping for a lot of `tubes` tubes to `zone`: packed weight = tubes × grams per tube (at least one tube's worth),
 * split into parcels no heavier than the heaviest band, each priced by its band plus handling.
 */
export function lotShippingCents(shipping: Shipping, tubes: number, zone: string): number {
  const table = shippingTableOf(shipping);
  const maxParcel = table.bands[table.bands.length - 1]!.upToGrams;
  let grams = Math.max(1, tubes) * shipping.gramsPerTube;
  let cents = 0;
  while (grams > 0) {
    const parcel = Math.min(grams, maxParcel);
    const q = shippingQuote(table, parcel, zone);
    if (q.kind !== "rate") throw new RangeError(`the shipping bands cannot price ${parcel} g to zone ${zone}`);
    cents += q.cents;
    grams -= parcel;
  }
  return cents;
}

/**
 * The tax rule for a destination [SUG]: a rule for its country and region (compared without case) wins over one for
 * the whole country (empty region); no rule, or no address, means no tax.
 */
export function taxRuleFor(tax: HouseSettings["tax"], destination: Place): TaxRule | null {
  if (!destination) return null;
  const country = destination.country.toUpperCase();
  const region = (destination.region ?? "").trim().toLowerCase();
  const inCountry = tax.rules.filter((r) => r.country === country);
  return (
    (region !== "" ? inCountry.find((r) => r.region.trim().toLowerCase() === region) : undefined) ??
    inCountry.find((r) => r.region.trim() === "") ??
    null
  );
}

/** The fee schedule a settings version gives for one destination's tax rule. */
export function feeScheduleOf(settings: HouseSettings, rule: TaxRule | null): FeeSchedule {
  return {
    buyersPremiumBp: settings.buyersPremiumBp,
    commissionTiers: settings.commissionTiers,
    taxRateBp: rule?.rateBp ?? 0,
    taxBase: {
      hammer: rule?.taxHammer ?? false,
      premium: rule?.taxPremium ?? false,
      shipping: rule?.taxShipping ?? false,
    },
  };
}

/** Everything an invoice records for one sold lot. */
export interface SettledInvoice extends InvoiceBreakdown {
  premiumBp: number;
  taxBp: number;
  zone: string;
  commissionCents: number;
}

/** Prices a sold lot under one settings version (see the module comment for the rounding rule). */
export function priceSoldLot(
  input: { hammerCents: number; tubes: number; origin: Place; destination: Place },
  settings: HouseSettings,
): SettledInvoice {
  const zone = shippingZone(settings.shipping, input.origin, input.destination);
  const shippingCents = lotShippingCents(settings.shipping, input.tubes, zone);
  const rule = taxRuleFor(settings.tax, input.destination);
  const schedule = feeScheduleOf(settings, rule);
  const inv = invoiceFor({ hammerCents: input.hammerCents, shippingCents }, schedule, DEFAULT_ROUNDING);
  return {
    ...inv,
    premiumBp: settings.buyersPremiumBp,
    taxBp: schedule.taxRateBp,
    zone,
    commissionCents: sellersCommissionCents(input.hammerCents, settings.commissionTiers, DEFAULT_ROUNDING),
  };
}
