/**
 * Shipping charges from the house's own rate table: packed weight band ×
 * destination zone → cents. The table is a house setting [SUG]; the figures
 * below are Getterline's own defaults, not any carrier's published rates.
 * Weights are the packed, double-boxed parcel (packing [CTP]).
 */
import { assertCents } from "./cents";

/** Destination zones of the default table: same country, neighbouring countries, overseas. */
export type DefaultZone = "home" | "near" | "far";

/** One weight band: parcels up to `upToGrams` (inclusive) cost `ratesCents[zone]`. */
export interface ShippingBand {
  /** Heaviest packed weight in this band, grams. */
  upToGrams: number;
  /** Charge per zone id, cents. */
  ratesCents: Readonly<Record<string, number>>;
}

/** A complete rate table. Bands ascend by weight; every band prices every zone. */
export interface ShippingTable {
  /** Zone ids this table prices. */
  zones: readonly string[];
  /** Weight bands, lightest first. */
  bands: readonly ShippingBand[];
  /** Flat packing/handling charge added to every parcel, cents. */
  handlingCents: number;
}

/** Getterline's default table [SUG house setting; invented figures]. */
export const DEFAULT_SHIPPING_TABLE: ShippingTable = {
  zones: ["home", "near", "far"],
  handlingCents: 300,
  bands: [
    { upToGrams: 500, ratesCents: { home: 900, near: 1_900, far: 2_900 } },
    { upToGrams: 2_000, ratesCents: { home: 1_400, near: 3_200, far: 5_200 } },
    { upToGrams: 5_000, ratesCents: { home: 2_200, near: 5_400, far: 8_900 } },
    { upToGrams: 10_000, ratesCents: { home: 3_400, near: 8_200, far: 13_900 } },
    { upToGrams: 20_000, ratesCents: { home: 5_200, near: 12_900, far: 21_900 } },
  ],
};

/** Lists what is wrong with a table (empty = valid). */
export function validateShippingTable(table: ShippingTable): string[] {
  const problems: string[] = [];
  if (table.zones.length === 0) problems.push("at least one zone is required");
  if (table.bands.length === 0) problems.push("at least one weight band is required");
  if (!Number.isSafeInteger(table.handlingCents) || table.handlingCents < 0) {
    problems.push("handlingCents must be a non-negative whole number of cents");
  }
  let previous = 0;
  table.bands.forEach((band, index) => {
    if (!Number.isSafeInteger(band.upToGrams) || band.upToGrams <= previous) {
      problems.push(`band ${index}: upToGrams must be a whole number above ${previous}`);
    } else {
      previous = band.upToGrams;
    }
    for (const zone of table.zones) {
      const rate = band.ratesCents[zone];
      if (rate === undefined) problems.push(`band ${index}: no rate for zone "${zone}"`);
      else if (!Number.isSafeInteger(rate) || rate < 0)
        problems.push(`band ${index}: rate for "${zone}" must be whole cents`);
    }
  });
  return problems;
}

/** A shipping price, or the reason the table cannot price the parcel (staff quote it by hand). */
export type ShippingQuote =
  | { kind: "rate"; cents: number; bandUpToGrams: number }
  | { kind: "quote-needed"; reason: "over-weight" | "unknown-zone" };

/**
 * Prices a parcel: the first band whose ceiling is at or above the packed
 * weight (integer grams, > 0), that band's zone rate, plus handling.
 * Parcels heavier than the last band or to an unknown zone need a manual quote.
 */
export function shippingQuote(table: ShippingTable, weightGrams: number, zone: string): ShippingQuote {
  const problems = validateShippingTable(table);
  if (problems.length > 0) throw new RangeError(`invalid shipping table: ${problems.join("; ")}`);
  if (!Number.isSafeInteger(weightGrams) || weightGrams <= 0) {
    throw new RangeError(`weightGrams must be a positive whole number, got ${weightGrams}`);
  }
  if (!table.zones.includes(zone)) return { kind: "quote-needed", reason: "unknown-zone" };
  const band = table.bands.find((b) => weightGrams <= b.upToGrams);
  if (!band) return { kind: "quote-needed", reason: "over-weight" };
  const cents = assertCents(band.ratesCents[zone] + table.handlingCents, "shipping");
  return { kind: "rate", cents, bandUpToGrams: band.upToGrams };
}
