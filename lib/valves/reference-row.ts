// The shape of one reference row: heater, base, nominal class-A1
// characteristics at a stated operating point, hazards, and its source and
// verification. Rows live in PostgreSQL (valve_types), curated by the house;
// lib/valves/seed holds the rows the database starts from.
// Testers use their own test points: never grade against these figures [CTP].

import type { BaseFamily, TypeHazard } from "./index-types";

/** What a type is, in trade words. */
export type ValveKind =
  | "triode"
  | "dual-triode"
  | "power-triode"
  | "dual-power-triode"
  | "duo-diode-triode"
  | "diode-duo-diode-triode"
  | "pentode"
  | "remote-cutoff-pentode"
  | "power-pentode"
  | "beam-tetrode"
  | "triode-pentode"
  | "pentagrid-converter"
  | "triode-heptode"
  | "triode-hexode"
  | "duo-diode-pentode"
  | "damper-diode"
  | "twin-diode"
  | "full-wave-rectifier"
  | "half-wave-rectifier"
  | "voltage-regulator"
  | "tuning-indicator";

/**
 * Row source: a publication tag from lib/valves/sources.ts ("REG", "EU-DS",
 * "MIL-E-1/REG"), "CTP" (common practice) or "MEM" (from memory), then an
 * optional mark: "✓" checked against a published data sheet, "MEM" recalled
 * from memory (verify), "MEM?" from memory with low confidence.
 * Examples: "REG ✓", "EU-DS MEM", "MEM?". Parsed by parseRowSource.
 */
export type RowSource = string;

/** Who checked a row against which data sheet, and when (ISO date). */
export interface RowVerification {
  /** The data sheet or handbook page checked, e.g. "REG data sheet, 12AU7A". */
  readonly against: string;
  readonly by: string;
  readonly on: string;
}

/** Heater (or filament) rating; `tapped` is the second wiring of a centre-tapped heater. */
export interface ReferenceHeater {
  readonly volts: number;
  readonly amps: number;
  /** Directly heated filament rather than an indirectly heated cathode. */
  readonly filament?: boolean;
  /** Halves in parallel (the first figures are halves in series). */
  readonly tapped?: { readonly volts: number; readonly amps: number };
}

/** Nominal characteristics at a stated operating point (per section for multi-section types). */
export type NominalCharacteristics =
  | {
      readonly kind: "amplifier";
      readonly plateVolts: number;
      readonly gridVolts?: number;
      readonly cathodeResistorOhms?: number;
      readonly screenVolts?: number;
      readonly mu?: number;
      readonly gmMicromho?: number;
      readonly plateCurrentMa?: number;
      readonly rpOhms?: number;
      /** Figures marked "≈" or "?" (approximate) in our sources. */
      readonly approximate?: boolean;
    }
  | { readonly kind: "rectifier"; readonly maxDcOutputMa?: number; readonly approximate?: boolean }
  | { readonly kind: "regulator"; readonly regulatedVolts: number; readonly currentRangeMa: readonly [number, number] };

/** One reference row. `aliases` share this row's heater, base and nominal characteristics. */
export interface ReferenceType {
  readonly designation: string;
  readonly aliases: readonly string[];
  readonly kind: ValveKind;
  /** null for cold-cathode types (no heater); left out when the house has no heater figures yet. */
  readonly heater?: ReferenceHeater | null;
  readonly base: BaseFamily;
  /** Year of introduction from secondary histories [MEM]. */
  readonly introduced?: { readonly year: number; readonly source: "MEM" };
  readonly characteristics?: NominalCharacteristics;
  readonly hazards: readonly TypeHazard[];
  /** Large glass envelope: breakage and implosion risk is higher [CTP]. */
  readonly largeEnvelope?: boolean;
  readonly source: RowSource;
  /** Set once someone has checked the row against a data sheet. */
  readonly verification?: RowVerification;
  readonly note?: string;
}

/** Kinds a row may have (ValveKind), for validation. */
export const VALVE_KINDS: readonly ValveKind[] = [
  "triode",
  "dual-triode",
  "power-triode",
  "dual-power-triode",
  "duo-diode-triode",
  "diode-duo-diode-triode",
  "pentode",
  "remote-cutoff-pentode",
  "power-pentode",
  "beam-tetrode",
  "triode-pentode",
  "pentagrid-converter",
  "triode-heptode",
  "triode-hexode",
  "duo-diode-pentode",
  "damper-diode",
  "twin-diode",
  "full-wave-rectifier",
  "half-wave-rectifier",
  "voltage-regulator",
  "tuning-indicator",
];
