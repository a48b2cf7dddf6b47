import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { can } from "../auth/roles";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { lotShippingCents, priceSoldLot } from "../money/settings-pricing";
import type { AddressBlock } from "../validation/address";
import { INITIAL_HOUSE_SETTINGS } from "../validation/house-settings";
import { db, User } from "../../models";
import { addressOf, invoiceAddressBlocks, invoiceHouseBlock } from "./addresses";
import { settingsVersion } from "./house-settings";
import { invoiceColumns, type InvoiceRow } from "./invoice-rows";
import { issueInvoice } from "./invoice-issue";
import { forgetComparables } from "./lot-summary";

/**
 * The invoice figures of the first settings version, for code that has no sale at hand. Sales read their own frozen
 * version (lib/services/house-settings.ts); these stay equal to version 1.
 */
export const INVOICE_SETTINGS = {
  dueDays: INITIAL_HOUSE_SETTINGS.payment.dueDays,
  /** Packed weight per tube, grams: the tube, its box and cushioning [SUG, house figure]. */
  gramsPerTube: INITIAL_HOUSE_SETTINGS.shipping.gramsPerTube,
  zone: INITIAL_HOUSE_SETTINGS.shipping.sameCountryZone,
};

/** Domestic shipping for a lot under the first settings version (sales price by zone from their own version). */
export function shippingFor(tubes: number): number {
  return lotShippingCents(INITIAL_HOUSE_SETTINGS.shipping, tubes, INVOICE_SETTINGS.zone);
}

export type { InvoiceRow } from "./invoice-rows";

/**
 * Invoice a sold lot once, by the settings version frozen on its sale: hammer, buyer's premium, shipping by zone from
 * the consignor's address to the buyer's over the weight bands, tax by the destination's rule (none without one);
 * the commission is fixed now from the version's tiers, and both addresses are copied onto the invoice. Posts the invoice to the ledger in the same
 * transaction and e-mails the buyer. Calling it again changes nothing.
 */
export async function invoiceSoldLot(saleLotId: string): Promise<string | null> {
  const s = db();
  const created = await s.transaction(async (t) => {
    const [sl] = await s.query<{
      id: string;
      lot_id: string;
      buyer_id: string | null;
      consignor_id: string;
      hammer_cents: number | null;
      phase: string;
      tubes: string;
      settings_version: number;
    }>(
      `SELECT sl.id, sl.lot_id, sl.buyer_id, sl.consignor_id, sl.hammer_cents, sl.phase, s.settings_version,
              (SELECT COALESCE(SUM(quantity), 0) FROM lot_items WHERE lot_id = sl.lot_id) AS tubes
         FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id WHERE sl.id = :saleLotId FOR UPDATE OF sl`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!sl || sl.phase !== "sold" || !sl.buyer_id || sl.hammer_cents == null) return null;
    const [existing] = await s.query<{ id: string }>(`SELECT id FROM invoices WHERE sale_lot_id = :saleLotId`, {
      replacements: { saleLotId },
      type: QueryTypes.SELECT,
      transaction: t,
    });
    if (existing) return null; // invoiced already (a second-chance invoice is written by offerToUnderbidder)
    const tubes = Number(sl.tubes);
    const settings = await settingsVersion(sl.settings_version, t);
    const destination = await addressOf(sl.buyer_id, t);
    const origin = await addressOf(sl.consignor_id, t);
    const inv = priceSoldLot({ hammerCents: sl.hammer_cents, tubes, origin, destination }, settings);
    const id = await issueInvoice(t, {
      saleLotId,
      lotId: sl.lot_id,
      buyerId: sl.buyer_id,
      consignorId: sl.consignor_id,
      priced: inv,
      tubes,
      settingsVersion: sl.settings_version,
      buyerAddress: destination,
      originAddress: origin,
      dueDays: settings.payment.dueDays,
      secondChance: false,
    });
    return { id, buyerId: sl.buyer_id, total: inv.totalCents, dueDays: settings.payment.dueDays };
  });
  if (!created) return null;
  forgetComparables(); // a new sale for estimates and price history
  const buyer = await User.findByPk(created.buyerId, { attributes: ["email", "displayName"] });
  if (buyer) {
    await sendMail({
      to: buyer.email,
      subject: "Your Getterline invoice",
      text: `Hello ${buyer.displayName},\n\nYour invoice for the lot you won is ready: ${formatCents(created.total)} due within ${created.dueDays} days.\nThe house holds your payment until you have received and inspected the tubes.\n\nPay: ${env().NEXTAUTH_URL}/invoices/${created.id}\n\nGetterline Exchange`,
    }).catch((e: Error) => console.error("[mail] invoice failed", e.message));
  }
  return created.id;
}

/** One invoice, for its buyer, its consignor (without buyer details) or the house. */
export async function getInvoice(viewer: Viewer, invoiceId: string) {
  const [inv] = await db().query<InvoiceRow & { title: string; sale_id: string; dispute_id: string | null }>(
    `SELECT ${invoiceColumns("i")}, l.title, sl.sale_id, (SELECT id FROM disputes WHERE invoice_id = i.id) AS dispute_id,
            (SELECT COALESCE(jsonb_agg(jsonb_build_object('amountCents', u.amount_cents, 'state', u.state, 'refundedAt', u.refunded_at) ORDER BY u.detected_at), '[]'::jsonb)
               FROM unexpected_charges u WHERE u.invoice_id = i.id) AS unexpected
       FROM invoices i JOIN lots l ON l.id = i.lot_id JOIN sale_lots sl ON sl.id = i.sale_lot_id WHERE i.id = :invoiceId`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT },
  );
  const house = viewer.roles.includes("admin");
  if (!inv) throw new ApiError("not_found", "No such invoice");
  const from = await invoiceHouseBlock(invoiceId);
  if (house || inv.buyer_id === viewer.id || inv.consignor_id === viewer.id) return presentInvoice(inv, viewer, from);
  // A mediator reads (never changes) the invoice of a case they mediate; any other invoice stays hidden.
  if (can(viewer.roles, "disputes.mediate") && inv.dispute_id) {
    const [mediated] = await db().query(`SELECT 1 FROM disputes WHERE id = :d AND mediator_id = :me`, {
      replacements: { d: inv.dispute_id, me: viewer.id },
      type: QueryTypes.SELECT,
    });
    if (mediated) return { ...presentInvoice(inv, viewer, from), readOnly: true as const };
  }
  throw new ApiError("not_found", "No such invoice");
}

/** A charge this invoice did not owe, refunded automatically (lib/services/unexpected-charges.ts). */
type UnexpectedOnInvoice = { amountCents: number; state: "refund-due" | "refunded"; refundedAt: string | null };

export function presentInvoice(
  inv: InvoiceRow & {
    title?: string;
    sale_id?: string;
    dispute_id?: string | null;
    unexpected?: UnexpectedOnInvoice[];
  },
  viewer: Viewer,
  /** The house as sender (its details in the invoice's settings version); lists leave it out. */
  from: AddressBlock | null = null,
) {
  const buyerView = viewer.roles.includes("admin") || inv.buyer_id === viewer.id;
  return {
    id: inv.id,
    number: inv.number,
    title: inv.title ?? "",
    saleId: inv.sale_id,
    saleLotId: inv.sale_lot_id,
    lotId: inv.lot_id,
    state: inv.state,
    hammerCents: inv.hammer_cents,
    premiumBp: inv.premium_bp,
    premiumCents: inv.premium_cents,
    shippingCents: inv.shipping_cents,
    taxCents: inv.tax_cents,
    taxBp: inv.tax_bp,
    shippingZone: inv.shipping_zone,
    totalCents: inv.total_cents,
    tubeCount: inv.tube_count,
    dueAt: inv.due_at.toISOString(),
    paidAt: inv.paid_at?.toISOString() ?? null,
    carrier: inv.carrier,
    tracking: inv.tracking,
    shippedAt: inv.shipped_at?.toISOString() ?? null,
    deliveredAt: inv.delivered_at?.toISOString() ?? null,
    inspectionEndsAt: inv.inspection_ends_at?.toISOString() ?? null,
    releasedAt: inv.released_at?.toISOString() ?? null,
    lastPaymentError: buyerView ? inv.last_payment_error : null,
    isBuyer: inv.buyer_id === viewer.id,
    isConsignor: inv.consignor_id === viewer.id,
    commissionCents: buyerView && !viewer.roles.includes("admin") ? undefined : inv.commission_cents,
    refundedCents: inv.hammer_refunded_cents + inv.premium_refunded_cents,
    commissionReturnedCents: buyerView && !viewer.roles.includes("admin") ? undefined : inv.commission_returned_cents,
    disputeId: inv.dispute_id ?? null,
    // The consignor sees where the lot goes (they ship it); the buyer sees where it comes from.
    addresses: { ...shownAddresses(inv, viewer), house: from },
    unexpectedCharges: buyerView ? (inv.unexpected ?? []) : [],
  };
}

/** The buyer's address for every party; where the lot ships from only for the house and the consignor. */
function shownAddresses(inv: InvoiceRow, viewer: Viewer) {
  const blocks = invoiceAddressBlocks(inv);
  const seesOrigin = viewer.roles.includes("admin") || inv.consignor_id === viewer.id;
  return { buyer: blocks.buyer, origin: seesOrigin ? blocks.origin : null };
}

/** Invoices the viewer is party to (the house sees all). */
export async function listInvoices(viewer: Viewer) {
  const house = viewer.roles.includes("admin");
  const rows = await db().query<InvoiceRow & { title: string; sale_id: string }>(
    `SELECT ${invoiceColumns("i")}, l.title, sl.sale_id, (SELECT id FROM disputes WHERE invoice_id = i.id) AS dispute_id FROM invoices i JOIN lots l ON l.id = i.lot_id JOIN sale_lots sl ON sl.id = i.sale_lot_id
      ${house ? "" : "WHERE i.buyer_id = :me OR i.consignor_id = :me"} ORDER BY i.created_at DESC LIMIT 500`,
    { replacements: { me: viewer.id }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => presentInvoice(r, viewer));
}

/**
 * Reminders for unpaid invoices: one some days before the due date (the sale's frozen settings say how many; 2 in
 * version 1), one when it is overdue. Each is sent once (the count is kept on the invoice).
 */
export async function sendReminders(): Promise<number> {
  const due = await db().query<{
    id: string;
    number: string;
    buyer_id: string;
    total_cents: number;
    due_at: Date;
    reminders_sent: number;
  }>(
    `UPDATE invoices i SET reminders_sent = i.reminders_sent + 1, updated_at = now()
       FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id
       JOIN house_settings_versions v ON v.version = s.settings_version
      WHERE sl.id = i.sale_lot_id AND i.state = 'awaiting-payment'
        AND ((i.reminders_sent = 0
              AND i.due_at - make_interval(days => (v.settings->'payment'->>'reminderDaysBefore')::int) <= now())
          OR (i.reminders_sent = 1 AND i.due_at <= now()))
      RETURNING i.id, i.number, i.buyer_id, i.total_cents, i.due_at, i.reminders_sent`,
    { type: QueryTypes.SELECT },
  );
  for (const inv of due) {
    const u = await User.findByPk(inv.buyer_id, { attributes: ["email", "displayName"] });
    if (!u) continue;
    const overdue = inv.reminders_sent >= 2;
    await sendMail({
      to: u.email,
      subject: overdue ? `Overdue: invoice ${inv.number}` : `Reminder: invoice ${inv.number} is due soon`,
      text: `Hello ${u.displayName},\n\nInvoice ${inv.number} for ${formatCents(inv.total_cents)} ${overdue ? "is now overdue; the house may cancel it and offer the lot to the under-bidder" : `is due on ${inv.due_at.toUTCString()}`}.\n\nPay: ${env().NEXTAUTH_URL}/invoices/${inv.id}\n\nGetterline Exchange`,
    }).catch((e: Error) => console.error("[mail] reminder failed", e.message));
  }
  return due.length;
}
