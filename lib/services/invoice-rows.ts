import { QueryTypes, type Transaction } from "sequelize";
import type { InvoiceState } from "../money/invoice-states";
import { db } from "../../models";

/**
 * The typed face of the `invoices` table: its row as services read it, the
 * column list they select (never `SELECT *`), and the one read by id.
 */
export type InvoiceRow = {
  id: string;
  number: string;
  sale_lot_id: string;
  lot_id: string;
  buyer_id: string;
  consignor_id: string;
  state: InvoiceState;
  hammer_cents: number;
  premium_bp: number;
  premium_cents: number;
  shipping_cents: number;
  tax_cents: number;
  total_cents: number;
  commission_cents: number;
  processor_fee_cents: number | null;
  tube_count: number;
  /** The house settings version the sale froze (null only on invoices older than versions). */
  settings_version: number | null;
  /** The buyer's and consignor's addresses as they stood when the invoice was issued. */
  buyer_address: unknown;
  origin_address: unknown;
  shipping_zone: string | null;
  tax_bp: number;
  due_at: Date;
  payment_intent_id: string | null;
  last_payment_error: string | null;
  paid_at: Date | null;
  carrier: string | null;
  tracking: string | null;
  shipped_at: Date | null;
  delivered_at: Date | null;
  inspection_ends_at: Date | null;
  released_at: Date | null;
  transfer_id: string | null;
  created_at: Date;
  hammer_refunded_cents: number;
  premium_refunded_cents: number;
  commission_returned_cents: number;
  released_hammer_cents: number;
  released_premium_cents: number;
  released_commission_cents: number;
};

/** The columns of InvoiceRow, in table order. */
export const INVOICE_COLUMNS = [
  "id",
  "number",
  "sale_lot_id",
  "lot_id",
  "buyer_id",
  "consignor_id",
  "state",
  "hammer_cents",
  "premium_bp",
  "premium_cents",
  "shipping_cents",
  "tax_cents",
  "total_cents",
  "commission_cents",
  "processor_fee_cents",
  "tube_count",
  "settings_version",
  "buyer_address",
  "origin_address",
  "shipping_zone",
  "tax_bp",
  "due_at",
  "payment_intent_id",
  "last_payment_error",
  "paid_at",
  "carrier",
  "tracking",
  "shipped_at",
  "delivered_at",
  "inspection_ends_at",
  "released_at",
  "transfer_id",
  "created_at",
  "hammer_refunded_cents",
  "premium_refunded_cents",
  "commission_returned_cents",
  "released_hammer_cents",
  "released_premium_cents",
  "released_commission_cents",
] as const satisfies readonly (keyof InvoiceRow)[];

/** Fails to compile when a field of InvoiceRow is missing from INVOICE_COLUMNS. */
type Complete<T extends never> = T;
export type InvoiceColumnsComplete = Complete<Exclude<keyof InvoiceRow, (typeof INVOICE_COLUMNS)[number]>>;

/** The select list for InvoiceRow, optionally qualified by a table alias (`i.id, i.number, …`). */
export function invoiceColumns(alias?: string): string {
  return INVOICE_COLUMNS.map((c) => (alias ? `${alias}.${c}` : c)).join(", ");
}

/** One invoice by id; `lock` takes its row lock (inside `transaction`). */
export async function findInvoice(
  invoiceId: string,
  opts: { transaction?: Transaction; lock?: boolean } = {},
): Promise<InvoiceRow | undefined> {
  const [inv] = await db().query<InvoiceRow>(
    `SELECT ${invoiceColumns()} FROM invoices WHERE id = :invoiceId${opts.lock ? " FOR UPDATE" : ""}`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT, transaction: opts.transaction },
  );
  return inv;
}
