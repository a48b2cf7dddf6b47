import { describe, expect, it } from "vitest";
import { canRelist, lotStage, netProceeds, proceedsBySale, type LifeInput } from "@/lib/lots/lifecycle";

// [SUG] Our own stage names and settlement rule; the arithmetic is checked by hand below.
const now = Date.parse("2026-12-03T12:00:00Z");
const approved: LifeInput = { lotState: "approved", sale: null, invoiceState: null, claimOpen: false, nowMs: now };

describe("lotStage", () => {
  it("follows a lot from draft to the house", () => {
    expect(lotStage({ ...approved, lotState: "draft" })).toBe("draft");
    expect(lotStage({ ...approved, lotState: "in-review" })).toBe("with-house");
    expect(lotStage(approved)).toBe("approved");
  });
  it("an approved lot in a sale is no longer just 'approved'", () => {
    expect(lotStage({ ...approved, sale: { phase: "open", startsAtMs: now - 1000 } })).toBe("in-sale");
    expect(lotStage({ ...approved, sale: { phase: "open", startsAtMs: now + 1000 } })).toBe("scheduled");
    expect(lotStage({ ...approved, sale: { phase: "unsold", startsAtMs: 0 } })).toBe("unsold");
  });
  it("a sold lot follows its invoice, and a claim outranks it", () => {
    const sold = { ...approved, sale: { phase: "sold" as const, startsAtMs: 0 } };
    expect(lotStage({ ...sold, invoiceState: null })).toBe("sold-awaiting-payment");
    expect(lotStage({ ...sold, invoiceState: "paid-held" })).toBe("paid");
    expect(lotStage({ ...sold, invoiceState: "released" })).toBe("released");
    expect(lotStage({ ...sold, invoiceState: "delivered", claimOpen: true })).toBe("claim");
  });
  it("only a lot that closed without a sale is offered a relisting", () => {
    expect(canRelist("unsold")).toBe(true);
    expect(canRelist("withdrawn")).toBe(true);
    expect(canRelist("in-sale")).toBe(false);
    expect(canRelist("released")).toBe(false);
  });
});

describe("netProceeds", () => {
  it("is hammer less commission, less hammer refunded, plus commission returned", () => {
    // $250.00 hammer, $25.00 commission, $40.00 refunded, $4.00 commission returned → $189.00
    expect(
      netProceeds({
        hammerCents: 25000,
        commissionCents: 2500,
        hammerRefundedCents: 4000,
        commissionReturnedCents: 400,
        cancelled: false,
      }),
    ).toBe(18900);
    expect(
      netProceeds({
        hammerCents: 25000,
        commissionCents: 2500,
        hammerRefundedCents: 0,
        commissionReturnedCents: 0,
        cancelled: true,
      }),
    ).toBe(0);
  });
  it("sums per sale, skipping lots with no figure", () => {
    const m = proceedsBySale([
      { saleId: "a", netCents: 100 },
      { saleId: "a", netCents: 250 },
      { saleId: "b", netCents: null },
      { saleId: null, netCents: 5 },
    ]);
    expect(m.get("a")).toBe(350);
    expect(m.has("b")).toBe(false);
  });
});
