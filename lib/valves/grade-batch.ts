/**
 * Grade a batch of tester readings and find the matched sets among the tubes
 * that pass: the computation behind POST /api/valves/grade and a lot's test
 * summary. Pure: readings in, grades and sets out.
 */
import {
  gradeReading,
  HOUSE_DEFAULT_THRESHOLDS,
  type Grade,
  type GradeResult,
  type GradeThresholds,
  type TestMeasure,
} from "./grading";
import { findMatchedPairs, findMatchedQuads, type MatchResult } from "./matching";

/** One tube in a batch; `chartNewValue` falls back to the batch's. */
export interface BatchTube {
  id: string;
  sections: number[];
  chartNewValue?: number;
  plateCurrentMa?: number;
  shorts?: boolean;
  leakage?: boolean;
  gas?: boolean;
  vacuumLoss?: boolean;
  openHeater?: boolean;
}

export interface BatchInput {
  measure: TestMeasure;
  chartNewValue?: number;
  thresholds?: Partial<GradeThresholds>;
  /** Matching tolerance on Gm (and plate current), % spread; pairs 5–10 % [CTP]. */
  tolerancePct: number;
  onPlateCurrent?: boolean;
  tubes: BatchTube[];
}

export type BatchGrade = (GradeResult & { id: string }) | { id: string; grade: "not-graded"; error: string };

export interface BatchResult {
  grades: BatchGrade[];
  counts: Record<Grade | "not-graded", number>;
  /** Matching is on Gm readings only: emission readings are never matched [CTP]. */
  pairs: MatchResult | null;
  quads: MatchResult | null;
  matchingNote: string;
}

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;

/** Grade every tube, then match the tubes that pass on Gm (mean of sections). */
export function gradeBatch(input: BatchInput): BatchResult {
  const thresholds: GradeThresholds = { ...HOUSE_DEFAULT_THRESHOLDS, ...input.thresholds };
  const counts: BatchResult["counts"] = {
    strong: 0,
    good: 0,
    fair: 0,
    weak: 0,
    "emission-ok": 0,
    reject: 0,
    "not-graded": 0,
  };
  const grades: BatchGrade[] = input.tubes.map((t) => {
    const chart = t.chartNewValue ?? input.chartNewValue;
    if (chart === undefined && t.sections.length > 0) {
      counts["not-graded"]++;
      return { id: t.id, grade: "not-graded" as const, error: "no chart value for % of new" };
    }
    try {
      const g = gradeReading(
        {
          measure: input.measure,
          sections: t.sections,
          chartNewValue: chart ?? 1,
          shorts: t.shorts,
          leakage: t.leakage,
          gas: t.gas,
          vacuumLoss: t.vacuumLoss,
          openHeater: t.openHeater,
        },
        thresholds,
      );
      counts[g.grade]++;
      return { ...g, id: t.id };
    } catch (e) {
      counts["not-graded"]++;
      return { id: t.id, grade: "not-graded" as const, error: (e as Error).message };
    }
  });

  if (input.measure !== "gm") {
    return {
      grades,
      counts,
      pairs: null,
      quads: null,
      matchingNote: "Only Gm readings are matched; emission and plate-current runs are graded but not matched.",
    };
  }
  const byId = new Map(input.tubes.map((t) => [t.id, t]));
  const passing = grades
    .filter(
      (g): g is GradeResult & { id: string } => g.grade !== "reject" && g.grade !== "not-graded" && g.grade !== "weak",
    )
    .map((g) => byId.get(g.id)!)
    .filter((t) => t.sections.length > 0 && (!input.onPlateCurrent || (t.plateCurrentMa ?? 0) > 0))
    .map((t) => ({
      id: t.id,
      gm: mean(t.sections),
      ...(t.plateCurrentMa ? { plateCurrentMa: t.plateCurrentMa } : {}),
    }));
  const opts = { tolerancePct: input.tolerancePct, onPlateCurrent: input.onPlateCurrent };
  return {
    grades,
    counts,
    pairs: findMatchedPairs(passing, opts),
    quads: findMatchedQuads(passing, opts),
    matchingNote: `Matched among ${passing.length} tubes graded fair or better${input.onPlateCurrent ? ", on Gm and plate current" : ", on Gm"}, within ${input.tolerancePct} % spread.`,
  };
}
