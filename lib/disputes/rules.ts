/**
 * The rules of a buyer's claim on a delivered lot, as pure functions: when a
 * claim may be opened, which items a misattribution claim may name, the
 * house's deadlines, and each consignor's attribution record. House figures
 * are marked [SUG]; trade practice is marked [CTP].
 */

/** Why the buyer says the lot is not as listed. */
export const DISPUTE_REASONS = [
  "maker-misattributed",
  "undisclosed-vacuum-loss",
  "readings-not-as-listed",
  "wrong-type",
  "short-count",
  "transit-damage",
  "other",
] as const;
export type DisputeReason = (typeof DISPUTE_REASONS)[number];

export const REASON_WORDS: Record<DisputeReason, string> = {
  "maker-misattributed": "Maker misattributed",
  "undisclosed-vacuum-loss": "Vacuum loss not disclosed",
  "readings-not-as-listed": "Readings not as listed",
  "wrong-type": "Wrong type",
  "short-count": "Short count",
  "transit-damage": "Damaged in transit",
  other: "Other",
};

/** What the buyer asks for. */
export const REMEDIES = ["refund-affected-items", "return-whole-lot", "other"] as const;
export type Remedy = (typeof REMEDIES)[number];

export const REMEDY_WORDS: Record<Remedy, string> = {
  "refund-affected-items": "Refund for the affected items",
  "return-whole-lot": "Return the whole lot for a refund",
  other: "Something else (explained in the statement)",
};

/** How a mediator closes a case. */
export const OUTCOMES = ["dismissed", "partial-refund", "refund-on-return"] as const;
export type Outcome = (typeof OUTCOMES)[number];

export const OUTCOME_WORDS: Record<Outcome, string> = {
  dismissed: "Claim dismissed: payment released to the consignor",
  "partial-refund": "Partial refund for the affected items",
  "refund-on-return": "Full refund once the lot is returned",
};

/** Where a case stands (our own names). */
export type DisputeState = "awaiting-answer" | "answered" | "with-mediator" | "settling" | "awaiting-return" | "closed";

export const STATE_WORDS: Record<DisputeState, string> = {
  "awaiting-answer": "Waiting for the consignor's answer",
  answered: "Answered: waiting for a mediator",
  "with-mediator": "With a mediator",
  settling: "Decided: money being moved",
  "awaiting-return": "Decided: waiting for the return",
  closed: "Closed",
};

/** The consignor's answer to the claim. */
export const STANCES = ["accepts", "contests", "accepts-in-part"] as const;
export type Stance = (typeof STANCES)[number];

export const STANCE_WORDS: Record<Stance, string> = {
  accepts: "Accepts the claim",
  contests: "Contests the claim",
  "accepts-in-part": "Accepts part of the claim",
};

/** The house's dispute settings [SUG: our own figures]. */
export const DISPUTE_SETTINGS = Object.freeze({
  /** Business days the consignor has to accept or contest a claim [CTP/SUG]. */
  answerBusinessDays: 3,
  /** Hours after delivery within which a breakage claim must be opened [CTP: 48 h, with packaging photos]. */
  breakageClaimHours: 48,
  /** Days the buyer has to ship a lot back after a refund-on-return decision. */
  returnShipDays: 14,
  /** Days after the return ships within which the consignor confirms receipt; after that the refund is paid anyway. */
  receiptConfirmDays: 10,
  /** Upheld misattribution claims after which a consignor's next lots go to extra review. */
  extraReviewAfterUpheld: 2,
});

const DAY_MS = 86_400_000;

/**
 * When the consignor's answer is due for a claim opened at `openedAtMs`: the
 * same time of day `days` business days later, skipping Saturdays and Sundays
 * (UTC; public holidays are not known to us).
 */
export function answerDueAt(openedAtMs: number, days: number = DISPUTE_SETTINGS.answerBusinessDays): number {
  let t = openedAtMs;
  let left = days;
  while (left > 0) {
    t += DAY_MS;
    const wd = new Date(t).getUTCDay();
    if (wd !== 0 && wd !== 6) left--;
  }
  return t;
}

/** The invoice facts that decide whether a claim may be opened. */
export interface ClaimableInvoice {
  state: string;
  deliveredAtMs: number | null;
  inspectionEndsAtMs: number | null;
}

/**
 * Why a claim cannot be opened now, or null when it can: only on a
 * delivered lot, and only before its inspection window ends; breakage in
 * transit only within 48 hours of delivery [CTP] (the sale's frozen settings may say otherwise).
 */
export function openingRefusal(
  inv: ClaimableInvoice,
  nowMs: number,
  reason?: DisputeReason,
  breakageClaimHours: number = DISPUTE_SETTINGS.breakageClaimHours,
): string | null {
  if (inv.state === "disputed") return "A claim is already open on this lot.";
  if (inv.state === "released")
    return "The payment has been released to the consignor: the inspection window is over, so a claim can no longer be opened.";
  if (inv.state === "refunded" || inv.state === "cancelled") return "This invoice is closed.";
  if (inv.state !== "delivered" || inv.deliveredAtMs == null || inv.inspectionEndsAtMs == null) {
    return "A claim can be opened once the lot is delivered, during its inspection window.";
  }
  if (reason === "transit-damage" && nowMs > inv.deliveredAtMs + breakageClaimHours * 3_600_000) {
    return `Breakage in transit must be claimed within ${breakageClaimHours} hours of delivery, with photos of the packaging; this lot was delivered on ${new Date(inv.deliveredAtMs).toISOString().slice(0, 16).replace("T", " ")} UTC.`;
  }
  if (nowMs >= inv.inspectionEndsAtMs) {
    return `The inspection window closed on ${new Date(inv.inspectionEndsAtMs).toISOString().slice(0, 16).replace("T", " ")} UTC; claims must be opened before it ends.`;
  }
  return null;
}

/** What a listing said about who made an item. */
export interface ListedAttribution {
  position: number;
  designation: string;
  labelBrand: string;
  makerName: string | null;
  makerBasis: string;
}

/**
 * Why a misattribution claim cannot name this item, or null when it can.
 * A tube sold by its label alone carries no maker claim, and rebranding by
 * itself is not misdescription [CTP: label ≠ maker; rebranding was normal
 * trade practice]: the claim stands only against a maker the listing named.
 */
export function misattributionRefusal(item: ListedAttribution): string | null {
  if (!item.makerName) {
    return `Line ${item.position} (${item.designation}) was listed by its label${item.labelBrand ? ` "${item.labelBrand}"` : ""} alone, with no maker named: a label is not a maker claim, and rebranding by itself is not misdescription.`;
  }
  return null;
}

/** One consignor's attribution record, in tubes. */
export interface TrackRecord {
  tubesSold: number;
  tubesDisputed: number;
  tubesUpheld: number;
  upheldMisattributionClaims: number;
  /** Upheld tubes per 1,000 sold (null before any sale). */
  upheldPerThousand: number | null;
  /** Plain words for dealers. */
  words: string;
}

const n = (x: number) => x.toLocaleString("en-US");

/** A consignor's record from their counts. */
export function trackRecord(c: {
  tubesSold: number;
  tubesDisputed: number;
  tubesUpheld: number;
  upheldMisattributionClaims: number;
}): TrackRecord {
  const per = c.tubesSold > 0 ? Math.round((c.tubesUpheld * 1000) / c.tubesSold) : null;
  const words =
    c.tubesSold === 0
      ? "No tubes sold here yet: no record."
      : c.tubesDisputed === 0
        ? `${n(c.tubesSold)} tubes sold; none disputed.`
        : `${n(c.tubesSold)} tubes sold; ${n(c.tubesDisputed)} disputed, ${n(c.tubesUpheld)} of them upheld against the listing.`;
  return { ...c, upheldPerThousand: per, words };
}

/** True when a consignor's next lots should go to extra review. */
export function needsExtraReview(
  upheldMisattributionClaims: number,
  threshold: number = DISPUTE_SETTINGS.extraReviewAfterUpheld,
): boolean {
  return upheldMisattributionClaims >= threshold;
}
