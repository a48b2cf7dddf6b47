/**
 * The mediator's side-by-side for one claimed item: what the listing said,
 * what the buyer reports, how the attribution engine ranks makers from each
 * set of features, and each side's readings graded against the chart or
 * nominal figure. A plain verdict per item says whether the buyer's evidence
 * supports the claim; the mediator decides. Pure.
 */
import type { TubeReading } from "../lots/item";
import { nominalGmFromReference } from "../lots/readings-chart";
import { typeFamily } from "../lots/type-family";
import { rankMakers, type ReferenceProfile } from "../valves/attribution";
import { featuresFromText } from "../valves/construction-text";
import { decodeDesignation } from "../valves/designation";
import type { ReferenceTable } from "../valves/reference-table";
import { gradeReading } from "../valves/grading";
import type { DisputeReason } from "./rules";
import { judge, TESTER_VARIATION_PCT } from "./verdicts";
import type { BuyerReport, GradedReading, ItemWeighing, ListingSide, SideRanking, Verdict } from "./weigh-types";

export type { BuyerReport, GradedReading, ItemWeighing, ListingSide, SideRanking, Verdict } from "./weigh-types";
export { TESTER_VARIATION_PCT } from "./verdicts";

/**
 * Grade each reading against the tester chart's "new" value: the reading's
 * own, else `fallbackChart` (the listing's chart for the same type, so both
 * sides are graded on one basis). Grades never rest on data-sheet figures
 * [CTP]; the weakest section as % of the nominal Gm is shown beside
 * them for orientation only.
 */
export function gradeAgainstNominal(
  table: ReferenceTable,
  designation: string,
  readings: readonly TubeReading[],
  vacuumLoss = false,
  fallbackChart?: number,
): GradedReading[] {
  const nominal = nominalGmFromReference(table, designation);
  return readings.map((r) => {
    const chart = r.chartNewValue ?? (r.measure === "gm" ? fallbackChart : undefined);
    const failed = Boolean(r.shorts || r.leakage || r.gas || vacuumLoss);
    const ofNominal =
      r.measure === "gm" && nominal && r.sections.length
        ? Math.round((Math.min(...r.sections) / nominal) * 1000) / 10
        : null;
    if (chart === undefined && !failed) {
      return {
        tubeNo: r.tubeNo,
        measure: r.measure,
        sections: r.sections,
        chartNewValue: null,
        grade: "not-graded",
        worstPercentOfNew: null,
        percentOfNominal: ofNominal,
        hardFail: false,
        reasons: ["No tester chart value: not graded (data-sheet figures are not a test limit)"],
      };
    }
    const g = gradeReading({
      measure: r.measure,
      sections: chart === undefined ? [] : r.sections,
      chartNewValue: chart ?? 1,
      shorts: r.shorts,
      leakage: r.leakage,
      gas: r.gas,
      vacuumLoss,
    });
    return {
      tubeNo: r.tubeNo,
      measure: r.measure,
      sections: r.sections,
      chartNewValue: chart ?? null,
      grade: g.grade,
      worstPercentOfNew: g.worstPercentOfNew,
      percentOfNominal: ofNominal,
      hardFail: g.hardFails.length > 0,
      reasons: g.reasons,
    };
  });
}

/** The chart "new" value the listing used for this line, if its readings carry one. */
function listingChart(readings: readonly TubeReading[]): number | undefined {
  return readings.find((r) => r.measure === "gm" && r.chartNewValue !== undefined)?.chartNewValue;
}

function rank(
  features: Record<string, string>,
  sourceCodeMaker: string | null,
  profiles: readonly ReferenceProfile[],
  family: string | undefined,
): SideRanking {
  const { features: typed, ignored } = featuresFromText(features);
  return {
    sourceCodeMaker,
    candidates: rankMakers(typed, profiles, { typeFamily: family }).slice(0, 4),
    ignored: ignored.map(String),
  };
}

/**
 * Weigh one claimed item against the house's reference table. `sourceMakers` are the makers the house's code
 * registry gives for each side's source code (null when absent or unknown). `tolerancePct`: the claim's sale's
 * tester tolerance (points of "% of new"), read by the caller from the sale's frozen settings.
 */
export function weighItem(
  table: ReferenceTable,
  reason: DisputeReason,
  listing: ListingSide,
  report: BuyerReport,
  profiles: readonly ReferenceProfile[],
  sourceMakers: { listing: string | null; buyer: string | null },
  tolerancePct: number = TESTER_VARIATION_PCT,
): ItemWeighing {
  const d = decodeDesignation(table, listing.designation);
  const family = d.ok ? typeFamily(table, d.normalised).key : undefined;
  const listingRanking = rank(listing.features, sourceMakers.listing, profiles, family);
  const buyerRanking = rank(report.features, sourceMakers.buyer, profiles, family);
  const chart = listingChart(listing.readings);
  const listingReadings = gradeAgainstNominal(table, listing.designation, listing.readings, listing.vacuumLoss);
  const buyerReadings = gradeAgainstNominal(
    table,
    listing.designation,
    report.readings,
    Boolean(report.vacuumLoss),
    chart,
  );
  const { verdict, findings } = judge(reason, {
    table,
    listing,
    report,
    d,
    listingRanking,
    buyerRanking,
    listingReadings,
    buyerReadings,
    tolerancePct,
  });
  return {
    position: listing.position,
    verdict,
    findings,
    listing: { ranking: listingRanking, readings: listingReadings },
    buyer: { ranking: buyerRanking, readings: buyerReadings },
  };
}

/** "The evidence supports N of M items (T tubes)." */
export function weighingSummary(items: readonly { verdict: Verdict; tubes: number }[]) {
  const supported = items.filter((i) => i.verdict === "supports");
  const against = items.filter((i) => i.verdict === "does-not-support").length;
  return {
    items: items.length,
    supported: supported.length,
    supportedTubes: supported.reduce((n, i) => n + i.tubes, 0),
    against,
    inconclusive: items.length - supported.length - against,
    words: `The evidence supports the claim on ${supported.length} of ${items.length} item${items.length === 1 ? "" : "s"} (${supported.reduce((n, i) => n + i.tubes, 0)} tubes); ${against} against, ${items.length - supported.length - against} inconclusive.`,
  };
}
