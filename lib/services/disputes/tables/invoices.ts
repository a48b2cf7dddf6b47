/**
 * The invoice columns a claim reads and the few invoice writes a claim makes
 * (state, refunded amounts). Named columns only.
 */
import type { Transaction } from "sequelize";
import type { InvoiceRow } from "../../invoices";
import { columns, exec, select } from "./query";

export const CASE_INVOICE_COLUMNS = [
  "id",
  "number",
  "lot_id",
  "buyer_id",
  "consignor_id",
  "state",
  "delivered_at",
  "inspection_ends_at",
  "hammer_cents",
  "premium_cents",
  "commission_cents",
  "shipping_cents",
  "tax_cents",
  "payment_intent_id",
  "hammer_refunded_cents",
  "premium_refunded_cents",
  "released_hammer_cents",
  "released_premium_cents",
] as const satisfies readonly (keyof InvoiceRow)[];

/** An invoice as a claim sees it. */
export type CaseInvoice = Pick<InvoiceRow, (typeof CASE_INVOICE_COLUMNS)[number]>;

/** The invoice by id, optionally locked inside `t`. */
export async function invoiceForCase(
  id: string,
  opts: { t?: Transaction; lock?: boolean } = {},
): Promise<CaseInvoice | undefined> {
  const [inv] = await select<CaseInvoice>(
    `SELECT ${columns(CASE_INVOICE_COLUMNS)} FROM invoices WHERE id = :id ${opts.lock ? "FOR UPDATE" : ""}`,
    { id },
    opts.t,
  );
  return inv;
}

/** As {@link invoiceForCase}, for an invoice a claim row points at (it must exist: a foreign key holds it). */
export async function claimInvoice(id: string, t?: Transaction): Promise<CaseInvoice> {
  const inv = await invoiceForCase(id, { t });
  if (!inv) throw new Error(`invoice ${id} of a claim is missing`);
  return inv;
}

/** The invoice is held while a claim is open. */
export async function markInvoiceDisputed(id: string, t: Transaction): Promise<void> {
  await exec(`UPDATE invoices SET state = 'disputed', updated_at = now() WHERE id = :id`, { id }, t);
}

/** Adds a paid refund to the invoice's running totals. */
export async function addRefunded(
  id: string,
  amounts: { hammerCents: number; premiumCents: number; commissionCents: number },
  t: Transaction,
): Promise<void> {
  await exec(
    `UPDATE invoices SET hammer_refunded_cents = hammer_refunded_cents + :h, premium_refunded_cents = premium_refunded_cents + :p,
            commission_returned_cents = commission_returned_cents + :c, updated_at = now() WHERE id = :id`,
    { h: amounts.hammerCents, p: amounts.premiumCents, c: amounts.commissionCents, id },
    t,
  );
}

/** A disputed invoice whose lot came back and was refunded in full. */
export async function markInvoiceRefunded(id: string, t: Transaction): Promise<void> {
  await exec(
    `UPDATE invoices SET state = 'refunded', updated_at = now() WHERE id = :id AND state = 'disputed'`,
    { id },
    t,
  );
}

/** True once a dispute refund has been posted for the invoice. */
export async function disputeRefundPosted(invoiceId: string): Promise<boolean> {
  const rows = await select<{ n: number }>(
    `SELECT 1 AS n FROM ledger_entries WHERE invoice_id = :id AND txn_kind = 'dispute-refund' LIMIT 1`,
    { id: invoiceId },
  );
  return rows.length > 0;
}

/** Locks the invoice's row for the rest of `t`. */
export async function lockInvoice(id: string, t: Transaction): Promise<void> {
  await select(`SELECT id FROM invoices WHERE id = :id FOR UPDATE`, { id }, t);
}
