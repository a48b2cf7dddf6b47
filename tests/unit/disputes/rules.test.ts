// Check values: [SUG] house dispute settings (lib/disputes/rules.ts DISPUTE_SETTINGS);
// [CTP] label ≠ maker; [SUG, CTP-informed] misattribution disputes,
// (step 3: the seller accepts or contests "within ~3 business days");
// [SUG] inspection period;
// [CTP/SUG] breakage claims within 48 h of delivery, with packaging photos,.
// All names below are invented demo names (scenario.md).
import { describe, expect, it } from "vitest";
import { inspectionWindowEnd } from "@/lib/money/inspection";
import {
  answerDueAt,
  DISPUTE_SETTINGS,
  misattributionRefusal,
  needsExtraReview,
  openingRefusal,
  trackRecord,
  type ClaimableInvoice,
  type ListedAttribution,
} from "@/lib/disputes/rules";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
// Invented delivery: the Voss estate box of 120 valves, delivered 3 March 2025, 15:00 UTC.
const DELIVERED = Date.UTC(2025, 2, 3, 15, 0, 0);
// 7 days + 1 per full 25 tubes = 11 days for 120 tubes [SUG] "Inspection and escrow".
const WINDOW_END = inspectionWindowEnd(DELIVERED, 120);

const delivered: ClaimableInvoice = { state: "delivered", deliveredAtMs: DELIVERED, inspectionEndsAtMs: WINDOW_END };

describe("openingRefusal: claims only on a delivered lot, inside its inspection window [SUG]", () => {
  it("the window used here is 11 days for 120 tubes [SUG]", () => {
    expect(WINDOW_END).toBe(DELIVERED + 11 * DAY);
  });

  it("delivered and inside the window → no refusal", () => {
    expect(openingRefusal(delivered, DELIVERED + HOUR)).toBeNull();
    expect(openingRefusal(delivered, WINDOW_END - 1)).toBeNull(); // last millisecond of the window
  });

  it("at or after the window's end → refused, naming the closing date in UTC", () => {
    // 3 March 15:00 UTC + 11 days = 14 March 2025, 15:00 UTC [SUG]
    const atEnd = openingRefusal(delivered, WINDOW_END);
    expect(atEnd).toContain("2025-03-14 15:00 UTC");
    expect(atEnd).toMatch(/inspection window closed/i);
    expect(openingRefusal(delivered, WINDOW_END + 3 * DAY)).toContain("2025-03-14 15:00 UTC");
  });

  it("not yet delivered → refused: a claim waits for delivery", () => {
    const inTransit: ClaimableInvoice = { state: "shipped", deliveredAtMs: null, inspectionEndsAtMs: null };
    const reason = openingRefusal(inTransit, DELIVERED);
    expect(reason).not.toBeNull();
    expect(reason).toMatch(/once the lot is delivered/i);
    // A "delivered" state without its dates cannot be judged either.
    expect(openingRefusal({ state: "delivered", deliveredAtMs: null, inspectionEndsAtMs: null }, DELIVERED)).toMatch(
      /once the lot is delivered/i,
    );
  });

  it("payment released → refused: the window is over", () => {
    const released: ClaimableInvoice = { ...delivered, state: "released" };
    const reason = openingRefusal(released, DELIVERED + HOUR); // even inside the dates
    expect(reason).toMatch(/released to the consignor/i);
    expect(reason).toMatch(/can no longer be opened/i);
  });

  it("a claim already open → refused, not opened twice", () => {
    expect(openingRefusal({ ...delivered, state: "disputed" }, DELIVERED + HOUR)).toBe(
      "A claim is already open on this lot.",
    );
  });

  it("refunded or cancelled → refused: the invoice is closed", () => {
    expect(openingRefusal({ ...delivered, state: "refunded" }, DELIVERED + HOUR)).toBe("This invoice is closed.");
    expect(openingRefusal({ ...delivered, state: "cancelled" }, DELIVERED + HOUR)).toBe("This invoice is closed.");
  });
});

describe('openingRefusal: breakage in transit only within 48 h of delivery [CTP/SUG] "Inspection and escrow"', () => {
  it("the house allows 48 hours [CTP/SUG]", () => {
    expect(DISPUTE_SETTINGS.breakageClaimHours).toBe(48);
  });

  it("transit damage up to exactly 48 h after delivery → no refusal", () => {
    expect(openingRefusal(delivered, DELIVERED + HOUR, "transit-damage")).toBeNull();
    expect(openingRefusal(delivered, DELIVERED + 48 * HOUR, "transit-damage")).toBeNull(); // 5 March 15:00 UTC, still in time
  });

  it("transit damage later than 48 h → refused, naming the 48 hours, the packaging photos and the delivery time in UTC", () => {
    const late = openingRefusal(delivered, DELIVERED + 48 * HOUR + 1, "transit-damage");
    expect(late).not.toBeNull();
    expect(late).toContain("within 48 hours of delivery");
    expect(late).toMatch(/photos of the packaging/);
    expect(late).toContain("delivered on 2025-03-03 15:00 UTC"); // the invented delivery above
    expect(openingRefusal(delivered, DELIVERED + 5 * DAY, "transit-damage")).toContain("2025-03-03 15:00 UTC");
  });

  it("other reasons keep the whole inspection window [SUG]", () => {
    const threeDaysOn = DELIVERED + 3 * DAY;
    expect(openingRefusal(delivered, threeDaysOn, "maker-misattributed")).toBeNull();
    expect(openingRefusal(delivered, threeDaysOn, "readings-not-as-listed")).toBeNull();
    expect(openingRefusal(delivered, threeDaysOn, "short-count")).toBeNull();
    expect(openingRefusal(delivered, threeDaysOn)).toBeNull(); // no reason given yet
    expect(openingRefusal(delivered, WINDOW_END - 1, "wrong-type")).toBeNull();
  });

  it("after the inspection window, a late breakage claim is told about the 48 hours", () => {
    expect(openingRefusal(delivered, WINDOW_END + DAY, "transit-damage")).toMatch(/within 48 hours of delivery/);
    expect(openingRefusal(delivered, WINDOW_END + DAY, "other")).toMatch(/inspection window closed/);
  });

  it("the invoice state still comes first: no breakage claim on an undelivered or already disputed lot", () => {
    const inTransit: ClaimableInvoice = { state: "shipped", deliveredAtMs: null, inspectionEndsAtMs: null };
    expect(openingRefusal(inTransit, DELIVERED + HOUR, "transit-damage")).toMatch(/once the lot is delivered/);
    expect(openingRefusal({ ...delivered, state: "disputed" }, DELIVERED + 72 * HOUR, "transit-damage")).toBe(
      "A claim is already open on this lot.",
    );
  });
});

describe("misattributionRefusal: a label is not a maker claim [CTP]; rebranding alone is not misdescription [SUG, CTP-informed]", () => {
  const labelOnly: ListedAttribution = {
    position: 4,
    designation: "12AX7",
    labelBrand: "Carrow Instruments", // invented label brand (scenario.md)
    makerName: null,
    makerBasis: "unconfirmed",
  };

  it("a line sold by its label alone, no maker named → refused, naming the label and the line", () => {
    const reason = misattributionRefusal(labelOnly);
    expect(reason).not.toBeNull();
    expect(reason).toContain('"Carrow Instruments"');
    expect(reason).toContain("Line 4 (12AX7)");
    expect(reason).toMatch(/label is not a maker claim/);
    expect(reason).toMatch(/rebranding by itself is not misdescription/);
  });

  it("no label and no maker → still refused, without an empty quoted label", () => {
    const reason = misattributionRefusal({ ...labelOnly, labelBrand: "" });
    expect(reason).toMatch(/listed by its label alone/);
    expect(reason).not.toContain('""');
  });

  it("a named maker may be claimed against, whatever the label [SUG]", () => {
    expect(
      misattributionRefusal({ ...labelOnly, makerName: "Kestrel Valve Company", makerBasis: "construction-matched" }),
    ).toBeNull();
    expect(
      misattributionRefusal({
        ...labelOnly,
        labelBrand: "",
        makerName: "Vireo Lamp & Valve",
        makerBasis: "source-code-confirmed",
      }),
    ).toBeNull();
  });
});

describe('answerDueAt: the consignor answers within 3 business days [SUG, CTP-informed] "~3 business days"', () => {
  // 7 March 2025 was a Friday.
  const friday = Date.UTC(2025, 2, 7, 9, 30, 0);

  it("the house gives 3 business days [CTP/SUG]; the old calendar-day setting is gone", () => {
    expect(DISPUTE_SETTINGS.answerBusinessDays).toBe(3); // [SUG, CTP-informed]
    expect("answerDays" in DISPUTE_SETTINGS).toBe(false);
  });

  it("opened on a Friday → due the next Wednesday at the same time (Saturday and Sunday skipped) [SUG]", () => {
    expect(answerDueAt(friday)).toBe(Date.UTC(2025, 2, 12, 9, 30, 0)); // Mon 10, Tue 11, Wed 12
    expect(new Date(answerDueAt(friday)).getUTCDay()).toBe(3); // Wednesday
  });

  it("opened early in the week → three weekdays later, no weekend in between [SUG]", () => {
    expect(answerDueAt(Date.UTC(2025, 2, 3, 15, 0, 0))).toBe(Date.UTC(2025, 2, 6, 15, 0, 0)); // Mon 3 → Thu 6
    expect(answerDueAt(Date.UTC(2025, 2, 5, 8, 0, 0))).toBe(Date.UTC(2025, 2, 10, 8, 0, 0)); // Wed 5 → Mon 10 (Thu, Fri, Mon)
  });

  it("opened on a Saturday or a Sunday → due Wednesday: the weekend days count for nothing [SUG]", () => {
    expect(answerDueAt(Date.UTC(2025, 2, 8, 11, 0, 0))).toBe(Date.UTC(2025, 2, 12, 11, 0, 0)); // Sat 8 → Wed 12
    expect(answerDueAt(Date.UTC(2025, 2, 9, 23, 0, 0))).toBe(Date.UTC(2025, 2, 12, 23, 0, 0)); // Sun 9 → Wed 12
  });

  it("weekdays are UTC days: 23:30 UTC on a Friday is still a Friday [SUG]", () => {
    const lateFriday = Date.UTC(2025, 2, 7, 23, 30, 0);
    expect(answerDueAt(lateFriday)).toBe(Date.UTC(2025, 2, 12, 23, 30, 0));
  });

  it("takes another number of business days when given [SUG]", () => {
    expect(answerDueAt(friday, 1)).toBe(Date.UTC(2025, 2, 10, 9, 30, 0)); // Friday + 1 business day = Monday
    expect(answerDueAt(friday, 5)).toBe(Date.UTC(2025, 2, 14, 9, 30, 0)); // a full working week: next Friday
    expect(answerDueAt(friday, 10)).toBe(Date.UTC(2025, 2, 21, 9, 30, 0)); // two weekends skipped
    expect(answerDueAt(friday, 0)).toBe(friday);
  });
});

describe("trackRecord: each consignor's attribution record [SUG] 'repeat offenders tracked'", () => {
  it("upheld per 1,000 sold = round(upheld × 1,000 ÷ sold) [SUG]", () => {
    const r = trackRecord({ tubesSold: 1_250, tubesDisputed: 40, tubesUpheld: 8, upheldMisattributionClaims: 1 });
    expect(r.upheldPerThousand).toBe(6); // 8 × 1,000 / 1,250 = 6.4 → 6
    expect(
      trackRecord({ tubesSold: 3, tubesDisputed: 1, tubesUpheld: 1, upheldMisattributionClaims: 1 }).upheldPerThousand,
    ).toBe(333); // 333.3 → 333
    expect(
      trackRecord({ tubesSold: 400, tubesDisputed: 1, tubesUpheld: 1, upheldMisattributionClaims: 1 })
        .upheldPerThousand,
    ).toBe(3); // 2.5 rounds up → 3
    expect(
      trackRecord({ tubesSold: 120, tubesDisputed: 0, tubesUpheld: 0, upheldMisattributionClaims: 0 })
        .upheldPerThousand,
    ).toBe(0);
  });

  it("keeps the counts it was given", () => {
    const counts = { tubesSold: 1_250, tubesDisputed: 40, tubesUpheld: 8, upheldMisattributionClaims: 1 };
    expect(trackRecord(counts)).toMatchObject(counts);
  });

  it("words: sold with disputes, sold without, and nothing sold", () => {
    expect(
      trackRecord({ tubesSold: 1_250, tubesDisputed: 40, tubesUpheld: 8, upheldMisattributionClaims: 1 }).words,
    ).toBe("1,250 tubes sold; 40 disputed, 8 of them upheld against the listing.");
    expect(trackRecord({ tubesSold: 120, tubesDisputed: 0, tubesUpheld: 0, upheldMisattributionClaims: 0 }).words).toBe(
      "120 tubes sold; none disputed.",
    );
    const none = trackRecord({ tubesSold: 0, tubesDisputed: 0, tubesUpheld: 0, upheldMisattributionClaims: 0 });
    expect(none.words).toBe("No tubes sold here yet: no record.");
    expect(none.upheldPerThousand).toBeNull(); // no division by zero
  });

  it("words: every count with thousands separators", () => {
    expect(
      trackRecord({ tubesSold: 12_480, tubesDisputed: 1_040, tubesUpheld: 1_001, upheldMisattributionClaims: 3 }).words,
    ).toBe("12,480 tubes sold; 1,040 disputed, 1,001 of them upheld against the listing.");
    expect(
      trackRecord({ tubesSold: 2_400, tubesDisputed: 0, tubesUpheld: 0, upheldMisattributionClaims: 0 }).words,
    ).toBe("2,400 tubes sold; none disputed.");
    expect(trackRecord({ tubesSold: 999, tubesDisputed: 0, tubesUpheld: 0, upheldMisattributionClaims: 0 }).words).toBe(
      "999 tubes sold; none disputed.",
    ); // no separator below 1,000
  });
});

describe("needsExtraReview: extra review from 2 upheld misattribution claims [SUG] house setting", () => {
  it("the house threshold is 2 [SUG]", () => {
    expect(DISPUTE_SETTINGS.extraReviewAfterUpheld).toBe(2);
  });

  it.each([
    [0, false],
    [1, false],
    [2, true],
    [5, true],
  ])("%d upheld claims → %s", (upheld, review) => {
    expect(needsExtraReview(upheld)).toBe(review);
  });

  it("takes another threshold when given [SUG]", () => {
    expect(needsExtraReview(2, 3)).toBe(false);
    expect(needsExtraReview(3, 3)).toBe(true);
  });
});
