// The shapes a weighing works on: each side of a claimed item and the comparison's result.
import type { TubeReading } from "../lots/item";
import type { MakerCandidate } from "../valves/attribution";
import type { Grade } from "../valves/grading";

/** The listing's side of an item. */
export interface ListingSide {
  position: number;
  designation: string;
  quantity: number;
  labelBrand: string;
  makerName: string | null;
  makerBasis: string;
  sourceCode: string | null;
  dateCode: string | null;
  features: Record<string, string>;
  vacuumLoss: boolean;
  readings: TubeReading[];
}

/** What the buyer reports about the same item. */
export interface BuyerReport {
  /** Tubes of the item the claim covers. */
  tubes: number;
  sourceCode?: string | null;
  dateCode?: string | null;
  /** Designation as the buyer reads it, when it differs. */
  designationSeen?: string | null;
  /** Tubes of the item actually received (short count). */
  tubesReceived?: number | null;
  /** The buyer saw a white getter flash (vacuum lost). */
  vacuumLoss?: boolean;
  features: Record<string, string>;
  readings: TubeReading[];
  note?: string;
}

/** One reading graded, for display. */
export interface GradedReading {
  tubeNo: number;
  measure: string;
  sections: number[];
  /** The tester chart's "new" value the grade rests on (null: not graded). */
  chartNewValue: number | null;
  grade: Grade | "not-graded";
  worstPercentOfNew: number | null;
  /** Weakest section as % of the data sheet's nominal Gm: illustrative only, never a grade. */
  percentOfNominal: number | null;
  hardFail: boolean;
  reasons: string[];
}

/** How each side's features rank makers. */
export interface SideRanking {
  /** Maker the side's source code points to, from the house's registry. */
  sourceCodeMaker: string | null;
  candidates: MakerCandidate[];
  /** Features recorded that our vocabulary did not know. */
  ignored: string[];
}

export type Verdict = "supports" | "does-not-support" | "inconclusive";

/** The item's comparison. */
export interface ItemWeighing {
  position: number;
  verdict: Verdict;
  findings: string[];
  listing: { ranking: SideRanking; readings: GradedReading[] };
  buyer: { ranking: SideRanking; readings: GradedReading[] };
}
