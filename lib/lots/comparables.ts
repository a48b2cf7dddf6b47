/**
 * Comparable sales from our own sold lots [SUG, our rule]. A lot's hammer is
 * one price for everything in it, so only lots whose tubes are all of one
 * type family and one condition say what a tube of that family fetched:
 * price per tube = (hammer − hammer refunded after a claim) ÷ tubes, rounded
 * half up to whole cents. Mixed lots are left out rather than split by a
 * guess. Pure.
 */
import type { ComparableSale } from "./estimate";
import type { ItemCondition } from "./item";
import type { ReferenceTable } from "../valves/reference-table";
import { typeFamily } from "./type-family";

/** One line of a sold lot, with the lot's net hammer. */
export interface SoldLine {
  lotId: string;
  /** Hammer less any hammer refunded after a claim, cents. */
  netHammerCents: number;
  soldAt: string;
  designation: string;
  condition: ItemCondition;
  quantity: number;
}

export function comparablesFromSoldLots(table: ReferenceTable, lines: readonly SoldLine[]): ComparableSale[] {
  const lots = new Map<string, SoldLine[]>();
  for (const l of lines) lots.set(l.lotId, [...(lots.get(l.lotId) ?? []), l]);
  const out: ComparableSale[] = [];
  for (const group of lots.values()) {
    const families = new Set(group.map((l) => typeFamily(table, l.designation).key));
    const conditions = new Set(group.map((l) => l.condition));
    const tubes = group.reduce((n, l) => n + l.quantity, 0);
    const [first] = group;
    if (families.size !== 1 || conditions.size !== 1 || tubes <= 0 || !first || first.netHammerCents < 0) continue;
    out.push({
      typeFamily: [...families][0]!,
      condition: first.condition,
      pricePerTubeCents: Math.round(first.netHammerCents / tubes),
      soldAt: first.soldAt,
    });
  }
  return out;
}
