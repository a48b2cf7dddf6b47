/**
 * Bid increment ladders. A ladder is a house setting held as data: a list of
 * price levels, each with the increment that applies from that level up.
 * Amounts are integer cents.
 */

/** One rung: from `fromCents` (inclusive) up to the next rung, bids rise by `incrementCents`. */
export interface LadderRung {
  /** Lowest price this rung covers, cents. */
  fromCents: number;
  /** Increment at prices on this rung, cents. */
  incrementCents: number;
}

/** A ladder: rungs in ascending order, the first from 0. */
export type IncrementLadder = readonly LadderRung[];

/**
 * Default ladder: generic 1-2-5 steps [CTP; a product setting, not
 * any company's table], in cents. Under $20: $1 · $20–49.99: $2 ·
 * $50–99.99: $5 · $100–249.99: $10 · $250–499.99: $25 · $500–999.99: $50 ·
 * $1,000–2,499.99: $100 · $2,500–4,999.99: $250 · $5,000 and up: $500.
 */
export const DEFAULT_INCREMENT_LADDER: IncrementLadder = [
  { fromCents: 0, incrementCents: 100 },
  { fromCents: 2_000, incrementCents: 200 },
  { fromCents: 5_000, incrementCents: 500 },
  { fromCents: 10_000, incrementCents: 1_000 },
  { fromCents: 25_000, incrementCents: 2_500 },
  { fromCents: 50_000, incrementCents: 5_000 },
  { fromCents: 100_000, incrementCents: 10_000 },
  { fromCents: 250_000, incrementCents: 25_000 },
  { fromCents: 500_000, incrementCents: 50_000 },
];

/** A ladder with one increment at every price (handy for small house sales and for worked examples). */
export function flatLadder(incrementCents: number): IncrementLadder {
  return [{ fromCents: 0, incrementCents }];
}

/**
 * Lists what is wrong with a ladder (empty = valid): at least one rung, the
 * first from 0, levels strictly ascending, increments positive whole cents.
 */
export function validateLadder(ladder: IncrementLadder): string[] {
  const problems: string[] = [];
  if (ladder.length === 0) return ["a ladder needs at least one rung"];
  if (ladder[0].fromCents !== 0) problems.push("the first rung must start at 0");
  ladder.forEach((rung, index) => {
    if (!Number.isSafeInteger(rung.fromCents) || rung.fromCents < 0) {
      problems.push(`rung ${index}: fromCents must be whole cents ≥ 0`);
    }
    if (index > 0 && !(rung.fromCents > ladder[index - 1].fromCents)) {
      problems.push(`rung ${index}: levels must ascend`);
    }
    if (!Number.isSafeInteger(rung.incrementCents) || rung.incrementCents <= 0) {
      problems.push(`rung ${index}: incrementCents must be whole cents > 0`);
    }
  });
  return problems;
}

/** Throws a RangeError listing the problems if the ladder is invalid. */
export function assertLadder(ladder: IncrementLadder): IncrementLadder {
  const problems = validateLadder(ladder);
  if (problems.length > 0) throw new RangeError(`invalid increment ladder: ${problems.join("; ")}`);
  return ladder;
}

/**
 * The increment that applies at `priceCents`: the rung with the highest
 * level at or below the price. Default ladder: $19.99 → $1, $20.00 → $2.
 */
export function incrementAt(priceCents: number, ladder: IncrementLadder = DEFAULT_INCREMENT_LADDER): number {
  if (!Number.isSafeInteger(priceCents) || priceCents < 0) {
    throw new RangeError(`priceCents must be whole cents ≥ 0, got ${priceCents}`);
  }
  assertLadder(ladder);
  let increment = ladder[0].incrementCents;
  for (const rung of ladder) {
    if (rung.fromCents > priceCents) break;
    increment = rung.incrementCents;
  }
  return increment;
}

/** What {@link nextMinimumBid} needs to know about a lot (the proxy state satisfies it). */
export interface MinimumBidInput {
  /** Current shown price, cents. */
  priceCents: number;
  /** Accepted bids so far. */
  bidCount: number;
  /** Opening price, cents. */
  openingCents: number;
}

/**
 * The lowest maximum a new bidder may enter: the opening price while there
 * are no bids, else the shown price plus one increment at that price.
 * Any whole-cent amount at or above it is acceptable (no rounding to steps).
 */
export function nextMinimumBid(state: MinimumBidInput, ladder: IncrementLadder = DEFAULT_INCREMENT_LADDER): number {
  if (state.bidCount === 0) return state.openingCents;
  return state.priceCents + incrementAt(state.priceCents, ladder);
}
