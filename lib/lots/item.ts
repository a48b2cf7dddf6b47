/**
 * A lot item as the domain sees it: one tube or a bundle of like tubes in a
 * consignment, with what is printed on it, who we think made it and on what
 * basis, its codes, construction notes, condition and tester readings.
 * Plain data only; validation of typed input lives with each importer.
 */
import { decodeDesignation } from "../valves/designation";
import type { ReferenceTable } from "../valves/reference-table";
import type { TestMeasure } from "../valves/grading";
import type { HazardKind } from "../valves/index-types";

/**
 * The three answers for a designation [SUG]: "known" (on file in the house's
 * reference table or the equivalents lists), "decoded" (reads by its scheme,
 * heater, systems and base, but no figures on file), "unknown-flagged" (not a
 * designation: flagged "check type" for review, never rejected).
 */
export type DesignationStatus = "known" | "decoded" | "unknown-flagged";

/** The designation as typed, its normalised form (null when it cannot be cleaned) and its status. */
export interface ItemDesignation {
  typed: string;
  normalised: string | null;
  status: DesignationStatus;
  /** For decoded and flagged designations: close known designations, nearest first. */
  candidates?: string[];
  /** For flagged designations: why, in words for the reviewer. */
  reviewNote?: string;
}

/**
 * How the maker was attributed. Label ≠ maker [CTP]: "source-code-confirmed"
 * when an EIA source code points to the maker (evidence, not proof [EIA-476]),
 * "construction-matched" when construction matches a reference example [CTP],
 * otherwise "unconfirmed".
 */
export type AttributionBasis = "source-code-confirmed" | "construction-matched" | "unconfirmed";

/** The factory we believe made the tube, and why. */
export interface AttributedMaker {
  makerName: string | null;
  basis: AttributionBasis;
}

/** Codes as printed or etched on the tube, kept verbatim (after trimming). */
export interface ItemCodes {
  source?: string;
  date?: string;
  other?: string;
}

/** NIB new in its original box; NOS never in service; used removed from equipment [CTP]. */
export type ItemCondition = "new-in-box" | "new-old-stock" | "used";

/** One tester run on one tube of the item. Readings are in the measure's own unit. */
export interface TubeReading {
  /** 1-based number of the tube within the item. */
  tubeNo: number;
  /** One reading per section; may be empty after a failed short, leakage or gas check. */
  sections: number[];
  /** The tester chart's "new" value for this type; falls back to the lot's chart values. */
  chartNewValue?: number;
  plateCurrentMa?: number;
  shorts?: boolean;
  leakage?: boolean;
  gas?: boolean;
  measure: TestMeasure;
}

/**
 * One line of a consignment. `quantity` counts tubes; tubes without a reading
 * are untested. `vacuumLoss` (white getter) applies to every tube of the item,
 * so a bundle with some white getters should be split into two items.
 */
export interface LotItem {
  designation: ItemDesignation;
  quantity: number;
  /** Brand printed on the tube, as printed; not the maker [CTP]. */
  labelBrand: string | null;
  attributedMaker: AttributedMaker;
  codes: ItemCodes;
  /** Construction features by name (plates, getter, micas...), in the consignor's words. */
  construction: Record<string, string>;
  condition: ItemCondition;
  vacuumLoss: boolean;
  defects: string[];
  /** Hazards declared by the consignor, beyond what our type data lists. */
  hazards: HazardKind[];
  readings: TubeReading[];
}

/**
 * Reads a typed designation into an ItemDesignation against the house's
 * reference table: "known" when it is on file, "decoded" when it reads by its
 * scheme with no figures on file, otherwise "unknown-flagged" with close known
 * candidates and a note for the reviewer.
 */
export function describeDesignation(table: ReferenceTable, typed: string): ItemDesignation {
  const d = decodeDesignation(table, typed);
  if (d.ok && d.knownType) return { typed, normalised: d.normalised, status: "known" };
  if (d.ok)
    return {
      typed,
      normalised: d.normalised,
      status: "decoded",
      ...(d.candidates.length ? { candidates: [...d.candidates] } : {}),
    };
  const normalised = d.normalised ?? null;
  const candidates = [...d.candidates];
  const reviewNote = `"${typed.slice(0, 40)}" could not be read as a designation: ${d.message}`;
  return { typed, normalised, status: "unknown-flagged", ...(candidates.length ? { candidates } : {}), reviewNote };
}

/**
 * Tubes an item stands for: its quantity, or more when it carries more
 * readings than its quantity (the readings are evidence of the tubes).
 */
export function itemTubeCount(item: Pick<LotItem, "quantity" | "readings">): number {
  return Math.max(item.quantity, item.readings.length);
}
