/**
 * Want lists: a dealer's standing order for a type ("six or more 12AX7 or exact equivalents, new old stock,
 * no white getters, estimate under $200"). Which designations a list wants, and whether a lot meets it. Pure.
 */
import type { AttributionBasis, ItemCondition } from "../lots/item";
import type { ReferenceTable } from "../valves/reference-table";
import { designationTerm, relationRank, type Relation } from "./relations";

/** How far from the type a list reaches: each step takes in the looser relations before it. */
export const CLOSENESS = ["same", "exact", "premium", "near", "caveat"] as const;
export type Closeness = (typeof CLOSENESS)[number];

export const CLOSENESS_WORDS: Record<Closeness, string> = {
  same: "this type only",
  exact: "with exact equivalents",
  premium: "with exact equivalents and special-quality versions",
  near: "also routine substitutes",
  caveat: "also substitutes with caveats",
};

export type WantCriteria = {
  designation: string;
  closeness: Closeness;
  minQuantity: number;
  conditions: ItemCondition[];
  makerBases: AttributionBasis[];
  noVacuumLoss: boolean;
  maxEstimateCents: number | null;
};

/** Every designation the list wants, each with its relation to the list's type; empty when the type is unknown. */
export function wantedDesignations(
  c: Pick<WantCriteria, "designation" | "closeness">,
  table: ReferenceTable,
): Map<string, Relation> {
  const term = designationTerm(c.designation, table);
  const out = new Map<string, Relation>();
  if (!term) return out;
  const reach = relationRank(c.closeness);
  for (const [d, r] of term.related) if (relationRank(r) <= reach) out.set(d, r);
  return out;
}

export type ItemForMatching = {
  designation: string | null;
  quantity: number;
  condition: string;
  makerBasis: string;
  vacuumLoss: boolean;
};
export type LotForMatching = { estimateLowCents: number | null; items: readonly ItemForMatching[] };

/**
 * Whether the lot meets the list: enough tubes of the wanted types in the wanted condition and basis (white
 * getters left out when asked), and an estimate within the list's maximum (a lot without an estimate is
 * offered). Returns the tubes that count.
 */
export function meetsWantList(
  c: WantCriteria,
  wanted: ReadonlyMap<string, Relation>,
  lot: LotForMatching,
): { matched: boolean; tubes: number } {
  if (c.maxEstimateCents !== null && lot.estimateLowCents !== null && lot.estimateLowCents > c.maxEstimateCents)
    return { matched: false, tubes: 0 };
  let tubes = 0;
  for (const i of lot.items) {
    if (!i.designation || !wanted.has(i.designation)) continue;
    if (c.conditions.length && !c.conditions.includes(i.condition as ItemCondition)) continue;
    if (c.makerBases.length && !c.makerBases.includes(i.makerBasis as AttributionBasis)) continue;
    if (c.noVacuumLoss && i.vacuumLoss) continue;
    tubes += i.quantity;
  }
  return { matched: tubes >= c.minQuantity && tubes > 0, tubes };
}
