/**
 * What a typed search term means in the trade's own terms: the designation it normalises to (as at intake:
 * "ecc 83" is ECC83, "6sn7" is listed as 6SN7GT) and every related type from the equivalents table, each with
 * how it relates. A lot matches when any of its items is the type or one of these. Pure.
 */
import { normaliseDesignation } from "../valves/designation/normalise";
import { isKnownDesignation } from "../valves/designation/known-names";
import { findEquivalents, type LinkKind } from "../valves/equivalents";
import type { ReferenceTable } from "../valves/reference-table";

/** How an item's type relates to the searched type: the same type, or one of the equivalents table's links. */
export type Relation = "same" | LinkKind;

/** Closest first. */
export const RELATION_ORDER: readonly Relation[] = [
  "same",
  "exact",
  "premium",
  "near",
  "caveat",
  "sibling-heater",
  "different-base",
];

export const RELATION_WORDS: Record<Relation, string> = {
  same: "the type searched for",
  exact: "same type under another name",
  premium: "special-quality or military version",
  near: "routinely substituted; check heater and ratings",
  caveat: "a substitute with caveats",
  "sibling-heater": "same pinout, different heater: not a drop-in",
  "different-base": "similar electrically, on another base",
};

export type DesignationTerm = { typed: string; designation: string; related: ReadonlyMap<string, Relation> };

/**
 * The designation a search term names, with its related types, or null when the term is not a designation we
 * know (it is then searched as words). Only a whole term that normalises to a known type counts, so "voss"
 * never becomes a type, and "ecc 83" is one type, not two words.
 */
export function designationTerm(typed: string, table: ReferenceTable): DesignationTerm | null {
  const n = normaliseDesignation(typed);
  if (!n.ok) return null;
  const eq = findEquivalents(n.value);
  const self = eq.resolvedAs ?? n.value;
  if (!isKnownDesignation(table, n.value) && !isKnownDesignation(table, self) && eq.matches.length === 0) return null;
  const related = new Map<string, Relation>([
    [self, "same"],
    [n.value, "same"],
  ]);
  for (const m of eq.matches) if (!related.has(m.designation)) related.set(m.designation, m.link);
  return { typed, designation: self, related };
}

/** The closest relation first: for ranking a lot by its best-matching item. */
export function relationRank(r: Relation): number {
  return RELATION_ORDER.indexOf(r);
}
