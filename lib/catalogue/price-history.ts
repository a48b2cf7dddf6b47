/**
 * Price history: what a tube of one type family and condition fetched in our own sold lots, by month — the
 * comparables the estimates use (lib/lots/comparables), made visible. Each point is one sold single-family,
 * single-condition lot's net hammer per tube; a month's figure is the median of its points [SUG, our rule].
 * Pure.
 */
import { percentile, type ComparableSale } from "../lots/estimate";

export type MonthPoint = { month: string; sales: number; medianCents: number; lowCents: number; highCents: number };
export type PriceSeries = { family: string; condition: string; months: MonthPoint[]; sales: number };

/** Series for the given families (every condition that has sales), months oldest first. */
export function priceSeries(comparables: readonly ComparableSale[], families: readonly string[]): PriceSeries[] {
  const out: PriceSeries[] = [];
  for (const family of families) {
    const conditions = [...new Set(comparables.filter((c) => c.typeFamily === family).map((c) => c.condition))].sort();
    for (const condition of conditions) {
      const byMonth = new Map<string, number[]>();
      for (const c of comparables) {
        if (c.typeFamily !== family || c.condition !== condition) continue;
        const month = c.soldAt.slice(0, 7);
        byMonth.set(month, [...(byMonth.get(month) ?? []), c.pricePerTubeCents]);
      }
      const months = [...byMonth.entries()]
        .sort(([a], [b]) => a.localeCompare(b))
        .map(([month, prices]) => {
          const sorted = [...prices].sort((a, b) => a - b);
          return {
            month,
            sales: sorted.length,
            medianCents: Math.round(percentile(sorted, 0.5)),
            lowCents: sorted[0]!,
            highCents: sorted.at(-1)!,
          };
        });
      out.push({ family, condition, months, sales: months.reduce((n, m) => n + m.sales, 0) });
    }
  }
  return out;
}
