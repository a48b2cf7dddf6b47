/**
 * Exact apportionment of an amount of cents over weights by the largest
 * remainder method, so the parts always add back to the whole.
 */
import { assertCents } from "./cents";

/**
 * Splits `totalCents` in proportion to `weights` (non-negative safe integers,
 * not all zero) so the parts sum exactly to the total.
 *
 * Method (largest remainder): each part first gets floor(total × w ÷ Σw);
 * the cents left over go one each to the parts with the largest fractional
 * remainders; equal remainders are served in list order (lower index first).
 * A negative total is split as its magnitude and every part negated.
 * Example: apportionCents(100, [1, 1, 1]) = [34, 33, 33].
 */
export function apportionCents(totalCents: number, weights: readonly number[]): number[] {
  assertCents(totalCents, "totalCents", { allowNegative: true });
  if (weights.length === 0) throw new RangeError("weights must not be empty");
  for (const w of weights) {
    if (!Number.isSafeInteger(w) || w < 0) throw new RangeError(`weight must be a non-negative safe integer, got ${w}`);
  }
  const weightSum = weights.reduce((sum, w) => sum + BigInt(w), 0n);
  if (weightSum === 0n) throw new RangeError("weights must not all be zero");

  const negative = totalCents < 0;
  const total = BigInt(Math.abs(totalCents));
  const floors = weights.map((w) => (total * BigInt(w)) / weightSum);
  const remainders = weights.map((w) => (total * BigInt(w)) % weightSum);
  let leftOver = total - floors.reduce((sum, part) => sum + part, 0n);

  const order = weights
    .map((_, index) => index)
    .sort((a, b) => (remainders[b] > remainders[a] ? 1 : remainders[b] < remainders[a] ? -1 : a - b));
  for (const index of order) {
    if (leftOver === 0n) break;
    floors[index] += 1n;
    leftOver -= 1n;
  }
  return floors.map((part) => (negative && part !== 0n ? -Number(part) : Number(part)));
}
