// Check values: [CTP] common trade practice, (2-minute window, staggered closings, optional cap).
import { describe, expect, it } from "vitest";
import { extendOnBid, isClosed, staggeredCloseTimes, validateSoftClose } from "@/lib/auction/soft-close";

const S = 1_000;
const T = Date.UTC(2025, 3, 12, 19, 0, 0); // closing time of a demo lot
const clock = { closesAtMs: T, extensionCount: 0 };
const twoMinutes = { windowSeconds: 120, maxExtensions: null }; // "e.g. 2 min" [CTP]

describe("extendOnBid — soft close [CTP]", () => {
  it("leaves the close alone for bids before the final window", () => {
    expect(extendOnBid(clock, T - 300 * S, twoMinutes)).toEqual({ ...clock, extended: false });
    expect(extendOnBid(clock, T - 120 * S, twoMinutes)).toEqual({ ...clock, extended: false }); // lands exactly on T
  });

  it("moves the close to bid time + window for bids inside it", () => {
    expect(extendOnBid(clock, T - 60 * S, twoMinutes)).toEqual({
      closesAtMs: T + 60 * S,
      extensionCount: 1,
      extended: true,
    });
    expect(extendOnBid(clock, T - 1, twoMinutes).closesAtMs).toBe(T + 120 * S - 1);
  });

  it("never moves the close earlier", () => {
    const late = { closesAtMs: T + 100 * S, extensionCount: 1 };
    expect(extendOnBid(late, T - 30 * S, twoMinutes)).toEqual({ ...late, extended: false }); // T + 90 s < T + 100 s
  });

  it("stops extending at the cap", () => {
    const capped = { windowSeconds: 120, maxExtensions: 2 };
    const first = extendOnBid(clock, T - 10 * S, capped);
    const second = extendOnBid(first, first.closesAtMs - 10 * S, capped);
    const third = extendOnBid(second, second.closesAtMs - 10 * S, capped);
    expect([first.extended, second.extended, third.extended]).toEqual([true, true, false]);
    expect(third.closesAtMs).toBe(second.closesAtMs);
    expect(third.extensionCount).toBe(2);
  });

  it("refuses bids at or after the close and bad settings", () => {
    expect(() => extendOnBid(clock, T, twoMinutes)).toThrow(/closing time/);
    expect(() => extendOnBid(clock, T - 1, { windowSeconds: 0, maxExtensions: null })).toThrow(/invalid/);
    expect(validateSoftClose({ windowSeconds: 120, maxExtensions: -1 })).toHaveLength(1);
  });

  it("isClosed is true from the closing time on", () => {
    expect(isClosed(clock, T - 1)).toBe(false);
    expect(isClosed(clock, T)).toBe(true);
  });
});

describe("staggeredCloseTimes — lots close 30–60 s apart [CTP]", () => {
  it("spaces lots by the gap", () => {
    expect(staggeredCloseTimes(T, 30, 3)).toEqual([T, T + 30 * S, T + 60 * S]);
    expect(staggeredCloseTimes(T, 45, 0)).toEqual([]);
    expect(() => staggeredCloseTimes(T, 1.5, 3)).toThrow(RangeError);
  });
});
