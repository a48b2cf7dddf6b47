import { describe, expect, it } from "vitest";
import { createSequencer } from "@/lib/realtime/sequencer";

// [SUG] Our delivery rule: apply a lot's events strictly in seq order, drop stale ones, hold one ahead of a gap.
describe("createSequencer", () => {
  it("applies in order and drops stale events", () => {
    const q = createSequencer<{ seq: number }>(3);
    expect(q.push({ seq: 3 })).toEqual([]);
    expect(q.push({ seq: 4 }).map((e) => e.seq)).toEqual([4]);
  });
  it("holds an event behind a gap and releases both when the gap fills", () => {
    const q = createSequencer<{ seq: number }>(1);
    expect(q.push({ seq: 3 })).toEqual([]);
    expect(q.waiting()).toBe(true);
    expect(q.push({ seq: 2 }).map((e) => e.seq)).toEqual([2, 3]);
    expect(q.waiting()).toBe(false);
  });
  it("a refetch moves past what it covers", () => {
    const q = createSequencer<{ seq: number }>(1);
    q.push({ seq: 4 });
    q.reset(4);
    expect(q.waiting()).toBe(false);
    expect(q.push({ seq: 5 }).map((e) => e.seq)).toEqual([5]);
  });
});
