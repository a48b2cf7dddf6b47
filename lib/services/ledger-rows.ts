import type { AccountName } from "../money/ledger";

/**
 * The typed face of the `ledger_entries` table: one side of a balanced
 * posting (debit or credit, never both). Posted only by ledger.ts `post()`,
 * never changed. BIGINT columns come back from pg as text.
 */
export type LedgerEntryRow = {
  id: string;
  txn_id: string;
  txn_kind: string;
  invoice_id: string | null;
  account: AccountName;
  debit_cents: string;
  credit_cents: string;
  external_ref: string | null;
  created_at: Date;
};

/** The columns of LedgerEntryRow, in table order. */
export const LEDGER_ENTRY_COLUMNS = [
  "id",
  "txn_id",
  "txn_kind",
  "invoice_id",
  "account",
  "debit_cents",
  "credit_cents",
  "external_ref",
  "created_at",
] as const satisfies readonly (keyof LedgerEntryRow)[];

/** A select list of some ledger columns, optionally qualified by a table alias. */
export function ledgerColumns<K extends keyof LedgerEntryRow>(columns: readonly K[], alias?: string): string {
  return columns.map((c) => (alias ? `${alias}.${c}` : c)).join(", ");
}
