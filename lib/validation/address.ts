/**
 * A shipping address kept by a buyer or consignor (shared by the address form and PUT /api/account/address).
 * Countries are ISO 3166-1 alpha-2 codes checked against the i18n-iso-countries package, never a list typed here;
 * lines and postal codes are bounded, control characters stripped as from any one-line text.
 */
import countries from "i18n-iso-countries";
import en from "i18n-iso-countries/langs/en.json";
import { z } from "zod";
import { lineText } from "./text";

countries.registerLocale(en);

/** Country codes and English names, sorted by name, for the form's picker. */
export function countryOptions(): { code: string; name: string }[] {
  return Object.entries(countries.getNames("en", { select: "official" }))
    .map(([code, name]) => ({ code, name }))
    .sort((a, b) => a.name.localeCompare(b.name, "en"));
}

/** The English name of a country code, or the code itself when unknown. */
export function countryName(code: string): string {
  return countries.getName(code, "en", { select: "official" }) ?? code;
}

/** One line of an address: control and direction characters stripped (lib/validation/text.ts), then bounded. */
const line = (label: string, max: number) => lineText().trim().max(max, `${label}: at most ${max} characters`);

export const AddressSchema = z.object({
  name: line("Name", 100).min(2, "Give the recipient's name"),
  line1: line("Address line 1", 120).min(3, "Give the street address"),
  line2: line("Address line 2", 120),
  city: line("City", 80).min(1, "Give the city or town"),
  region: line("Region", 60),
  postalCode: line("Postal code", 16).regex(/^[A-Za-z0-9 -]*$/, "Postal code: letters, digits, spaces and hyphens"),
  country: z
    .string()
    .trim()
    .toUpperCase()
    .refine((c) => /^[A-Z]{2}$/.test(c) && countries.isValid(c), "Choose a country from the list"),
});
export type Address = z.infer<typeof AddressSchema>;

/** An address as the invoice and the PDF print it: the name, then the lines (region and country spelled out). */
export type AddressBlock = { name: string; lines: string[] };

/** Lines of an address for print; null when there is none. */
export function addressBlock(a: Address | null | undefined): AddressBlock | null {
  if (!a) return null;
  const cityLine = [a.city, a.region, a.postalCode].filter((p) => p.trim() !== "").join(", ");
  return {
    name: a.name,
    lines: [a.line1, a.line2, cityLine, countryName(a.country)].filter((l) => l.trim() !== ""),
  };
}
