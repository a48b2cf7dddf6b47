// Result types of decodeDesignation.

import type { BaseFamily, HeaterConfiguration, HeaterKind } from "../index-types";

/**
 * Which numbering scheme a designation follows.
 * - us-rma: heater number + serial letters + element count + suffix (6SN7GT) [LS53]
 * - us-special: four-digit EIA registrations (5751, 7025); no heater meaning [MEM]
 * - us-numeric: early or transmitting numbers (83, 866A, 300B); only accepted when known
 * - european: heater letter + system letters + base digits (ECC83) [PE]
 * - european-special: special-quality order, digits inside (E88CC) [PE]
 * - military-cv / military-vt: military register numbers; no heater meaning [MEM]
 * - other: a type in our lists whose name follows none of the schemes above (KT88)
 */
export type DesignationSystem =
  "us-rma" | "us-special" | "us-numeric" | "european" | "european-special" | "military-cv" | "military-vt" | "other";

/** What the designation (and, where known, reference data) says about the heater. */
export interface HeaterInfo {
  readonly kind: HeaterKind;
  /** Nominal voltage, when the designation or reference data gives one. */
  readonly volts?: number;
  /** The class range the first number stands for, e.g. 5.6-6.6 V for "6" [LS53]. */
  readonly voltsRange?: readonly [number, number];
  /** Heater current from reference data (the designation never gives it for US types). */
  readonly amps?: number;
  /** Series-string current for European letters (P = 300 mA) [PE]. */
  readonly seriesCurrentMa?: number;
  /** true/false only when reference data says; undefined when unknown. */
  readonly tapped?: boolean;
  /** Known wiring configurations (two for a tapped heater). */
  readonly configurations?: readonly HeaterConfiguration[];
}

/** One decoded European system letter (E-C-C-83 has two "C" entries). */
export interface ElectrodeSystem {
  readonly letter: string;
  readonly system: string;
  /** Source tag text for this letter's meaning, e.g. "PE" or "PE, MEM". */
  readonly source: string;
}

/** Base as decoded, with where it came from. */
export interface BaseInfo {
  readonly family: BaseFamily;
  readonly label: string;
  readonly from: "designation" | "reference-data";
}

/** Envelope style read from a US suffix (or inferred for a plain octal type). */
export type EnvelopeKind =
  | "metal"
  | "metal-probable"
  | "glass-shouldered"
  | "glass-tubular"
  | "glass-tubular-or-shouldered"
  | "glass-miniature"
  | "unspecified";

/** What a US suffix says: envelope, improvement letter, ruggedising and base material. */
export interface EnvelopeInfo {
  readonly kind: EnvelopeKind;
  readonly suffix: string;
  /** Improvement letter (A, B, C...): improved and backward-compatible [MEM]. */
  readonly improvement?: string;
  readonly ruggedised: boolean;
  readonly baseMaterial?: "low-loss-phenolic" | "low-loss-ceramic";
}

/** The pieces of the designation as written. */
export interface DesignationParts {
  /** US heater number or European heater letter. */
  readonly heaterCode?: string;
  /** US serial letters or European system letters. */
  readonly letters?: string;
  /** US element count, European base digits, or a register number. */
  readonly number?: string;
  readonly suffix?: string;
  /** Military register prefix (CV, VT). */
  readonly prefix?: string;
}

/** A successfully decoded designation. Every reason carries its source tag. */
export interface DecodedDesignation {
  readonly ok: true;
  readonly input: string;
  readonly normalised: string;
  readonly system: DesignationSystem;
  readonly parts: DesignationParts;
  readonly heater: HeaterInfo;
  /** European system letters, in order; empty for other schemes. */
  readonly electrodes: readonly ElectrodeSystem[];
  readonly base?: BaseInfo;
  readonly envelope?: EnvelopeInfo;
  /** Leading S of a US two-letter group: single-ended, no top cap [LS53]. */
  readonly singleEnded?: boolean;
  readonly loktal?: boolean;
  readonly coldCathode: boolean;
  /** US final number; loosely applied, never a pinout [MEM]. */
  readonly elementCount?: number;
  /** Special-quality form (E88CC) or premium register number. */
  readonly specialQuality: boolean;
  /** Reference row used to enrich the decode, and how it matched. */
  readonly reference?: { readonly designation: string; readonly match: "exact" | "alias" | "stem" };
  /** true when the type is in our reference or equivalents lists. */
  readonly knownType: boolean;
  /** For types we do not know: the closest known designations. */
  readonly candidates: readonly string[];
  /** What normalisation changed in the input (upper-cased, removed hyphens...). */
  readonly changes: readonly string[];
  readonly reasons: readonly string[];
}

/** Why a designation could not be decoded. */
export type DesignationErrorCode = "empty" | "too-long" | "bad-characters" | "not-a-designation";

/** A failed decode, with the closest known designations. */
export interface DesignationError {
  readonly ok: false;
  readonly input: string;
  readonly normalised?: string;
  readonly error: DesignationErrorCode;
  readonly message: string;
  readonly candidates: readonly string[];
}

/** Result of decodeDesignation. */
export type DecodeResult = DecodedDesignation | DesignationError;

/**
 * What a scheme decoder produces before reference data is added: the decoded
 * fields without the input, known-type and candidate bookkeeping.
 */
export type StructuralDecode = Omit<
  DecodedDesignation,
  "ok" | "input" | "knownType" | "candidates" | "reference" | "reasons" | "changes"
> & { reasons: string[] };

/** A scheme decoder's refusal: the shape matched the scheme but something in it is impossible. */
export interface StructuralRefusal {
  readonly refused: true;
  readonly message: string;
}
