import { referenceTable, type ReferenceTable } from "../valves/reference-table";
import { db, ValveType } from "../../models";

const g = globalThis as unknown as {
  __getterlineReference?: { table: ReferenceTable; loading?: Promise<ReferenceTable> };
};

/**
 * The house's reference table as the pure code reads it: the valve_types rows
 * on file, loaded once per revision. Every call re-checks the revision counter
 * (one indexed single-row read) that a trigger bumps on any change, so a
 * correction made on one instance reaches every other at its next request.
 * The cache lives on globalThis, shared by the server's and Next's module graphs.
 */
export async function currentReferenceTable(): Promise<ReferenceTable> {
  db();
  const revision = await ValveType.tableRevision();
  const cached = g.__getterlineReference?.table;
  if (cached && cached.revision === revision) return cached;
  const rows = await ValveType.onFile();
  const table = referenceTable(
    rows.map((r) => r.toReference()),
    revision,
  );
  // Keep the newest revision if two loads race.
  if (!g.__getterlineReference || Number(g.__getterlineReference.table.revision) <= Number(revision))
    g.__getterlineReference = { table };
  return table;
}

/** The rows of the current table as plain data, for client components that decode as the user types. */
export async function referenceRowsForClient() {
  const t = await currentReferenceTable();
  return { revision: t.revision, rows: t.rows };
}
