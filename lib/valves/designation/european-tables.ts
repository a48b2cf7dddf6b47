// Tables for European valve designations [PE].

import type { BaseFamily, HeaterKind } from "../index-types";

/** Meaning of a European first (heater) letter. */
export interface EuropeanHeaterLetter {
  readonly kind: HeaterKind;
  readonly volts?: number;
  readonly seriesCurrentMa?: number;
  readonly label: string;
  /** Source tag text: "PE" for the main table, "PE, MEM" for the rarer letters. */
  readonly source: string;
}

/**
 * First letter = heater [PE]. The rarer letters differ between secondary
 * sources, so they are kept as data, marked MEM, and carry no value where
 * sources disagree (verify in a European data book).
 */
export const EUROPEAN_HEATER_LETTERS: Readonly<Record<string, EuropeanHeaterLetter>> = {
  A: { kind: "voltage", volts: 4, label: "4 V parallel supply", source: "PE" },
  B: { kind: "series-current", seriesCurrentMa: 180, label: "180 mA series string", source: "PE" },
  C: { kind: "series-current", seriesCurrentMa: 200, label: "200 mA series string", source: "PE" },
  D: { kind: "battery", volts: 1.4, label: "1.4 V battery filament (later 0.5-1.5 V)", source: "PE" },
  E: { kind: "voltage", volts: 6.3, label: "6.3 V parallel supply", source: "PE" },
  F: { kind: "voltage", volts: 12.6, label: "12.6 V parallel supply", source: "PE" },
  G: { kind: "voltage", volts: 5, label: "5 V (later miscellaneous)", source: "PE" },
  H: { kind: "series-current", seriesCurrentMa: 150, label: "150 mA series string", source: "PE" },
  K: { kind: "battery", volts: 2, label: "2 V battery filament", source: "PE" },
  P: { kind: "series-current", seriesCurrentMa: 300, label: "300 mA series string", source: "PE" },
  U: { kind: "series-current", seriesCurrentMa: 100, label: "100 mA series string", source: "PE" },
  V: { kind: "series-current", seriesCurrentMa: 50, label: "50 mA series string", source: "PE" },
  L: { kind: "series-current", seriesCurrentMa: 450, label: "450 mA series string", source: "PE, MEM" },
  X: { kind: "series-current", label: "series string, 450 or 600 mA (sources differ)", source: "PE, MEM" },
  Y: { kind: "series-current", label: "series string, 450 or 600 mA (sources differ)", source: "PE, MEM" },
  W: { kind: "series-current", label: "series string, 450 or 600 mA (sources differ)", source: "PE, MEM" },
  T: { kind: "unknown", label: "rare letter, meaning differs between sources", source: "PE, MEM" },
};

/**
 * Following letters = systems, in alphabetical order [PE]. P (secondary
 * emission) is marked MEM (from memory).
 */
export const EUROPEAN_SYSTEM_LETTERS: Readonly<Record<string, { readonly system: string; readonly source: string }>> = {
  A: { system: "signal diode", source: "PE" },
  B: { system: "double diode (common cathode)", source: "PE" },
  C: { system: "signal triode", source: "PE" },
  D: { system: "power triode", source: "PE" },
  E: { system: "signal tetrode", source: "PE" },
  F: { system: "signal pentode", source: "PE" },
  H: { system: "hexode or hexode-type heptode", source: "PE" },
  K: { system: "octode or octode-type heptode", source: "PE" },
  L: { system: "output tetrode or pentode", source: "PE" },
  M: { system: "tuning indicator", source: "PE" },
  N: { system: "thyratron", source: "PE" },
  P: { system: "secondary-emission valve", source: "PE, MEM" },
  Q: { system: "nonode", source: "PE" },
  X: { system: "gas-filled full-wave rectifier", source: "PE" },
  Y: { system: "half-wave vacuum rectifier", source: "PE" },
  Z: { system: "full-wave vacuum rectifier", source: "PE" },
};

/** Base read from the digits, with the reason text. */
export interface EuropeanBaseReading {
  readonly family?: BaseFamily;
  readonly reason: string;
}

const TWO_DIGIT_BASE: Readonly<Record<string, EuropeanBaseReading>> = {
  "0": { family: "older-european", reason: "first digit 0: older or miscellaneous base [PE]" },
  "1": { family: "older-european", reason: "first digit 1: older or miscellaneous base [PE]" },
  "2": { family: "loktal-b10b", reason: "first digit 2: loktal-type base, later B10B [PE]" },
  "3": { family: "octal", reason: "first digit 3: International Octal [PE]" },
  "4": { family: "rimlock", reason: "first digit 4: Rimlock B8A [PE]" },
  "5": { family: "b9g", reason: "first digit 5: B9G and related bases [PE]" },
  "6": { family: "subminiature", reason: "first digit 6: subminiature [PE]" },
  "7": { family: "subminiature", reason: "first digit 7: subminiature [PE]" },
  "8": { family: "noval", reason: "first digit 8: noval B9A [PE]" },
  "9": { family: "miniature-7-pin", reason: "first digit 9: B7G 7-pin miniature [PE]" },
};

/**
 * Base from the serial digits [PE]: the first digit of a two-digit number
 * (3 octal, 4 rimlock, 8 noval, 9 B7G...); three-digit numbers 18x and 8xx are
 * noval and 5xx Magnoval [MEM]; other three-digit numbers are left undecoded.
 */
export function readEuropeanDigits(digits: string): EuropeanBaseReading {
  if (digits.length === 2) return TWO_DIGIT_BASE[digits[0]];
  if (digits.length === 3) {
    if (digits.startsWith("18")) return { family: "noval", reason: "three digits 18x: noval B9A [PE, MEM]" };
    if (digits[0] === "8") return { family: "noval", reason: "three digits 8xx: noval B9A [PE, MEM]" };
    if (digits[0] === "5") return { family: "magnoval", reason: "three digits 5xx: Magnoval [PE, MEM]" };
  }
  return { reason: `digits ${digits}: base not decoded from this number; check a data book [MEM]` };
}
