/**
 * Estimate range for a lot from comparable past sales.
 *
 * The rule [SUG, ours]: for each type family and condition in the lot, take
 * the comparables of the same family and condition, or of the same family in
 * any condition when none match the condition. Per tube, low = 25th and high =
 * 75th percentile of their prices (linear interpolation between order
 * statistics: rank h = (n − 1)·p), rounded half up to whole cents, then × the
 * tubes to value. Tubes graded reject or with a white getter are valued at
 * zero and counted apart. Families without comparables are listed, not
 * guessed; when no family has any, the answer is "no comparables yet".
 */
import type { ItemCondition } from "./item";

/** One past sale, per tube, in integer cents. */
export interface ComparableSale {
  /** Key from typeFamily(). */
  typeFamily: string;
  condition: ItemCondition;
  /** Grade at sale, for display; the estimate does not filter on it. */
  grade?: string;
  pricePerTubeCents: number;
  /** ISO 8601 date of the sale. */
  soldAt: string;
}

/** Tubes of one family and condition to value. */
export interface EstimateGroup {
  familyKey: string;
  familyLabel: string;
  condition: ItemCondition;
  /** Tubes that count towards the estimate. */
  tubes: number;
}

/** Per-family part of an estimate. */
export interface FamilyEstimate {
  familyKey: string;
  familyLabel: string;
  condition: ItemCondition;
  tubes: number;
  comparablesUsed: number;
  /** True when no comparable had this condition and the family's sales in any condition were used. */
  conditionFallback: boolean;
  lowPerTubeCents: number;
  highPerTubeCents: number;
  lowCents: number;
  highCents: number;
}

/** A lot estimate: a range in cents, or none yet. */
export type LotEstimate =
  | {
      kind: "range";
      lowCents: number;
      highCents: number;
      parts: FamilyEstimate[];
      /** Families with tubes to value but no comparables: not included in the range. */
      familiesWithoutComparables: { familyKey: string; familyLabel: string; tubes: number }[];
    }
  | {
      kind: "none";
      text: "no comparables yet";
      familiesWithoutComparables: { familyKey: string; familyLabel: string; tubes: number }[];
    };

/** Percentile p (0–1) of ascending-sorted values, linear interpolation between ranks; NaN when empty. */
export function percentile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  if (!(p >= 0 && p <= 1)) throw new RangeError(`percentile must be between 0 and 1, got ${p}`);
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.ceil(h);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Lower and upper percentiles used for the range [SUG]. */
export const ESTIMATE_PERCENTILES = { low: 0.25, high: 0.75 } as const;

/** Options for estimateLot. `since`: ignore sales before this ISO date. */
export interface EstimateOptions {
  since?: string;
}

/**
 * Values each group from comparables by the rule in this file's header.
 * Prices that are not non-negative integer cents are ignored.
 */
export function estimateLot(
  groups: readonly EstimateGroup[],
  comparables: readonly ComparableSale[],
  options: EstimateOptions = {},
): LotEstimate {
  const usable = comparables.filter(
    (c) =>
      Number.isSafeInteger(c.pricePerTubeCents) &&
      c.pricePerTubeCents >= 0 &&
      (!options.since || c.soldAt >= options.since),
  );
  const parts: FamilyEstimate[] = [];
  const missing = new Map<string, { familyKey: string; familyLabel: string; tubes: number }>();
  for (const g of groups) {
    if (g.tubes <= 0) continue;
    const family = usable.filter((c) => c.typeFamily === g.familyKey);
    const sameCondition = family.filter((c) => c.condition === g.condition);
    const chosen = sameCondition.length > 0 ? sameCondition : family;
    if (chosen.length === 0) {
      const m = missing.get(g.familyKey) ?? { familyKey: g.familyKey, familyLabel: g.familyLabel, tubes: 0 };
      m.tubes += g.tubes;
      missing.set(g.familyKey, m);
      continue;
    }
    const prices = chosen.map((c) => c.pricePerTubeCents).sort((a, b) => a - b);
    const low = Math.round(percentile(prices, ESTIMATE_PERCENTILES.low));
    const high = Math.round(percentile(prices, ESTIMATE_PERCENTILES.high));
    parts.push({
      familyKey: g.familyKey,
      familyLabel: g.familyLabel,
      condition: g.condition,
      tubes: g.tubes,
      comparablesUsed: chosen.length,
      conditionFallback: sameCondition.length === 0,
      lowPerTubeCents: low,
      highPerTubeCents: high,
      lowCents: low * g.tubes,
      highCents: high * g.tubes,
    });
  }
  const familiesWithoutComparables = [...missing.values()].sort((a, b) => a.familyKey.localeCompare(b.familyKey));
  if (parts.length === 0) return { kind: "none", text: "no comparables yet", familiesWithoutComparables };
  return {
    kind: "range",
    lowCents: parts.reduce((s, p) => s + p.lowCents, 0),
    highCents: parts.reduce((s, p) => s + p.highCents, 0),
    parts,
    familiesWithoutComparables,
  };
}
