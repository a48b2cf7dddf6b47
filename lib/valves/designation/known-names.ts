// The list of designations we know (the house's reference rows and aliases,
// and the equivalents table), used to accept listed-only names and to suggest
// candidates for mistyped ones. Built once per reference-table revision.

import { equivalentNames } from "../equivalents";
import { derivedFrom, referenceNames, type ReferenceTable } from "../reference-table";
import { closestNames } from "./edit-distance";

function known(table: ReferenceTable): { list: readonly string[]; set: ReadonlySet<string> } {
  return derivedFrom(table, "known-names", (t) => {
    const set = new Set<string>([...referenceNames(t), ...equivalentNames()]);
    return { list: [...set].sort(), set };
  });
}

/** Every designation we know, sorted. */
export function knownDesignations(table: ReferenceTable): readonly string[] {
  return known(table).list;
}

/** Whether a normalised designation is in the reference table or the equivalents lists. */
export function isKnownDesignation(table: ReferenceTable, normalised: string): boolean {
  return known(table).set.has(normalised);
}

/**
 * Closest known designations to a normalised query, nearest first (edit
 * distance with neighbour swaps: "ECC38" -> ECC83, "12AX8" -> 12AX7).
 * Queries joined by "/" ("12AX7/ECC83") are split and each half suggested.
 */
export function candidateDesignations(table: ReferenceTable, normalised: string, limit = 6): string[] {
  const parts = normalised.split("/").filter((p) => p.length > 0);
  const halves = parts.length > 1 ? parts : [normalised];
  const out: string[] = halves.length > 1 ? halves.filter((p) => isKnownDesignation(table, p)) : [];
  const perHalf = Math.max(1, Math.floor((limit - out.length) / halves.length));
  for (const part of halves) {
    for (const c of closestNames(part, known(table).list, { limit: perHalf })) if (!out.includes(c)) out.push(c);
  }
  return out.slice(0, limit);
}
