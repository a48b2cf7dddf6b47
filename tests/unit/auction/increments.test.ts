// Check values: [CTP] common trade practice — generic 1-2-5 increment ladder (a house setting).
import { describe, expect, it } from "vitest";
import {
  DEFAULT_INCREMENT_LADDER,
  flatLadder,
  incrementAt,
  nextMinimumBid,
  validateLadder,
} from "@/lib/auction/increments";

describe("default ladder — generic 1-2-5 steps [CTP]", () => {
  it("is valid", () => {
    expect(validateLadder(DEFAULT_INCREMENT_LADDER)).toEqual([]);
  });

  it.each([
    [0, 100],
    [1_999, 100], // $19.99 → $1
    [2_000, 200], // $20.00 → $2
    [4_999, 200],
    [5_000, 500],
    [9_999, 500],
    [10_000, 1_000],
    [24_999, 1_000],
    [25_000, 2_500],
    [49_999, 2_500],
    [50_000, 5_000],
    [99_999, 5_000],
    [100_000, 10_000],
    [249_999, 10_000],
    [250_000, 25_000],
    [499_999, 25_000],
    [500_000, 50_000],
    [10_000_000, 50_000],
  ])("at %i cents the increment is %i cents", (price, increment) => {
    expect(incrementAt(price)).toBe(increment);
  });

  it("rejects fractional or negative prices", () => {
    expect(() => incrementAt(19.99)).toThrow(RangeError);
    expect(() => incrementAt(-1)).toThrow(RangeError);
  });
});

describe("validateLadder", () => {
  it("names each problem", () => {
    expect(validateLadder([])).toEqual(["a ladder needs at least one rung"]);
    expect(validateLadder([{ fromCents: 100, incrementCents: 10 }])).toContain("the first rung must start at 0");
    expect(
      validateLadder([
        { fromCents: 0, incrementCents: 10 },
        { fromCents: 0, incrementCents: 20 },
      ]),
    ).toContain("rung 1: levels must ascend");
    expect(validateLadder([{ fromCents: 0, incrementCents: 0 }])).toContain(
      "rung 0: incrementCents must be whole cents > 0",
    );
    expect(validateLadder([{ fromCents: 0, incrementCents: 2.5 }])).toHaveLength(1);
    expect(() => incrementAt(10, [{ fromCents: 5, incrementCents: 1 }])).toThrow(/invalid increment ladder/);
  });

  it("flatLadder gives one increment everywhere", () => {
    expect(incrementAt(123_456, flatLadder(1_000))).toBe(1_000);
  });
});

describe("nextMinimumBid", () => {
  it("is the opening price before any bid", () => {
    expect(nextMinimumBid({ priceCents: 0, bidCount: 0, openingCents: 2_500 })).toBe(2_500);
  });

  it("is price + one increment at that price, across the $20 boundary", () => {
    expect(nextMinimumBid({ priceCents: 1_999, bidCount: 3, openingCents: 500 })).toBe(2_099); // $19.99 + $1
    expect(nextMinimumBid({ priceCents: 2_000, bidCount: 3, openingCents: 500 })).toBe(2_200); // $20.00 + $2
    expect(nextMinimumBid({ priceCents: 14_000, bidCount: 2, openingCents: 1_000 }, flatLadder(1_000))).toBe(15_000);
  });
});
