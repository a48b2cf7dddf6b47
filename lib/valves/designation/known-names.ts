// The cached list of designations we know (reference rows, aliases and the
// equivalents table), used to accept listed-only names and to suggest
// candidates for mistyped ones.

import { equivalentNames } from "../equivalents";
import { referenceNames } from "../reference-data";
import { closestNames } from "./edit-distance";

let cache: { list: readonly string[]; set: ReadonlySet<string> } | undefined;

function known(): { list: readonly string[]; set: ReadonlySet<string> } {
  if (!cache) {
    const set = new Set<string>([...referenceNames(), ...equivalentNames()]);
    cache = { list: [...set].sort(), set };
  }
  return cache;
}

/** Every designation we know, sorted. Built once per process. */
export function knownDesignations(): readonly string[] {
  return known().list;
}

/** Whether a normalised designation is in our reference or equivalents lists. */
export function isKnownDesignation(normalised: string): boolean {
  return known().set.has(normalised);
}

/**
 * Closest known designations to a normalised query, nearest first (edit
 * distance with neighbour swaps: "ECC38" -> ECC83, "12AX8" -> 12AX7).
 * Queries joined by "/" ("12AX7/ECC83") are split and each half suggested.
 */
export function candidateDesignations(normalised: string, limit = 6): string[] {
  const parts = normalised.split("/").filter((p) => p.length > 0);
  const halves = parts.length > 1 ? parts : [normalised];
  const out: string[] = halves.length > 1 ? halves.filter((p) => isKnownDesignation(p)) : [];
  const perHalf = Math.max(1, Math.floor((limit - out.length) / halves.length));
  for (const part of halves) {
    for (const c of closestNames(part, known().list, { limit: perHalf })) if (!out.includes(c)) out.push(c);
  }
  return out.slice(0, limit);
}
