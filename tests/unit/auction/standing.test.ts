import { describe, expect, it } from "vitest";
import { canBidIn, panelMessage, standingOf, type StandingInput } from "@/lib/auction/standing";

// [SUG] Our own product rule: one standing per dealer and lot, closed phases override live ones.
const base: StandingInput = { phase: "open", ownLot: false, bidding: false, leading: false };

describe("standingOf", () => {
  it("names every standing of an open lot", () => {
    expect(standingOf(base)).toBe("not-bid");
    expect(standingOf({ ...base, bidding: true, leading: true })).toBe("leading");
    expect(standingOf({ ...base, bidding: true, leading: false })).toBe("outbid");
    expect(standingOf({ ...base, ownLot: true })).toBe("own-lot");
  });
  it("a sold lot is won by the leader and lost by every other bidder", () => {
    expect(standingOf({ ...base, phase: "sold", bidding: true, leading: true })).toBe("won");
    expect(standingOf({ ...base, phase: "sold", bidding: true, leading: false })).toBe("lost");
    expect(standingOf({ ...base, phase: "sold", bidding: false, leading: false })).toBe("not-bid");
  });
  it("an unsold lot is unsold for its bidders, whoever led", () => {
    expect(standingOf({ ...base, phase: "unsold", bidding: true, leading: true })).toBe("unsold");
    expect(standingOf({ ...base, phase: "withdrawn", bidding: true, leading: false })).toBe("unsold");
  });
  it("a closed lot takes no bid form", () => {
    expect(canBidIn("open", "outbid")).toBe(true);
    expect(canBidIn("sold", "lost")).toBe(false);
    expect(canBidIn("unsold", "not-bid")).toBe(false);
    expect(canBidIn("open", "own-lot")).toBe(false);
  });
});

describe("panelMessage", () => {
  const open = { ...base, bidding: true, seq: 7 };
  it("keeps the bid answer while the lot has not moved and it still agrees", () => {
    const m = panelMessage({ ...open, leading: true }, { kind: "bid", outcome: "new-leader", seq: 7, maxCents: 3000 });
    expect(m.key).toBe("new-leader");
    expect(m.tone).toBe("lead");
  });
  it("drops a 'you lead' answer once a later bid put the dealer behind", () => {
    const m = panelMessage(
      { ...open, leading: false, seq: 8 },
      { kind: "bid", outcome: "new-leader", seq: 7, maxCents: 3000 },
    );
    expect(m.key).toBe("outbid");
    expect(m.last).toBeNull();
  });
  it("drops a 'you lead' answer that disagrees with the standing even at the same seq", () => {
    expect(
      panelMessage({ ...open, leading: false }, { kind: "bid", outcome: "first-bid", seq: 7, maxCents: 100 }).key,
    ).toBe("outbid");
  });
  it("a leader raising their own maximum hears it privately", () => {
    expect(
      panelMessage({ ...open, leading: true }, { kind: "bid", outcome: "max-raised", seq: 7, maxCents: 9000 }).key,
    ).toBe("max-raised");
  });
  it("after the close only the outcome speaks", () => {
    const m = panelMessage(
      { ...open, phase: "sold", leading: false, seq: 9 },
      { kind: "bid", outcome: "outbid-by-proxy", seq: 9, maxCents: 100 },
    );
    expect(m.key).toBe("lost");
    expect(m.tone).toBe("behind");
  });
});

describe("a leader's private ceiling raise [SUG]", () => {
  it("does not count as a public bid unless it moves the price", async () => {
    const { applyBid, initialProxyState } = await import("@/lib/auction/proxy");
    const { DEFAULT_INCREMENT_LADDER } = await import("@/lib/auction/increments");
    let st = initialProxyState({
      openingCents: 1000,
      reserveCents: null,
      ladder: DEFAULT_INCREMENT_LADDER,
      consignorId: "c",
    });
    const a = applyBid(st, { bidderId: "a", maxCents: 5000, placedAtMs: 1, seq: 1 });
    if (!a.accepted) throw new Error("refused");
    st = a.state;
    const raise = applyBid(st, { bidderId: "a", maxCents: 9000, placedAtMs: 2, seq: 2 });
    expect(raise.accepted && raise.outcome).toBe("max-raised");
    expect(raise.state.bidCount).toBe(1);
    expect(raise.state.priceCents).toBe(st.priceCents);
  });
});
