// The reference table as the pure code reads it: the house's current rows
// (loaded from PostgreSQL by lib/services/reference-table.ts, or the seed rows
// in tests) with lookup indexes. Every function that needs type figures takes
// a ReferenceTable argument; nothing here reads a built-in list.

import { designationStem, normaliseDesignation } from "./designation/normalise";
import type { ReferenceType } from "./reference-row";

/** Which way a lookup matched a reference row. */
export type ReferenceMatch = "exact" | "alias" | "stem";

/** Rows with their indexes, for one revision of the house's table. */
export interface ReferenceTable {
  /** Opaque revision key: changes whenever any row changes. */
  readonly revision: string;
  readonly rows: readonly ReferenceType[];
  readonly byName: ReadonlyMap<string, { readonly row: ReferenceType; readonly match: "exact" | "alias" }>;
  readonly byStem: ReadonlyMap<string, ReferenceType>;
}

/** Builds a table (and its indexes) from rows. Later rows never override earlier names. */
export function referenceTable(rows: readonly ReferenceType[], revision: string): ReferenceTable {
  const byName = new Map<string, { row: ReferenceType; match: "exact" | "alias" }>();
  const byStem = new Map<string, ReferenceType>();
  for (const r of rows) byName.set(r.designation, { row: r, match: "exact" });
  for (const r of rows) for (const a of r.aliases) if (!byName.has(a)) byName.set(a, { row: r, match: "alias" });
  for (const r of rows) {
    for (const name of [r.designation, ...r.aliases]) {
      const stem = designationStem(name);
      // Prefer the row named exactly by its stem (6L6 over 6L6GC).
      if (stem && (!byStem.has(stem) || name === stem)) byStem.set(stem, r);
    }
  }
  return { revision, rows, byName, byStem };
}

/**
 * Finds the reference row for a designation by name or alias after
 * normalisation ("ecc 83" -> 12AX7 row), then, for US numbers, by the
 * suffix-free stem ("6L6GB" -> the 6L6 row). Reports how it matched.
 */
export function findReferenceType(
  table: ReferenceTable,
  designation: string,
): { row: ReferenceType; match: ReferenceMatch } | undefined {
  const n = normaliseDesignation(designation);
  if (!n.ok) return undefined;
  const direct = table.byName.get(n.value);
  if (direct) return direct;
  const stem = designationStem(n.value);
  const byStemRow = stem ? table.byStem.get(stem) : undefined;
  return byStemRow ? { row: byStemRow, match: "stem" } : undefined;
}

/**
 * The reference row for a designation or any of its aliases, after
 * normalisation; undefined when we have no row. Does not match by stem.
 */
export function getReferenceType(table: ReferenceTable, designation: string): ReferenceType | undefined {
  const found = findReferenceType(table, designation);
  return found && found.match !== "stem" ? found.row : undefined;
}

/** Every designation and alias in the table, for suggestion lists. */
export function referenceNames(table: ReferenceTable): string[] {
  return [...table.byName.keys()];
}

const derived = new WeakMap<ReferenceTable, Map<string, unknown>>();

/**
 * A value derived from a table (known-name lists, family indexes), built once
 * per table object: a new revision is a new object, so nothing goes stale.
 */
export function derivedFrom<T>(table: ReferenceTable, key: string, build: (t: ReferenceTable) => T): T {
  let m = derived.get(table);
  if (!m) derived.set(table, (m = new Map()));
  if (!m.has(key)) m.set(key, build(table));
  return m.get(key) as T;
}
