/**
 * Grading one tester reading: "% of new" per section, a grade band, hard
 * failures and dual-section balance [CTP].
 *
 * "% of new" is always against the tester model's own chart value, never a
 * data-sheet figure [CTP], and emission readings are never set against Gm.
 */

/** What the tester measured. Emission testers give relative good/bad only [CTP]. */
export type TestMeasure = "gm" | "emission" | "plate-current";

/**
 * Our grade labels. "emission-ok" is the only pass an emission reading can
 * earn: an emission tester does not support strong/good/fair bands [CTP].
 */
export type Grade = "strong" | "good" | "fair" | "weak" | "emission-ok" | "reject";

/** Absolute failures that reject a tube whatever its reading [CTP]. */
export type HardFail = "short" | "leakage" | "gas" | "vacuum-loss" | "open-heater";

/** Band limits in % of new; a house setting. */
export interface GradeThresholds {
  strongMinPct: number;
  goodMinPct: number;
  fairMinPct: number;
  /** Optional house rule: below this % the tube is rejected, not just weak. */
  rejectBelowPct?: number;
  /** Largest section spread (max − min)/mean in % still called balanced. */
  sectionBalanceMaxSpreadPct: number;
}

/**
 * House defaults [CTP; dealers differ]: ≥100 % strong, 80–99 % good,
 * 60–79 % fair, <60 % weak; dual-triode sections within ~10–20 % [CTP].
 */
export const HOUSE_DEFAULT_THRESHOLDS: Readonly<GradeThresholds> = Object.freeze({
  strongMinPct: 100,
  goodMinPct: 80,
  fairMinPct: 60,
  sectionBalanceMaxSpreadPct: 20,
});

/** One tester run on one tube. Readings are in the measure's own unit. */
export interface TesterReading {
  measure: TestMeasure;
  /** One reading per section (a dual triode has two). May be empty after a hard failure. */
  sections: number[];
  /** The tester chart's "new" value: one for all sections, or one per section. */
  chartNewValue: number | number[];
  shorts?: boolean;
  leakage?: boolean;
  gas?: boolean;
  /** White or milky getter: the envelope has let air in [CTP]. */
  vacuumLoss?: boolean;
  openHeater?: boolean;
}

/** Section balance of a multi-section tube, computed on % of new. */
export interface SectionBalance {
  spreadPct: number;
  tolerancePct: number;
  withinTolerance: boolean;
}

/** The verdict on one reading. */
export interface GradeResult {
  measure: TestMeasure;
  grade: Grade;
  percentOfNew: number[];
  /** The weakest section decides the grade [CTP]; null when nothing was measured. */
  worstPercentOfNew: number | null;
  hardFails: HardFail[];
  reasons: string[];
  sectionBalance?: SectionBalance;
}

/** Thrown for readings that cannot be graded (missing values, non-positive chart values). */
export class GradingInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "GradingInputError";
  }
}

/** Reading ÷ chart "new" value × 100 [CTP]. */
export function percentOfNew(reading: number, chartNewValue: number): number {
  if (!Number.isFinite(reading) || reading < 0)
    throw new GradingInputError(`reading must be a number ≥ 0, got ${reading}`);
  if (!Number.isFinite(chartNewValue) || chartNewValue <= 0) {
    throw new GradingInputError(`chart "new" value must be a positive number, got ${chartNewValue}`);
  }
  return (reading / chartNewValue) * 100;
}

/** The Gm/plate-current band for a % of new, under the given thresholds. */
export function bandForPercent(
  pct: number,
  thresholds: GradeThresholds = HOUSE_DEFAULT_THRESHOLDS,
): "strong" | "good" | "fair" | "weak" | "reject" {
  if (thresholds.rejectBelowPct !== undefined && pct < thresholds.rejectBelowPct) return "reject";
  if (pct >= thresholds.strongMinPct) return "strong";
  if (pct >= thresholds.goodMinPct) return "good";
  if (pct >= thresholds.fairMinPct) return "fair";
  return "weak";
}

/** Spread (max − min)/mean in % [SUG]; 0 for fewer than two values. */
export function sectionSpreadPct(values: readonly number[]): number {
  if (values.length < 2) return 0;
  const mean = values.reduce((sum, v) => sum + v, 0) / values.length;
  if (mean === 0) return 0;
  return ((Math.max(...values) - Math.min(...values)) / mean) * 100;
}

const HARD_FAIL_CHECKS: readonly [keyof TesterReading, HardFail, string][] = [
  ["shorts", "short", "short between elements"],
  ["leakage", "leakage", "excess leakage"],
  ["gas", "gas", "gas"],
  ["vacuumLoss", "vacuum-loss", "white getter: air leak"],
  ["openHeater", "open-heater", "open heater"],
];

function checkThresholds(t: GradeThresholds): void {
  const ordered = t.strongMinPct > t.goodMinPct && t.goodMinPct > t.fairMinPct && t.fairMinPct > 0;
  if (!ordered) throw new GradingInputError("thresholds must satisfy strong > good > fair > 0");
  if (t.rejectBelowPct !== undefined && t.rejectBelowPct > t.fairMinPct) {
    throw new GradingInputError("rejectBelowPct must not exceed fairMinPct");
  }
}

/**
 * Grade one reading. Any short, leakage, gas, vacuum loss or open heater
 * rejects the tube regardless of the reading [CTP]. Otherwise the weakest
 * section's % of new picks the band; emission readings only pass or fail.
 */
export function gradeReading(
  reading: TesterReading,
  thresholds: GradeThresholds = HOUSE_DEFAULT_THRESHOLDS,
): GradeResult {
  checkThresholds(thresholds);
  const hardFails = HARD_FAIL_CHECKS.filter(([key]) => reading[key] === true).map(([, fail]) => fail);
  const reasons = HARD_FAIL_CHECKS.filter(([key]) => reading[key] === true).map(
    ([, , text]) => `${text}: rejected regardless of reading`,
  );
  if (reading.sections.length === 0 && hardFails.length === 0) {
    throw new GradingInputError("no section readings and no hard failure: nothing to grade");
  }
  const charts = Array.isArray(reading.chartNewValue)
    ? reading.chartNewValue
    : reading.sections.map(() => reading.chartNewValue as number);
  if (charts.length !== reading.sections.length) {
    throw new GradingInputError(`${reading.sections.length} section readings but ${charts.length} chart values`);
  }
  const percents = reading.sections.map((value, i) => percentOfNew(value, charts[i]));
  const worst = percents.length > 0 ? Math.min(...percents) : null;
  const result: GradeResult = {
    measure: reading.measure,
    grade: "reject",
    percentOfNew: percents,
    worstPercentOfNew: worst,
    hardFails,
    reasons,
  };

  if (percents.length >= 2) {
    const spreadPct = sectionSpreadPct(percents);
    const tolerancePct = thresholds.sectionBalanceMaxSpreadPct;
    result.sectionBalance = { spreadPct, tolerancePct, withinTolerance: spreadPct <= tolerancePct };
    if (spreadPct > tolerancePct)
      reasons.push(`sections unbalanced: spread ${spreadPct.toFixed(1)} % exceeds ${tolerancePct} %`);
  }
  if (hardFails.length > 0 || worst === null) return result;

  if (reading.measure === "emission") {
    const passes = worst >= thresholds.fairMinPct;
    result.grade = passes ? "emission-ok" : "weak";
    reasons.push(`emission reading ${worst.toFixed(0)} % of chart: pass/fail only, not comparable with Gm`);
    return result;
  }
  result.grade = bandForPercent(worst, thresholds);
  const label = reading.measure === "gm" ? "Gm" : "plate current";
  reasons.push(
    `${percents.length > 1 ? "weakest section " : ""}${label} ${worst.toFixed(1)} % of new → ${result.grade}`,
  );
  return result;
}
