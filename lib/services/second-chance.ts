import { QueryTypes, type Transaction } from "sequelize";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { entriesFrom, invoiceIssuedEntries } from "../money/ledger";
import { priceSoldLot } from "../money/settings-pricing";
import { db, User } from "../../models";
import { addressOf } from "./addresses";
import { settingsForInvoice } from "./house-settings";
import type { BidRow } from "./bid-rows";
import { issueInvoice } from "./invoice-issue";
import { invoiceColumns, type InvoiceRow } from "./invoice-rows";
import { post } from "./ledger";

type UnpaidInvoice = InvoiceRow & { due_passed: boolean };
type Underbidder = Pick<BidRow, "bidder_id" | "max_cents">;
/** A second-chance invoice issued inside the transaction, with what its e-mail needs. */
type SecondChanceOffer = { offeredTo: string; newInvoiceId: string; total: number; hammer: number; dueDays: number };

/** Lock the invoice and check that it is unpaid and past its due date. */
async function lockOverdueInvoice(t: Transaction, invoiceId: string): Promise<UnpaidInvoice> {
  const [inv] = await db().query<UnpaidInvoice>(
    `SELECT ${invoiceColumns()}, due_at <= now() AS due_passed FROM invoices WHERE id = :invoiceId FOR UPDATE`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT, transaction: t },
  );
  if (!inv) throw new ApiError("not_found", "No such invoice");
  if (inv.state !== "awaiting-payment")
    throw new ApiError("conflict", `Only an unpaid invoice can be cancelled; this one is ${inv.state}`);
  if (!inv.due_passed) throw new ApiError("conflict", "The invoice is not yet past its due date");
  return inv;
}

/** Mark the invoice cancelled and post the reverse of its issuing entries. */
async function cancelAndReverse(t: Transaction, invoiceId: string, inv: UnpaidInvoice): Promise<void> {
  await db().query(`UPDATE invoices SET state = 'cancelled', updated_at = now() WHERE id = :invoiceId`, {
    replacements: { invoiceId },
    transaction: t,
  });
  const issued = {
    hammerCents: inv.hammer_cents,
    premiumCents: inv.premium_cents,
    shippingCents: inv.shipping_cents,
    taxableCents: 0,
    taxCents: inv.tax_cents,
    totalCents: inv.total_cents,
  };
  await post(
    t,
    "invoice-cancelled",
    invoiceId,
    entriesFrom(
      invoiceIssuedEntries(issued).map((e) => [e.account, e.debitCents ? -e.debitCents : e.creditCents!] as const),
    ),
  );
}

/** The highest other bidder on the lot (retracted bids aside), or undefined when there is none. */
async function findUnderbidder(t: Transaction, inv: UnpaidInvoice): Promise<Underbidder | undefined> {
  const [under] = await db().query<Underbidder>(
    `SELECT bidder_id, MAX(max_cents) AS max_cents FROM bids WHERE sale_lot_id = :sl AND retracted_at IS NULL AND bidder_id <> :buyer GROUP BY bidder_id ORDER BY MAX(max_cents) DESC LIMIT 1`,
    { replacements: { sl: inv.sale_lot_id, buyer: inv.buyer_id }, type: QueryTypes.SELECT, transaction: t },
  );
  return under;
}

/**
 * Issue the under-bidder a new invoice at their last bid (never above the old hammer), priced with the
 * sale's frozen settings and shipped and taxed to their own address, and post it to the ledger.
 */
async function issueSecondChanceInvoice(
  t: Transaction,
  invoiceId: string,
  inv: UnpaidInvoice,
  under: Underbidder,
): Promise<SecondChanceOffer> {
  const hammer = Math.min(under.max_cents, inv.hammer_cents);
  const settings = await settingsForInvoice(invoiceId, t);
  const destination = await addressOf(under.bidder_id, t);
  const origin = await addressOf(inv.consignor_id, t);
  const next = priceSoldLot({ hammerCents: hammer, tubes: inv.tube_count, origin, destination }, settings);
  const id = await issueInvoice(t, {
    saleLotId: inv.sale_lot_id,
    lotId: inv.lot_id,
    buyerId: under.bidder_id,
    consignorId: inv.consignor_id,
    priced: next,
    tubes: inv.tube_count,
    settingsVersion: inv.settings_version,
    buyerAddress: destination,
    originAddress: origin,
    dueDays: settings.payment.dueDays,
    secondChance: true,
  });
  return {
    offeredTo: under.bidder_id,
    newInvoiceId: id,
    total: next.totalCents,
    hammer,
    dueDays: settings.payment.dueDays,
  };
}

/** After commit: tell the under-bidder about the offer (a failed send is logged, not thrown). */
async function mailSecondChance(offer: SecondChanceOffer): Promise<void> {
  const u = await User.findByPk(offer.offeredTo, { attributes: ["email", "displayName"] });
  if (u) {
    await sendMail({
      to: u.email,
      subject: "A second chance at a lot you bid on",
      text: `Hello ${u.displayName},\n\nThe winner of a lot you bid on did not pay. The house offers it to you at your last bid, ${formatCents(offer.hammer)} hammer (${formatCents(offer.total)} with premium and shipping). If you want it, pay within ${offer.dueDays} days:\n\n${env().NEXTAUTH_URL}/invoices/${offer.newInvoiceId}\n\nIf not, simply let it lapse.\n\nGetterline Exchange`,
    }).catch((e: Error) => console.error("[mail] second chance failed", e.message));
  }
}

/**
 * The house cancels an invoice left unpaid past its due date (the ledger
 * posting is reversed) and, if asked, offers the lot to the under-bidder at
 * their last bid with a new invoice.
 */
export async function cancelUnpaid(
  invoiceId: string,
  offerToUnderbidder: boolean,
): Promise<{ cancelled: true; offeredTo: string | null; newInvoiceId: string | null }> {
  const out = await db().transaction(async (t): Promise<SecondChanceOffer | null> => {
    const inv = await lockOverdueInvoice(t, invoiceId);
    await cancelAndReverse(t, invoiceId, inv);
    if (!offerToUnderbidder) return null;
    const under = await findUnderbidder(t, inv);
    if (!under) return null;
    return issueSecondChanceInvoice(t, invoiceId, inv, under);
  });
  if (out && out.offeredTo && out.newInvoiceId) await mailSecondChance(out);
  return { cancelled: true, offeredTo: out?.offeredTo ?? null, newInvoiceId: out?.newInvoiceId ?? null };
}
