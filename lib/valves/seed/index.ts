// Seed data for the house's reference table. The running exchange reads
// valve_types in PostgreSQL (lib/services/reference-table.ts); these rows are
// what a new database starts from (migrations 20261201000300 and
// 20261203000900) and what unit tests build a table from.

import { referenceTable, type ReferenceTable } from "../reference-table";
import type { ReferenceType } from "../reference-row";
import { BATTERY_AND_EARLY_ROWS } from "./battery-and-early";
import { CORE_ROWS } from "./core";
import { EUROPEAN_ROWS } from "./european";
import { RECTIFIER_REGULATOR_ROWS } from "./rectifiers-regulators";
import { SERIES_STRING_ROWS } from "./series-string";
import { SPECIAL_QUALITY_ROWS } from "./special-quality";
import { US_MINIATURE_ROWS } from "./us-miniature";
import { US_OCTAL_ROWS } from "./us-octal";

/** Every seed row, core rows first. Designations and aliases are unique across the list. */
export const SEED_REFERENCE_TYPES: readonly ReferenceType[] = [
  ...CORE_ROWS,
  ...US_MINIATURE_ROWS,
  ...US_OCTAL_ROWS,
  ...SERIES_STRING_ROWS,
  ...BATTERY_AND_EARLY_ROWS,
  ...EUROPEAN_ROWS,
  ...SPECIAL_QUALITY_ROWS,
  ...RECTIFIER_REGULATOR_ROWS,
];

let seedTable: ReferenceTable | undefined;

/** The seed rows as a table (revision "seed"), for tests and scripts without a database. */
export function seedReferenceTable(): ReferenceTable {
  seedTable ??= referenceTable(SEED_REFERENCE_TYPES, "seed");
  return seedTable;
}
