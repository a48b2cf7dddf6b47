// Check values: [SUG] our own escrow rules (pay, ship, deliver, inspect, then release or a claim's decision).
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  ESCROW_STATE_OF,
  ESCROW_STATES,
  INVOICE_STATES,
  INVOICE_TRANSITIONS,
  canMoveEscrow,
  canMoveInvoice,
  holdsMoney,
  isFinalInvoiceState,
  isInvoiceState,
} from "@/lib/money/invoice-states";

describe("invoice states", () => {
  it("are exactly the states the database's CHECK constraint allows", () => {
    const migration = readFileSync(path.join(__dirname, "../../../migrations/20261201000600-escrow.ts"), "utf8");
    const check = /invoices_state CHECK \(state IN \(([^)]*)\)\)/.exec(migration);
    expect(check).not.toBeNull();
    const inDb = check![1]!.split(",").map((s) => s.trim().replace(/'/g, ""));
    expect([...INVOICE_STATES].sort()).toEqual(inDb.sort());
  });

  it("follow the sale forward: paid, shipped, delivered, then released [SUG]", () => {
    expect(canMoveInvoice("awaiting-payment", "paid-held")).toBe(true);
    expect(canMoveInvoice("paid-held", "shipped")).toBe(true);
    expect(canMoveInvoice("shipped", "delivered")).toBe(true);
    expect(canMoveInvoice("delivered", "released")).toBe(true);
  });

  it("never skip shipping or delivery, and never go back [SUG]", () => {
    expect(canMoveInvoice("paid-held", "released")).toBe(false);
    expect(canMoveInvoice("paid-held", "delivered")).toBe(false);
    expect(canMoveInvoice("shipped", "released")).toBe(false);
    expect(canMoveInvoice("delivered", "shipped")).toBe(false);
    expect(canMoveInvoice("released", "delivered")).toBe(false);
  });

  it("allow a claim only on a delivered lot, ending in a release or a full refund [SUG]", () => {
    expect(canMoveInvoice("delivered", "disputed")).toBe(true);
    expect(canMoveInvoice("shipped", "disputed")).toBe(false);
    expect(canMoveInvoice("released", "disputed")).toBe(false);
    expect(canMoveInvoice("disputed", "released")).toBe(true);
    expect(canMoveInvoice("disputed", "refunded")).toBe(true);
    expect(canMoveInvoice("disputed", "delivered")).toBe(false);
  });

  it("cancel only an unpaid invoice (a second-chance offer) [SUG]", () => {
    expect(canMoveInvoice("awaiting-payment", "cancelled")).toBe(true);
    for (const s of INVOICE_STATES.filter((x) => x !== "awaiting-payment"))
      expect(canMoveInvoice(s, "cancelled")).toBe(false);
  });

  it("end in released, refunded or cancelled", () => {
    expect(INVOICE_STATES.filter(isFinalInvoiceState).sort()).toEqual(["cancelled", "refunded", "released"]);
  });

  it("recognise their own names and nothing else", () => {
    expect(isInvoiceState("paid-held")).toBe(true);
    expect(isInvoiceState("paid")).toBe(false);
    expect(isInvoiceState("")).toBe(false);
  });

  it("name only known states as targets", () => {
    for (const to of Object.values(INVOICE_TRANSITIONS).flat()) expect(isInvoiceState(to)).toBe(true);
  });
});

describe("escrow states", () => {
  it("hold the buyer's money from payment until release or refund [SUG]", () => {
    expect(holdsMoney("awaiting-payment")).toBe(false);
    expect(holdsMoney("paid-held")).toBe(true);
    expect(holdsMoney("shipped")).toBe(true);
    expect(holdsMoney("delivered")).toBe(true);
    expect(holdsMoney("disputed")).toBe(true);
    expect(holdsMoney("released")).toBe(false);
    expect(holdsMoney("refunded")).toBe(false);
    expect(holdsMoney("cancelled")).toBe(false);
  });

  it("freeze under a claim: a frozen payment is never simply held again [SUG]", () => {
    expect(ESCROW_STATE_OF.disputed).toBe("frozen");
    expect(canMoveEscrow("frozen", "held")).toBe(false);
    expect(canMoveEscrow("frozen", "paid-out")).toBe(true);
    expect(canMoveEscrow("frozen", "returned")).toBe(true);
    expect(canMoveEscrow("held", "returned")).toBe(false);
  });

  it("agree with the invoice moves: every invoice move keeps escrow still or moves it along its own table", () => {
    for (const from of INVOICE_STATES)
      for (const to of INVOICE_TRANSITIONS[from]) {
        const a = ESCROW_STATE_OF[from];
        const b = ESCROW_STATE_OF[to];
        expect(a === b || canMoveEscrow(a, b), `${from} → ${to} moves escrow ${a} → ${b}`).toBe(true);
      }
  });

  it("are all reached by some invoice state", () => {
    expect(new Set(Object.values(ESCROW_STATE_OF))).toEqual(new Set(ESCROW_STATES));
  });
});
