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
import { rankMakers, type MakerCandidate, type ReferenceProfile } from "../valves/attribution";
import { featuresFromText } from "../valves/construction-text";
import { decodeDesignation } from "../valves/designation";
import { findEquivalents } from "../valves/equivalents";
import type { ReferenceTable } from "../valves/reference-table";
import { gradeReading, HOUSE_DEFAULT_THRESHOLDS, type Grade } from "../valves/grading";
import type { DisputeReason } from "./rules";

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

/**
 * Tester-to-tester variation allowed before a lower reading counts against
 * the listing [CTP: roughly ±10–15 %; we take the generous end].
 */
export const TESTER_VARIATION_PCT = 15;

/** The lowest % of new inside each band (house thresholds). */
const BAND_FLOOR: Record<string, number> = {
  strong: HOUSE_DEFAULT_THRESHOLDS.strongMinPct,
  good: HOUSE_DEFAULT_THRESHOLDS.goodMinPct,
  fair: HOUSE_DEFAULT_THRESHOLDS.fairMinPct,
  weak: 0,
};

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

const same = (a: string | null | undefined, b: string | null | undefined) =>
  Boolean(a && b && a.trim().toLowerCase() === b.trim().toLowerCase());

/**
 * Weigh one claimed item against the house's reference table. `sourceMakers` are the makers the house's code
 * registry gives for each side's source code (null when absent or unknown).
 */
export function weighItem(
  table: ReferenceTable,
  reason: DisputeReason,
  listing: ListingSide,
  report: BuyerReport,
  profiles: readonly ReferenceProfile[],
  sourceMakers: { listing: string | null; buyer: string | null },
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
  const findings: string[] = [];
  let verdict: Verdict = "inconclusive";

  if (reason === "maker-misattributed") {
    const claimed = listing.makerName;
    const top = buyerRanking.candidates[0];
    const listedInBuyer = buyerRanking.candidates.find((c) => same(c.makerName, claimed));
    let codeDecided = false;
    if (!claimed) {
      verdict = "does-not-support";
      findings.push("The listing named no maker for this line, so there is no attribution to be wrong.");
    } else if (buyerRanking.sourceCodeMaker && !same(buyerRanking.sourceCodeMaker, claimed)) {
      const backsListing = top && same(top.makerName, claimed) && top.confidence === "high";
      verdict = backsListing ? "inconclusive" : "supports";
      codeDecided = true;
      findings.push(
        `The source code the buyer read (${report.sourceCode ?? "as reported"}) belongs to ${buyerRanking.sourceCodeMaker}, not ${claimed}. A source code is evidence, not proof: it may name the brand owner.`,
      );
      if (backsListing)
        findings.push(
          `But the buyer's own construction ranks ${claimed} first with high confidence: the code may name the brand owner rather than the factory. Weigh the photos.`,
        );
    } else if (buyerRanking.sourceCodeMaker && same(buyerRanking.sourceCodeMaker, claimed)) {
      verdict = "does-not-support";
      findings.push(`The buyer's source code (${report.sourceCode ?? "as reported"}) points to ${claimed}, as listed.`);
    }
    if (!codeDecided && verdict === "inconclusive" && top) {
      if (
        !same(top.makerName, claimed) &&
        top.confidence !== "low" &&
        (!listedInBuyer || listedInBuyer.conflicting.length > 0)
      ) {
        verdict = "supports";
        findings.push(
          `The buyer's construction ranks ${top.makerName} first (${top.confidence} confidence, ${top.matching.length} matching features)${listedInBuyer ? `; ${claimed} conflicts on ${listedInBuyer.conflicting.join(", ")}` : `; ${claimed} does not fit at all`}.`,
        );
      } else if (same(top.makerName, claimed) && top.confidence !== "low") {
        verdict = "does-not-support";
        findings.push(`The buyer's construction ranks ${claimed} first (${top.confidence} confidence), as listed.`);
      } else {
        findings.push(
          `The buyer's construction is not decisive: best fit ${top.makerName} at ${top.confidence} confidence.`,
        );
      }
    } else if (!codeDecided && verdict === "inconclusive") {
      findings.push("The buyer recorded no construction features or codes that the reference profiles can compare.");
    }
    const lt = listingRanking.candidates[0];
    if (lt && claimed && !same(lt.makerName, claimed))
      findings.push(`Even the listing's own construction notes rank ${lt.makerName} above ${claimed}.`);
    if (listing.makerBasis === "unconfirmed")
      findings.push(
        "The listing marked its attribution unconfirmed; dealers were told it was a belief, not a finding.",
      );
  } else if (reason === "undisclosed-vacuum-loss") {
    if (listing.vacuumLoss) {
      verdict = "does-not-support";
      findings.push("The listing disclosed vacuum loss (white getter) on this line.");
    } else if (report.vacuumLoss) {
      verdict = "supports";
      findings.push("The buyer reports a white getter flash that the listing did not disclose; photos should show it.");
    } else {
      verdict = "does-not-support";
      findings.push("The buyer does not report a white getter on this line.");
    }
  } else if (reason === "readings-not-as-listed") {
    // Like with like: same tube, same measure, both graded on a chart value [CTP].
    const listedByTube = new Map(listingReadings.map((r) => [`${r.tubeNo}:${r.measure}`, r]));
    let worse = 0;
    let compared = 0;
    for (const b of buyerReadings) {
      const l = listedByTube.get(`${b.tubeNo}:${b.measure}`);
      if (!l || l.grade === "not-graded" || b.grade === "not-graded") continue;
      compared++;
      if (b.hardFail && !l.hardFail) {
        worse++;
        findings.push(
          `Tube ${b.tubeNo}: listed ${l.grade}, the buyer finds an absolute failure (${b.reasons.join("; ")}).`,
        );
        continue;
      }
      if (l.hardFail || l.grade === "reject") continue; // a failure the listing disclosed is not a claim
      const floor = BAND_FLOOR[l.grade];
      if (
        floor !== undefined &&
        floor > 0 &&
        b.worstPercentOfNew != null &&
        b.worstPercentOfNew < floor - TESTER_VARIATION_PCT
      ) {
        worse++;
        findings.push(
          `Tube ${b.tubeNo}: listed ${l.grade} (${floor} % of new or more); the buyer reads ${b.worstPercentOfNew.toFixed(0)} %, more than ${TESTER_VARIATION_PCT} points below the band.`,
        );
      }
    }
    if (compared === 0)
      findings.push(
        "No tube has readings of the same measure, graded on a chart value, on both sides: nothing to compare like with like.",
      );
    else if (worse > 0) verdict = "supports";
    else {
      verdict = "does-not-support";
      findings.push(
        `${compared} tube reading(s) compared: none falls below its listed band by more than the ${TESTER_VARIATION_PCT} % testers differ by.`,
      );
    }
  } else if (reason === "wrong-type") {
    const seen = report.designationSeen ? decodeDesignation(table, report.designationSeen) : null;
    const seenNorm = seen?.ok ? seen.normalised : report.designationSeen;
    const link =
      seen?.ok && d.ok
        ? findEquivalents(d.normalised).matches.find((m) => m.designation === seenNorm)?.link
        : undefined;
    if (!seenNorm) findings.push("The buyer did not say what type is printed on the tubes.");
    else if (seen && !seen.ok)
      findings.push(
        `"${report.designationSeen}" could not be read as a designation; compare the print with the photos.`,
      );
    else if (!d.ok)
      findings.push(
        `The listed designation "${listing.designation}" could not be read; compare the print with the photos.`,
      );
    else if (seenNorm === d.normalised) {
      verdict = "does-not-support";
      findings.push(`The buyer reads ${seenNorm}, as listed.`);
    } else if (link === "exact") {
      verdict = "does-not-support";
      findings.push(`${seenNorm} is listed as an exact equivalent of ${d.normalised} [MEM].`);
    } else {
      verdict = "supports";
      findings.push(
        `Listed as ${d.normalised}; the buyer reads ${seenNorm}${link ? ` (a ${link.replace(/-/g, " ")} equivalent, not the type listed)` : ""}.`,
      );
    }
  } else if (reason === "short-count") {
    if (report.tubesReceived != null && report.tubesReceived < listing.quantity) {
      verdict = "supports";
      findings.push(
        `Listed ${listing.quantity}, received ${report.tubesReceived}. Check the packing list and the carrier's weight.`,
      );
    } else if (report.tubesReceived != null) {
      verdict = "does-not-support";
      findings.push(`Received ${report.tubesReceived} of ${listing.quantity}.`);
    } else findings.push("The buyer did not say how many tubes arrived.");
  } else {
    findings.push("Judge this from the photos and the carrier's record: the engine has nothing to compute here.");
  }
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
