// Seed data for the house's reference table. The running exchange reads
// valve_types in PostgreSQL (lib/services/reference-table.ts); these rows are
// what a new database starts from (migrations 20261201000300 and
// 20261203000900) and what unit tests build a table from.

import { referenceTable, type ReferenceTable } from "../reference-table";
import type { ReferenceType } from "../reference-row";
import { CORE_ROWS } from "./core";

/** Every seed row, core rows first. Designations and aliases are unique across the list. */
export const SEED_REFERENCE_TYPES: readonly ReferenceType[] = [...CORE_ROWS];

let seedTable: ReferenceTable | undefined;

/** The seed rows as a table (revision "seed"), for tests and scripts without a database. */
export function seedReferenceTable(): ReferenceTable {
  seedTable ??= referenceTable(SEED_REFERENCE_TYPES, "seed");
  return seedTable;
}
