// Check values: [SUG] our own claim states and the steps between them (lib/disputes/states.ts):
// a claim waits for the consignor's answer, goes to a mediator, is decided, settles (or waits for a
// return), and closes; nothing leaves "closed".
import { describe, expect, it } from "vitest";
import {
  canMove,
  DISPUTE_STATES,
  DISPUTE_TRANSITIONS,
  isDisputeState,
  isOpenState,
  statesBefore,
} from "@/lib/disputes/states";

describe("claim states [SUG]", () => {
  it("lists the six states the database's check constraint allows", () => {
    expect([...DISPUTE_STATES]).toEqual([
      "awaiting-answer",
      "answered",
      "with-mediator",
      "settling",
      "awaiting-return",
      "closed",
    ]);
    expect(isDisputeState("with-mediator")).toBe(true);
    expect(isDisputeState("refunded")).toBe(false);
  });

  it("moves forward only: answer → mediator → settling → (return) → closed", () => {
    expect(canMove("awaiting-answer", "answered")).toBe(true);
    expect(canMove("answered", "with-mediator")).toBe(true);
    expect(canMove("awaiting-answer", "with-mediator")).toBe(true); // a mediator may take it before the answer
    expect(canMove("with-mediator", "settling")).toBe(true);
    expect(canMove("settling", "awaiting-return")).toBe(true);
    expect(canMove("settling", "closed")).toBe(true);
    expect(canMove("awaiting-return", "closed")).toBe(true);
  });

  it("refuses skipped and backward steps", () => {
    expect(canMove("awaiting-answer", "settling")).toBe(false); // no decision before a mediator has the case
    expect(canMove("answered", "closed")).toBe(false);
    expect(canMove("settling", "with-mediator")).toBe(false);
    expect(canMove("awaiting-return", "settling")).toBe(false);
    for (const to of DISPUTE_STATES) expect(canMove("closed", to)).toBe(false);
  });

  it("a retried take keeps the case with its mediator; only an open case may be taken", () => {
    expect(canMove("with-mediator", "with-mediator")).toBe(true);
    expect(statesBefore("take")).toEqual(["awaiting-answer", "answered", "with-mediator"]);
    expect(statesBefore("take")).not.toContain("closed");
  });

  it("every step leads to a listed state and starts from listed states", () => {
    for (const t of Object.values(DISPUTE_TRANSITIONS)) {
      expect(DISPUTE_STATES).toContain(t.to);
      for (const f of t.from) expect(DISPUTE_STATES).toContain(f);
    }
  });

  it("only a closed claim is shut to messages and evidence", () => {
    expect(DISPUTE_STATES.filter((s) => !isOpenState(s))).toEqual(["closed"]);
  });
});
