// One judge per claim reason: each reads both sides of an item and says whether the evidence supports the claim,
// with findings in words. Sources: [CTP] tester practice (bands, ±10–15 % tester variation, white getter = air leak);
// [EIA-476] a source code may name the brand owner; [SUG] our own rules where marked.
import { decodeDesignation } from "../valves/designation";
import type { DecodeResult } from "../valves/designation/types";
import { findEquivalents } from "../valves/equivalents";
import { HOUSE_DEFAULT_THRESHOLDS } from "../valves/grading";
import type { ReferenceTable } from "../valves/reference-table";
import type { DisputeReason } from "./rules";
import type { BuyerReport, GradedReading, ListingSide, SideRanking, Verdict } from "./weigh-types";

/**
 * Tester-to-tester variation allowed before a lower reading counts against
 * the listing [CTP: roughly ±10–15 %; we take the generous end]. Only the fallback: a claim is weighed with its
 * sale's frozen `claims.testerTolerancePct`, passed in as `Evidence.tolerancePct`.
 */
export const TESTER_VARIATION_PCT = 15;

/** The lowest % of new inside each band (house thresholds). */
export const BAND_FLOOR: Record<string, number> = {
  strong: HOUSE_DEFAULT_THRESHOLDS.strongMinPct,
  good: HOUSE_DEFAULT_THRESHOLDS.goodMinPct,
  fair: HOUSE_DEFAULT_THRESHOLDS.fairMinPct,
  weak: 0,
};

export const same = (a: string | null | undefined, b: string | null | undefined) =>
  Boolean(a && b && a.trim().toLowerCase() === b.trim().toLowerCase());

/** Everything a judge may read about one item. */
export interface Evidence {
  table: ReferenceTable;
  listing: ListingSide;
  report: BuyerReport;
  /** The listed designation, decoded. */
  d: DecodeResult;
  listingRanking: SideRanking;
  buyerRanking: SideRanking;
  listingReadings: GradedReading[];
  buyerReadings: GradedReading[];
  /** Points of "% of new" testers may differ by (the claim's sale's settings). */
  tolerancePct: number;
}

/** A judge's answer. */
export interface Judgement {
  verdict: Verdict;
  findings: string[];
}

/** The listing credited the tubes to the wrong original maker [SUG, CTP-informed; EIA-476]. */
function makerMisattributed({ listing, report, listingRanking, buyerRanking }: Evidence): Judgement {
  const findings: string[] = [];
  let verdict: Verdict = "inconclusive";
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
    findings.push("The listing marked its attribution unconfirmed; dealers were told it was a belief, not a finding.");
  return { verdict, findings };
}

/** A white getter flash the listing did not disclose [CTP]. */
function undisclosedVacuumLoss({ listing, report }: Evidence): Judgement {
  const findings: string[] = [];
  let verdict: Verdict = "inconclusive";
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
  return { verdict, findings };
}

/** Readings below the listed band by more than testers differ [CTP]. */
function readingsNotAsListed({ listingReadings, buyerReadings, tolerancePct }: Evidence): Judgement {
  const findings: string[] = [];
  let verdict: Verdict = "inconclusive";
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
    if (floor !== undefined && floor > 0 && b.worstPercentOfNew != null && b.worstPercentOfNew < floor - tolerancePct) {
      worse++;
      findings.push(
        `Tube ${b.tubeNo}: listed ${l.grade} (${floor} % of new or more); the buyer reads ${b.worstPercentOfNew.toFixed(0)} %, more than ${tolerancePct} points below the band.`,
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
      `${compared} tube reading(s) compared: none falls below its listed band by more than the ${tolerancePct} % testers differ by.`,
    );
  }
  return { verdict, findings };
}

/** A different type from the one listed; exact equivalents are not a wrong type [MEM]. */
function wrongType({ table, listing, report, d }: Evidence): Judgement {
  const findings: string[] = [];
  let verdict: Verdict = "inconclusive";
  const seen = report.designationSeen ? decodeDesignation(table, report.designationSeen) : null;
  const seenNorm = seen?.ok ? seen.normalised : report.designationSeen;
  const link =
    seen?.ok && d.ok ? findEquivalents(d.normalised).matches.find((m) => m.designation === seenNorm)?.link : undefined;
  if (!seenNorm) findings.push("The buyer did not say what type is printed on the tubes.");
  else if (seen && !seen.ok)
    findings.push(`"${report.designationSeen}" could not be read as a designation; compare the print with the photos.`);
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
  return { verdict, findings };
}

/** Fewer tubes arrived than were listed. */
function shortCount({ listing, report }: Evidence): Judgement {
  const findings: string[] = [];
  let verdict: Verdict = "inconclusive";
  if (report.tubesReceived != null && report.tubesReceived < listing.quantity) {
    verdict = "supports";
    findings.push(
      `Listed ${listing.quantity}, received ${report.tubesReceived}. Check the packing list and the carrier's weight.`,
    );
  } else if (report.tubesReceived != null) {
    verdict = "does-not-support";
    findings.push(`Received ${report.tubesReceived} of ${listing.quantity}.`);
  } else findings.push("The buyer did not say how many tubes arrived.");
  return { verdict, findings };
}

/** Reasons the engine cannot compute (e.g. transit damage): judged from photos and the carrier's record. */
function fromPhotosOnly(): Judgement {
  return {
    verdict: "inconclusive",
    findings: ["Judge this from the photos and the carrier's record: the engine has nothing to compute here."],
  };
}

const JUDGES: Partial<Record<DisputeReason, (e: Evidence) => Judgement>> = {
  "maker-misattributed": makerMisattributed,
  "undisclosed-vacuum-loss": undisclosedVacuumLoss,
  "readings-not-as-listed": readingsNotAsListed,
  "wrong-type": wrongType,
  "short-count": shortCount,
};

/** The judge for a claim reason. */
export function judge(reason: DisputeReason, evidence: Evidence): Judgement {
  return (JUDGES[reason] ?? fromPhotosOnly)(evidence);
}
