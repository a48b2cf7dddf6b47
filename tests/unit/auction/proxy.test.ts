// Check values: [CTP] common trade practice — proxy rules; worked example:.
import { describe, expect, it } from "vitest";
import { DEFAULT_INCREMENT_LADDER, flatLadder } from "@/lib/auction/increments";
import { closeOutcome } from "@/lib/auction/lot-phase";
import {
  initialProxyState,
  minimumBidFor,
  placeBid,
  replayBids,
  validateLotTerms,
  type BidDecision,
  type LotTerms,
  type MaxBid,
  type ProxyState,
} from "@/lib/auction/proxy";

const T0 = Date.UTC(2025, 3, 12, 18, 0, 0);
const OPEN = { phase: "open" as const };
const A = "quill-cathode"; // demo dealers (scenario.md)
const B = "bellweather-audio";
const C = "northbank-valve";

// uses a flat $10 increment
const FLAT10: LotTerms = {
  openingCents: 1_000,
  reserveCents: null,
  ladder: flatLadder(1_000),
  consignorId: "voss-estate",
};

let seq = 0;
const bid = (bidderId: string, maxCents: number): MaxBid => ({
  bidderId,
  maxCents,
  placedAtMs: T0 + seq * 1_000,
  seq: ++seq,
});

/** Places bids in order, expecting each to be accepted; returns the final state. */
function run(terms: LotTerms, ...bids: [string, number][]): ProxyState {
  return bids.reduce(
    (state, [who, max]) => accepted(placeBid(state, bid(who, max), OPEN)).state,
    initialProxyState(terms),
  );
}

function accepted(decision: BidDecision): Extract<BidDecision, { accepted: true }> {
  if (!decision.accepted) throw new Error(`refused: ${decision.reason}`);
  return decision;
}

function refusal(decision: BidDecision): string {
  return decision.accepted ? "accepted" : decision.reason;
}

describe("proxy bidding check values [CTP]", () => {
  it("increment 10, A max 150, B max 130 → A leads at 140", () => {
    const s = run(FLAT10, [A, 15_000], [B, 13_000]);
    expect(s.leader?.bidderId).toBe(A);
    expect(s.priceCents).toBe(14_000);
  });

  it("equal maxima 150 → the earlier bidder leads at 150", () => {
    const s = run(FLAT10, [A, 15_000], [B, 15_000]);
    expect(s.leader?.bidderId).toBe(A);
    expect(s.priceCents).toBe(15_000);
    const reversed = run(FLAT10, [B, 15_000], [A, 15_000]);
    expect(reversed.leader?.bidderId).toBe(B);
  });
});

describe("proxy rules [CTP]", () => {
  it("a single bidder pays the opening price", () => {
    const s = run(FLAT10, [A, 50_000]);
    expect(s.priceCents).toBe(1_000);
    expect(s.reserveMet).toBe(true); // no reserve
    expect(closeOutcome(s)).toEqual({ phase: "sold", buyerId: A, hammerCents: 1_000 });
  });

  it("a higher maximum takes the lead at the old maximum + one increment", () => {
    const first = initialProxyState(FLAT10);
    const one = accepted(placeBid(first, bid(A, 15_000), OPEN));
    expect(one.outcome).toBe("first-bid");
    const two = accepted(placeBid(one.state, bid(B, 20_000), OPEN));
    expect(two.outcome).toBe("new-leader");
    expect(two.state.leader?.bidderId).toBe(B);
    expect(two.state.priceCents).toBe(16_000);
    expect(two.minimumCents).toBe(17_000);
  });

  it("a challenger just above the leader pays only their own maximum", () => {
    const s = run(FLAT10, [A, 15_000], [B, 15_500]);
    expect(s.leader?.bidderId).toBe(B);
    expect(s.priceCents).toBe(15_500); // min(155, 150 + 10)
  });

  it("a lower challenger is outbid by proxy and raises the price", () => {
    const s0 = run(FLAT10, [A, 15_000]);
    const d = accepted(placeBid(s0, bid(C, 12_000), OPEN));
    expect(d.outcome).toBe("outbid-by-proxy");
    expect(d.state.leader?.bidderId).toBe(A);
    expect(d.state.priceCents).toBe(13_000);
  });

  it("the leader raising their maximum does not raise the price", () => {
    const s0 = run(FLAT10, [A, 15_000], [B, 13_000]);
    const d = accepted(placeBid(s0, bid(A, 30_000), OPEN));
    expect(d.outcome).toBe("max-raised");
    expect(d.state.priceCents).toBe(14_000);
    expect(d.state.leader?.maxCents).toBe(30_000);
    // even when the price sits at the old maximum (A 145, B 140 → 145), a raise leaves it there
    const s1 = run(FLAT10, [A, 14_500], [B, 14_000]);
    expect(s1.priceCents).toBe(14_500);
    expect(accepted(placeBid(s1, bid(A, 30_000), OPEN)).state.priceCents).toBe(14_500);
  });

  it("equal maxima after a raise go to the raise, being earlier", () => {
    const s = run(FLAT10, [A, 15_000], [B, 13_000], [A, 20_000], [C, 20_000]);
    expect(s.leader?.bidderId).toBe(A);
    expect(s.priceCents).toBe(20_000);
  });
});

describe("ladder boundaries in proxy prices (default ladder)", () => {
  const terms: LotTerms = {
    openingCents: 100,
    reserveCents: null,
    ladder: DEFAULT_INCREMENT_LADDER,
    consignorId: "voss-estate",
  };
  it("second maximum $19.99 adds $1; $20.00 adds $2", () => {
    expect(run(terms, [A, 5_000], [B, 1_999]).priceCents).toBe(2_099);
    expect(run(terms, [A, 5_000], [B, 2_000]).priceCents).toBe(2_200);
  });
});

describe("reserve [CTP]", () => {
  const terms: LotTerms = {
    openingCents: 5_000,
    reserveCents: 20_000,
    ladder: DEFAULT_INCREMENT_LADDER,
    consignorId: "voss-estate",
  };

  it("a lone maximum at or above the reserve pays the reserve", () => {
    const s = run(terms, [A, 30_000]);
    expect(s.priceCents).toBe(20_000);
    expect(s.reserveMet).toBe(true);
    // once the price is at the reserve, the next minimum is 200 + 10 = $210 ($10 steps from $100)
    expect(refusal(placeBid(s, bid(B, 20_999), OPEN))).toBe("below-minimum");
    expect(run(terms, [A, 30_000], [B, 22_000]).priceCents).toBe(23_000); // 220 + 10
    expect(run(terms, [A, 30_000], [B, 25_000]).priceCents).toBe(27_500); // 250 + 25 at the $250 level
  });

  it("below the reserve the price follows the bids and the lot closes unsold", () => {
    const s = run(terms, [A, 15_000], [B, 9_000]);
    expect(s.priceCents).toBe(9_500); // 90 + 5
    expect(s.reserveMet).toBe(false);
    expect(closeOutcome(s)).toEqual({ phase: "unsold", reason: "reserve-not-met", highBidCents: 9_500 });
  });

  it("a leader's raise that reaches the reserve lifts the price to it; one that does not, does nothing", () => {
    const s0 = run(terms, [A, 15_000]);
    expect(s0.priceCents).toBe(5_000);
    const short = accepted(placeBid(s0, bid(A, 18_000), OPEN)).state;
    expect(short.priceCents).toBe(5_000);
    expect(short.reserveMet).toBe(false);
    const met = accepted(placeBid(short, bid(A, 25_000), OPEN)).state;
    expect(met.priceCents).toBe(20_000);
    expect(met.reserveMet).toBe(true);
  });

  it("a challenger that meets the reserve leads at the reserve", () => {
    const s = run(terms, [A, 15_000], [B, 22_000]);
    expect(s.leader?.bidderId).toBe(B);
    expect(s.priceCents).toBe(20_000); // min(220, 150 + 10) = 160 → raised to the reserve
  });

  it("terms are checked", () => {
    expect(validateLotTerms({ ...terms, reserveCents: 4_000 })).toHaveLength(1);
    expect(validateLotTerms({ ...terms, openingCents: 0 }).length).toBeGreaterThan(0);
    expect(() => initialProxyState({ ...terms, ladder: [] })).toThrow(/invalid lot terms/);
  });
});

describe("refusals", () => {
  const s0 = run(FLAT10, [A, 15_000], [B, 13_000]); // price 140, minimum 150

  it.each([
    ["lot not open", () => placeBid(s0, bid(C, 50_000), { phase: "scheduled" }), "lot-not-open"],
    ["lot sold", () => placeBid(s0, bid(C, 50_000), { phase: "sold" }), "lot-not-open"],
    [
      "after close",
      () =>
        placeBid(
          s0,
          { ...bid(C, 50_000), placedAtMs: T0 + 10_000_000 },
          { phase: "extended", closesAtMs: T0 + 10_000_000 },
        ),
      "after-close",
    ],
    ["own lot", () => placeBid(s0, bid("voss-estate", 50_000), OPEN), "own-lot"],
    ["fractional cents", () => placeBid(s0, bid(C, 15_000.5), OPEN), "invalid-amount"],
    ["zero", () => placeBid(s0, bid(C, 0), OPEN), "invalid-amount"],
    ["below minimum", () => placeBid(s0, bid(C, 14_999), OPEN), "below-minimum"],
    ["leader lowering", () => placeBid(s0, bid(A, 14_000), OPEN), "max-not-raised"],
    ["leader repeating", () => placeBid(s0, bid(A, 15_000), OPEN), "max-not-raised"],
    ["stale sequence", () => placeBid(s0, { ...bid(C, 50_000), seq: 1 }, OPEN), "out-of-sequence"],
  ] as const)("%s", (_name, make, reason) => {
    const decision = make();
    expect(refusal(decision)).toBe(reason);
    expect(decision.state).toBe(s0); // refused bids change nothing
    expect(decision.minimumCents).toBe(15_000);
  });

  it("any whole-cent amount at or above the minimum is accepted (no step rounding)", () => {
    expect(minimumBidFor(s0)).toBe(15_000);
    expect(refusal(placeBid(s0, bid(C, 15_001), OPEN))).toBe("accepted");
  });
});

describe("replay", () => {
  it("replaying accepted bids in seq order rebuilds the same state, whatever order they are stored in", () => {
    const terms: LotTerms = {
      openingCents: 2_500,
      reserveCents: 30_000,
      ladder: DEFAULT_INCREMENT_LADDER,
      consignorId: "voss-estate",
    };
    const attempts = [
      bid(A, 4_000),
      bid(B, 3_000),
      bid(B, 12_000),
      bid(C, 9_000), // outbid by proxy: price 90 + 5 = 95
      bid(A, 12_000),
      bid(A, 35_000),
      bid(B, 31_000), // reserve met at 300, minimum 325: refused
      bid(C, 40_000),
      bid(A, 40_000), // equals C's maximum but later → C keeps the lead at 400
    ];
    let state = initialProxyState(terms);
    const stored: MaxBid[] = [];
    for (const attempt of attempts) {
      const decision = placeBid(state, attempt, OPEN);
      if (decision.accepted) stored.push(attempt);
      state = decision.state;
    }
    expect(stored).toHaveLength(attempts.length - 1);
    expect(stored).not.toContain(attempts[6]);
    expect(state.leader?.bidderId).toBe(C);
    expect(state.priceCents).toBe(40_000);
    const shuffled = [stored[5], stored[0], stored[7], stored[2], stored[1], stored[6], stored[3], stored[4]];
    expect(replayBids(terms, shuffled)).toEqual(state);
  });

  it("throws on an inconsistent history", () => {
    const bad = [bid(A, 15_000), bid(B, 1_500)];
    expect(() => replayBids(FLAT10, bad)).toThrow(/refused on replay: below-minimum/);
  });
});
