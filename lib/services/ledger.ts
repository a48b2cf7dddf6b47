import { randomUUID } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { ACCOUNTS, assertBalanced, type AccountName, type LedgerEntry } from "../money/ledger";
import { db } from "../../models";
import { ledgerColumns, type LedgerEntryRow } from "./ledger-rows";

/**
 * Post one balanced set of entries inside the caller's transaction (the same
 * one that changes the state). `kind` is unique per invoice, so a retried
 * handler that tries to post the same movement twice posts nothing.
 * Returns false when this movement was already posted.
 */
export async function post(
  t: Transaction,
  kind: string,
  invoiceId: string | null,
  entries: LedgerEntry[],
  externalRef: string | null = null,
): Promise<boolean> {
  assertBalanced(entries);
  const s = db();
  if (invoiceId) {
    const [seen] = await s.query<{ n: number }>(
      `SELECT 1 AS n FROM ledger_entries WHERE invoice_id = :invoiceId AND txn_kind = :kind LIMIT 1`,
      { replacements: { invoiceId, kind }, type: QueryTypes.SELECT, transaction: t },
    );
    if (seen) return false;
  }
  const txn = randomUUID();
  const values = entries.map((e, i) => `(:txn, :kind, :invoiceId, :a${i}, :d${i}, :c${i}, :ref, now())`).join(", ");
  const replacements: Record<string, unknown> = { txn, kind, invoiceId, ref: externalRef };
  entries.forEach((e, i) => {
    replacements[`a${i}`] = e.account;
    replacements[`d${i}`] = e.debitCents ?? 0;
    replacements[`c${i}`] = e.creditCents ?? 0;
  });
  await s.query(
    `INSERT INTO ledger_entries (txn_id, txn_kind, invoice_id, account, debit_cents, credit_cents, external_ref, created_at) VALUES ${values}`,
    { replacements, transaction: t },
  );
  return true;
}

/** Debit-positive balance per account, from the whole ledger (or one invoice). */
export async function balances(invoiceId?: string): Promise<Record<AccountName, number>> {
  const rows = await db().query<{ account: AccountName; balance: string }>(
    `SELECT account, SUM(debit_cents) - SUM(credit_cents) AS balance FROM ledger_entries ${invoiceId ? "WHERE invoice_id = :invoiceId" : ""} GROUP BY account`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT },
  );
  const out = Object.fromEntries(ACCOUNTS.map((a) => [a, 0])) as Record<AccountName, number>;
  for (const r of rows) out[r.account] = Number(r.balance);
  return out;
}

/** Sum of all debits minus all credits: zero while every posting balanced. */
export async function trialBalance(): Promise<number> {
  const [r] = await db().query<{ diff: string | null }>(
    `SELECT SUM(debit_cents) - SUM(credit_cents) AS diff FROM ledger_entries`,
    { type: QueryTypes.SELECT },
  );
  return Number(r?.diff ?? 0);
}

/** The postings of one invoice, oldest first. */
export async function entriesFor(invoiceId: string) {
  const rows = await db().query<
    Pick<LedgerEntryRow, "txn_kind" | "account" | "debit_cents" | "credit_cents" | "created_at">
  >(
    `SELECT ${ledgerColumns(["txn_kind", "account", "debit_cents", "credit_cents", "created_at"])} FROM ledger_entries WHERE invoice_id = :invoiceId ORDER BY id`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    kind: r.txn_kind,
    account: r.account,
    debitCents: Number(r.debit_cents),
    creditCents: Number(r.credit_cents),
    at: r.created_at.toISOString(),
  }));
}
