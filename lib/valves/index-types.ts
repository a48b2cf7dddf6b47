// Shared plain types for the valve knowledge modules (designations, reference
// data, equivalents, hazards). Types only: no data, no behaviour.

/**
 * Source tags used beside every trade constant, listed with their publications in lib/valves/sources.ts:
 * REG registered data sheets, MIL-E-1 military sheets, EU-DS European data books,
 * PE European designation scheme, LS53 designer's handbook 1953, EIA-476 date/source
 * codes, CTP common trade practice, MEM from memory (verify), SUG our own suggestion.
 */
export type SourceTag = "REG" | "MIL-E-1" | "EU-DS" | "PE" | "LS53" | "EIA-476" | "CTP" | "MEM" | "SUG";

/**
 * Base (socket) families we name. The labels live in designation/base-families.ts.
 * "loktal-b10b" is the European 2x series ("loktal-type, later B10B" [PE]).
 */
export type BaseFamily =
  | "octal"
  | "noval"
  | "miniature-7-pin"
  | "rimlock"
  | "loktal"
  | "loktal-b10b"
  | "magnoval"
  | "b9g"
  | "subminiature"
  | "four-pin"
  | "pre-octal"
  | "older-european";

/**
 * How a heater is specified: by voltage (parallel supply), by series-string
 * current, as a battery filament, not at all (cold cathode), or not knowable
 * from the designation alone.
 */
export type HeaterKind = "none" | "voltage" | "series-current" | "battery" | "unknown";

/** One way of wiring a heater; tapped heaters have two (halves in series or in parallel). */
export interface HeaterConfiguration {
  readonly volts: number;
  readonly amps: number;
  readonly wiring: "single" | "halves-in-series" | "halves-in-parallel";
}

/**
 * Hazards a listing may have to show. "high-voltage" and "glass" apply to every
 * valve; the others are type-specific.
 */
export type HazardKind = "high-voltage" | "glass" | "beryllium-oxide" | "radioactive" | "mercury-vapour";

/** How sure we are that a type carries a hazard: "known" for the type, or "possible" for some production. */
export type HazardCertainty = "known" | "possible";

/** A hazard attached to one reference type, with its source. */
export interface TypeHazard {
  readonly kind: HazardKind;
  readonly certainty: HazardCertainty;
  readonly note: string;
  /** Source tag text, e.g. "MEM, verify". */
  readonly source: string;
}
