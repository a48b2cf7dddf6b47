/**
 * Spread arithmetic shared by the matching searches.
 *
 * Spread of a set = (max − min)/mean [SUG]. For two tubes the mean
 * is fixed by the pair; for larger sets it also depends on the inner values.
 */

/** Slack added to tolerance comparisons so a set exactly on the limit passes despite rounding. */
export const TOLERANCE_SLACK_PCT = 1e-9;

/** Spread (max − min)/mean of the values, in % [SUG]. 0 for fewer than two values. */
export function spreadPct(values: readonly number[]): number {
  if (values.length < 2) return 0;
  let min = Infinity;
  let max = -Infinity;
  let sum = 0;
  for (const value of values) {
    if (value < min) min = value;
    if (value > max) max = value;
    sum += value;
  }
  return sum === 0 ? 0 : ((max - min) * values.length * 100) / sum;
}

/** True when the spread of the values is within the tolerance (in %). */
export function isWithinTolerance(values: readonly number[], tolerancePct: number): boolean {
  return spreadPct(values) <= tolerancePct + TOLERANCE_SLACK_PCT;
}

/** Same test from a set's min, max, sum and size, for the inner loops. */
export function fitsSpread(min: number, max: number, sum: number, size: number, tolerancePct: number): boolean {
  return (max - min) * size * 100 <= (tolerancePct + TOLERANCE_SLACK_PCT) * sum;
}

/**
 * Largest max/min ratio any set of `size` values can have and still fit: the
 * mean is at most (min + (size − 1)·max)/size, so a fit needs
 * max·(1 − t(size − 1)/size) ≤ min·(1 + t/size). Exact for pairs; for larger
 * sets a necessary condition only (it assumes every inner value sits at max).
 */
export function maxRatioForSize(size: number, tolerancePct: number): number {
  const t = (tolerancePct + TOLERANCE_SLACK_PCT) / 100;
  const denominator = 1 - (t * (size - 1)) / size;
  return denominator <= 0 ? Infinity : ((1 + t / size) / denominator) * (1 + 1e-12);
}

/**
 * Most disjoint windows of `size` consecutive sorted values whose max/min is
 * within `ratio`. Because such a rule looks only at min and max and is closed
 * under narrowing, consecutive windows taken greedily from the bottom are
 * optimal; with maxRatioForSize this bounds the true count from above.
 */
export function countRatioWindows(sortedAscending: ArrayLike<number>, size: number, ratio: number): number {
  let count = 0;
  let i = 0;
  while (i + size - 1 < sortedAscending.length) {
    if (sortedAscending[i + size - 1] <= sortedAscending[i] * ratio) {
      count += 1;
      i += size;
    } else {
      i += 1;
    }
  }
  return count;
}
