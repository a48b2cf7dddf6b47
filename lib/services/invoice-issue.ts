import { randomUUID } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { invoiceIssuedEntries } from "../money/ledger";
import type { SettledInvoice } from "../money/settings-pricing";
import type { Address } from "../validation/address";
import { db } from "../../models";
import { post } from "./ledger";

/** A sold lot's invoice as priced by priceSoldLot, with the parties and the copies the invoice keeps. */
export type NewInvoice = {
  saleLotId: string;
  lotId: string;
  buyerId: string;
  consignorId: string;
  priced: SettledInvoice;
  tubes: number;
  /** The house settings version the sale froze (null only on invoices from before versions existed). */
  settingsVersion: number | null;
  /** Copies of both addresses as they were when the invoice was issued (a later move changes nothing). */
  buyerAddress: Address | null;
  originAddress: Address | null;
  dueDays: number;
  /** Offered to the under-bidder after the winner did not pay. */
  secondChance: boolean;
};

/**
 * Number, write and post a new invoice awaiting payment, inside the caller's transaction (the winner's invoice
 * and a second-chance offer are written the same way). Returns the new invoice's id.
 */
export async function issueInvoice(t: Transaction, n: NewInvoice): Promise<string> {
  const s = db();
  const id = randomUUID();
  const [{ number }] = (await s.query<{ number: string }>(`SELECT nextval('invoice_numbers') AS number`, {
    type: QueryTypes.SELECT,
    transaction: t,
  })) as [{ number: string }];
  const p = n.priced;
  await s.query(
    `INSERT INTO invoices (id, number, sale_lot_id, lot_id, buyer_id, consignor_id, state, hammer_cents, premium_bp,
                           premium_cents, shipping_cents, tax_cents, total_cents, commission_cents, tube_count,
                           settings_version, buyer_address, origin_address, shipping_zone, tax_bp, due_at,
                           second_chance, created_at, updated_at)
     VALUES (:id, :number, :saleLotId, :lotId, :buyer, :consignor, 'awaiting-payment', :hammer, :bp,
             :premium, :shipping, :tax, :total, :commission, :tubes,
             :version, CAST(:buyerAddress AS jsonb), CAST(:originAddress AS jsonb), :zone, :taxBp,
             now() + (:dueDays || ' days')::interval, :secondChance, now(), now())`,
    {
      replacements: {
        id,
        number: `GL-${new Date().getUTCFullYear()}-${number}`,
        saleLotId: n.saleLotId,
        lotId: n.lotId,
        buyer: n.buyerId,
        consignor: n.consignorId,
        hammer: p.hammerCents,
        bp: p.premiumBp,
        premium: p.premiumCents,
        shipping: p.shippingCents,
        tax: p.taxCents,
        total: p.totalCents,
        commission: p.commissionCents,
        tubes: n.tubes,
        version: n.settingsVersion,
        buyerAddress: n.buyerAddress ? JSON.stringify(n.buyerAddress) : null,
        originAddress: n.originAddress ? JSON.stringify(n.originAddress) : null,
        zone: p.zone,
        taxBp: p.taxBp,
        dueDays: String(n.dueDays),
        secondChance: n.secondChance,
      },
      transaction: t,
    },
  );
  await post(t, "invoice-issued", id, invoiceIssuedEntries(p));
  return id;
}
