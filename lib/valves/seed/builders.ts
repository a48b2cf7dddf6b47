// Compact builders for the seed rows (lib/valves/seed/*). Seed data only:
// the running exchange reads the house's table from PostgreSQL.

import type { TypeHazard } from "../index-types";
import type { NominalCharacteristics, ReferenceHeater, ReferenceType } from "../reference-row";

export const H = (volts: number, amps: number, filament = false): ReferenceHeater =>
  filament ? { volts, amps, filament } : { volts, amps };
/** 12.6 V centre-tapped heater: `amps` in series, twice that at 6.3 V in parallel. */
export const TAP = (amps: number): ReferenceHeater => ({
  volts: 12.6,
  amps,
  tapped: { volts: 6.3, amps: Math.round(amps * 2000) / 1000 },
});
export const TRI = (
  plateVolts: number,
  bias: number | { rk: number },
  mu: number,
  gm: number,
  ip: number,
  rp?: number,
): NominalCharacteristics => ({
  kind: "amplifier",
  plateVolts,
  ...(typeof bias === "number" ? { gridVolts: bias } : { cathodeResistorOhms: bias.rk }),
  mu,
  gmMicromho: gm,
  plateCurrentMa: ip,
  ...(rp !== undefined ? { rpOhms: rp } : {}),
});
export const PEN = (
  plateVolts: number,
  screenVolts: number,
  bias: number | { rk: number },
  gm: number,
  ip: number,
  approximate = false,
): NominalCharacteristics => ({
  kind: "amplifier",
  plateVolts,
  screenVolts,
  ...(typeof bias === "number" ? { gridVolts: bias } : { cathodeResistorOhms: bias.rk }),
  gmMicromho: gm,
  plateCurrentMa: ip,
  ...(approximate ? { approximate } : {}),
});
export const RECT = (maxDcOutputMa?: number, approximate = true): NominalCharacteristics => ({
  kind: "rectifier",
  ...(maxDcOutputMa !== undefined ? { maxDcOutputMa } : {}),
  approximate,
});
export const REGV = (regulatedVolts: number, min: number, max: number): NominalCharacteristics => ({
  kind: "regulator",
  regulatedVolts,
  currentRangeMa: [min, max],
});
export const MEM_YEAR = (year: number) => ({ year, source: "MEM" as const });

export const MERCURY: TypeHazard = {
  kind: "mercury-vapour",
  certainty: "known",
  note: "Holds liquid mercury; after transport, warm the heater alone before applying high voltage",
  source: "MEM, verify",
};
export const PRIMING_SOURCE: TypeHazard = {
  kind: "radioactive",
  certainty: "possible",
  note: "Some cold-cathode regulators carried a small radioactive priming source, not always marked",
  source: "MEM, verify",
};

/** A row as written in the seed files: aliases and hazards may be left out. */
export type Row = Omit<ReferenceType, "aliases" | "hazards"> & Partial<Pick<ReferenceType, "aliases" | "hazards">>;
export const row = (r: Row): ReferenceType => ({ ...r, aliases: r.aliases ?? [], hazards: r.hazards ?? [] });

/**
 * A bulk seed row: designation, kind, heater, base; source defaults to
 * registered figures recalled from memory ("REG MEM"). Characteristics are
 * left empty unless given: never invent a figure to fill a column.
 */
export const T = (
  designation: string,
  kind: ReferenceType["kind"],
  heater: ReferenceHeater | null,
  base: ReferenceType["base"],
  extra: Partial<Row> = {},
): ReferenceType => row({ designation, kind, heater, base, source: "REG MEM", ...extra });

/** 1.4 V battery filament with a centre tap: `amps` at 2.8 V (halves in series), twice that at 1.4 V. */
export const B28 = (amps: number): ReferenceHeater => ({
  volts: 2.8,
  amps,
  filament: true,
  tapped: { volts: 1.4, amps: Math.round(amps * 2000) / 1000 },
});
/** European seed row: figures from European data books, recalled from memory. */
export const EU = (
  designation: string,
  kind: ReferenceType["kind"],
  heater: ReferenceHeater | null | undefined,
  base: ReferenceType["base"],
  extra: Partial<Row> = {},
): ReferenceType =>
  row({ designation, kind, ...(heater !== undefined ? { heater } : {}), base, source: "EU-DS MEM", ...extra });
