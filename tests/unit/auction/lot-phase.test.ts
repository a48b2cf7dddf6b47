// Check values: [SUG] product rule — our own phase names; close decision per [CTP].
import { describe, expect, it } from "vitest";
import { canMove, closeOutcome, isBiddable, isFinished, LOT_PHASES } from "@/lib/auction/lot-phase";

describe("lot phases", () => {
  it("only open and extended lots take bids", () => {
    expect(LOT_PHASES.filter(isBiddable)).toEqual(["open", "extended"]);
  });

  it("allows only forward moves; finished phases are final", () => {
    expect(canMove("scheduled", "open")).toBe(true);
    expect(canMove("open", "extended")).toBe(true);
    expect(canMove("extended", "sold")).toBe(true);
    expect(canMove("extended", "open")).toBe(false);
    expect(canMove("scheduled", "sold")).toBe(false);
    expect(canMove("sold", "unsold")).toBe(false);
    expect(LOT_PHASES.filter(isFinished)).toEqual(["sold", "unsold", "withdrawn"]);
  });
});

describe("closeOutcome — [CTP]", () => {
  it("sells to the leader at the shown price when the reserve is met", () => {
    expect(closeOutcome({ leader: { bidderId: "quill-cathode" }, priceCents: 14_000, reserveMet: true })).toEqual({
      phase: "sold",
      buyerId: "quill-cathode",
      hammerCents: 14_000,
    });
  });

  it("is unsold with reserve not met, or with no bids", () => {
    expect(closeOutcome({ leader: { bidderId: "bellweather" }, priceCents: 9_000, reserveMet: false })).toEqual({
      phase: "unsold",
      reason: "reserve-not-met",
      highBidCents: 9_000,
    });
    expect(closeOutcome({ leader: null, priceCents: 0, reserveMet: false })).toEqual({
      phase: "unsold",
      reason: "no-bids",
      highBidCents: null,
    });
  });
});
