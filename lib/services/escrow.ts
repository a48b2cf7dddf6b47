import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { inspectionWindowEnd } from "../money/inspection";
import { escrowReleasedEntries, payoutSentEntries } from "../money/ledger";
import { stripe, stripeConfig } from "../stripe/client";
import { settingsForInvoice } from "./house-settings";
import { notify } from "./notices";
import { db, User } from "../../models";
import type { InvoiceState } from "../money/invoice-states";
import { findInvoice, type InvoiceRow } from "./invoice-rows";
import type { SaleLotRow } from "./sale-lot-rows";
import { post } from "./ledger";
import { statementCsv, statementFor, statementPdf } from "./statements";

/** Move an invoice from one state to the next under its row lock; 409 from any other state. */
async function step(
  invoiceId: string,
  from: InvoiceState,
  fn: (inv: InvoiceRow, t: import("sequelize").Transaction) => Promise<void>,
) {
  const s = db();
  return s.transaction(async (t) => {
    const inv = await findInvoice(invoiceId, { transaction: t, lock: true });
    if (!inv) throw new ApiError("not_found", "No such invoice");
    if (inv.state !== from)
      throw new ApiError("conflict", `The invoice is ${inv.state}, not ${from}`, undefined, undefined, {
        state: inv.state,
      });
    await fn(inv, t);
    return inv;
  });
}

/** The house records the shipment (carrier and tracking number). */
export async function markShipped(invoiceId: string, carrier: string, tracking: string): Promise<void> {
  const inv = await step(invoiceId, "paid-held", async (_i, t) => {
    await db().query(
      `UPDATE invoices SET state = 'shipped', carrier = :carrier, tracking = :tracking, shipped_at = now(), updated_at = now() WHERE id = :invoiceId`,
      { replacements: { carrier, tracking, invoiceId }, transaction: t },
    );
  });
  await mailParty(
    inv.buyer_id,
    "Your tubes are on their way",
    `Your lot (invoice ${inv.number}) has shipped with ${carrier}, tracking ${tracking}.`,
  );
}

/**
 * The house records delivery; the inspection window starts (the sale's frozen settings: 7 days + 1 per 25 tubes, at
 * most 21, in version 1).
 */
export async function markDelivered(invoiceId: string): Promise<Date> {
  let ends = new Date();
  const { inspection, claims } = await settingsForInvoice(invoiceId);
  const rule = { ...inspection, breakageClaimHours: claims.breakageClaimHours };
  const inv = await step(invoiceId, "shipped", async (i, t) => {
    ends = new Date(inspectionWindowEnd(Date.now(), i.tube_count, rule));
    await db().query(
      `UPDATE invoices SET state = 'delivered', delivered_at = now(), inspection_ends_at = :ends, updated_at = now() WHERE id = :invoiceId`,
      { replacements: { ends, invoiceId }, transaction: t },
    );
  });
  await mailParty(
    inv.buyer_id,
    "Delivered: your inspection window is open",
    `Invoice ${inv.number} is marked delivered. Inspect and test the tubes by ${ends.toUTCString()}; open a claim before then if anything is not as listed. Otherwise the house pays the consignor at the end of the window.`,
  );
  return ends;
}

/** The buyer accepts the lot before the window ends: release at once. */
export async function acceptDelivery(viewer: Viewer, invoiceId: string): Promise<void> {
  const inv = await findInvoice(invoiceId);
  if (!inv || inv.buyer_id !== viewer.id) throw new ApiError("not_found", "No such invoice");
  if (!(await release(invoiceId, "accepted by the buyer"))) {
    const [now] = await db().query<{ state: string; released_at: Date | null }>(
      `SELECT state, released_at FROM invoices WHERE id = :invoiceId`,
      { replacements: { invoiceId }, type: QueryTypes.SELECT },
    );
    throw new ApiError(
      "conflict",
      now?.released_at
        ? `You accepted this lot already: payment was released to the consignor on ${now.released_at.toISOString().slice(0, 10)}`
        : "This lot cannot be accepted now",
      undefined,
      undefined,
      { state: now?.state ?? inv.state },
    );
  }
}

/** The user's connected payout account at the processor, made on first use (keyed by user). */
export async function payoutAccount(userId: string): Promise<string> {
  const [row] = await db().query<{ stripe_account_id: string }>(
    `SELECT stripe_account_id FROM payout_accounts WHERE user_id = :userId`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
  if (row) return row.stripe_account_id;
  const user = await User.findByPk(userId, { attributes: ["email", "displayName"] });
  const acct = await stripe().accounts.create(
    {
      type: "custom",
      email: user?.email,
      capabilities: { transfers: { requested: true } },
      metadata: { user_id: userId },
    },
    { idempotencyKey: `payout-account:${userId}` },
  );
  await db().query(
    `INSERT INTO payout_accounts (user_id, stripe_account_id, created_at) VALUES (:userId, :acct, now()) ON CONFLICT DO NOTHING`,
    { replacements: { userId, acct: acct.id } },
  );
  const [again] = await db().query<{ stripe_account_id: string }>(
    `SELECT stripe_account_id FROM payout_accounts WHERE user_id = :userId`,
    { replacements: { userId }, type: QueryTypes.SELECT },
  );
  return again!.stripe_account_id;
}

/**
 * Release escrow: transfer the consignor's payout (what is left of the hammer
 * after refunds, less the commission still charged) to their connected
 * account with a key tied to the invoice, then, in one transaction, post the
 * release and the payout and mark the invoice released. A retry finds the
 * same transfer and posts nothing twice. A disputed invoice is released only
 * by its case's decision (`fromDispute`).
 */
export async function release(invoiceId: string, why: string, opts: { fromDispute?: boolean } = {}): Promise<boolean> {
  const inv = await findInvoice(invoiceId);
  if (!inv) throw new ApiError("not_found", "No such invoice");
  if (inv.state === "released") return false;
  const releasable = (state: InvoiceState) =>
    state === "delivered" || (opts.fromDispute === true && state === "disputed");
  if (!releasable(inv.state)) {
    throw new ApiError(
      "conflict",
      inv.state === "disputed"
        ? "A claim is open on this lot: payment stays held until it is decided"
        : `The invoice is ${inv.state}; escrow is released only after delivery`,
    );
  }
  const left = remainingFigures(inv);
  const payout = left.hammerCents - left.commissionCents;
  const account = payout > 0 ? await payoutAccount(inv.consignor_id) : null;
  const transfer = account
    ? await stripe().transfers.create(
        {
          amount: payout,
          currency: stripeConfig().CURRENCY,
          destination: account,
          transfer_group: `invoice:${inv.id}`,
          metadata: { invoice_id: inv.id },
        },
        { idempotencyKey: `invoice:${inv.id}:release` },
      )
    : null;
  const released = await db().transaction(async (t) => {
    const locked = await findInvoice(invoiceId, { transaction: t, lock: true });
    if (!locked || !releasable(locked.state)) return false;
    if (left.hammerCents + left.premiumCents > 0)
      await post(t, "escrow-released", invoiceId, escrowReleasedEntries(left));
    if (transfer) await post(t, "payout-sent", invoiceId, payoutSentEntries(payout), transfer.id);
    await db().query(
      `UPDATE invoices SET state = 'released', released_at = now(), transfer_id = :tr, updated_at = now() WHERE id = :invoiceId`,
      { replacements: { tr: transfer?.id ?? null, invoiceId }, transaction: t },
    );
    return true;
  });
  if (released)
    await mailStatement(inv, left, payout, why).catch((e: Error) =>
      console.error("[mail] statement failed", e.message),
    );
  return released;
}

/** What is left of a sale to release after the refunds already paid on it and any undisputed share released early. */
export function remainingFigures(
  inv: Pick<
    InvoiceRow,
    | "hammer_cents"
    | "premium_cents"
    | "commission_cents"
    | "hammer_refunded_cents"
    | "premium_refunded_cents"
    | "commission_returned_cents"
    | "released_hammer_cents"
    | "released_premium_cents"
    | "released_commission_cents"
  >,
) {
  return {
    hammerCents: inv.hammer_cents - inv.hammer_refunded_cents - inv.released_hammer_cents,
    premiumCents: inv.premium_cents - inv.premium_refunded_cents - inv.released_premium_cents,
    commissionCents: inv.commission_cents - inv.commission_returned_cents - inv.released_commission_cents,
  };
}

/**
 * Release the undisputed share of a disputed invoice early [SUG]:
 * once per invoice, the consignor is paid that share's hammer less its
 * commission, and the premium and commission on it become house revenue; the
 * rest stays held for the claim. Returns the payout in cents, and whether this
 * call released it (false when it was released before).
 */
export async function releaseUndisputed(
  invoiceId: string,
  share: { hammerCents: number; premiumCents: number; commissionCents: number },
  why: string,
): Promise<{ payoutCents: number; done: boolean }> {
  const inv = await findInvoice(invoiceId);
  if (!inv) throw new ApiError("not_found", "No such invoice");
  if (inv.state !== "disputed")
    throw new ApiError("conflict", "Only a lot under a claim has an undisputed share to release early");
  const payout = share.hammerCents - share.commissionCents;
  if (inv.released_hammer_cents > 0 || inv.released_premium_cents > 0)
    return { payoutCents: inv.released_hammer_cents - inv.released_commission_cents, done: false }; // done already
  if (share.hammerCents + share.premiumCents === 0) return { payoutCents: 0, done: true };
  const account = payout > 0 ? await payoutAccount(inv.consignor_id) : null;
  const transfer = account
    ? await stripe().transfers.create(
        {
          amount: payout,
          currency: stripeConfig().CURRENCY,
          destination: account,
          transfer_group: `invoice:${inv.id}`,
          metadata: { invoice_id: inv.id, share: "undisputed" },
        },
        { idempotencyKey: `invoice:${inv.id}:release-undisputed` },
      )
    : null;
  const done = await db().transaction(async (t) => {
    const locked = await findInvoice(invoiceId, { transaction: t, lock: true });
    if (!locked || locked.state !== "disputed" || locked.released_hammer_cents > 0 || locked.released_premium_cents > 0)
      return false;
    await post(t, "escrow-released-undisputed", invoiceId, escrowReleasedEntries(share));
    if (transfer) await post(t, "payout-sent-undisputed", invoiceId, payoutSentEntries(payout), transfer.id);
    await db().query(
      `UPDATE invoices SET released_hammer_cents = :h, released_premium_cents = :p, released_commission_cents = :c, updated_at = now() WHERE id = :invoiceId`,
      {
        replacements: { h: share.hammerCents, p: share.premiumCents, c: share.commissionCents, invoiceId },
        transaction: t,
      },
    );
    return true;
  });
  if (done) {
    await mailParty(
      inv.consignor_id,
      "Part of your payment is released",
      `A claim is open on invoice ${inv.number}. The share of the lot it does not touch is released now (${why}): ${formatCents(payout)} is on its way to your payout account (hammer ${formatCents(share.hammerCents)} less commission ${formatCents(share.commissionCents)}). The rest stays held until the claim is decided.`,
    );
  }
  return { payoutCents: payout, done };
}

/** Release every delivered invoice whose inspection window has ended without a claim. */
export async function releaseDue(): Promise<number> {
  const due = await db().query<{ id: string }>(
    `SELECT id FROM invoices WHERE state = 'delivered' AND inspection_ends_at <= now() LIMIT 50`,
    { type: QueryTypes.SELECT },
  );
  let n = 0;
  for (const d of due)
    if (
      await release(d.id, "inspection window ended").catch((e: Error) => {
        console.error("[escrow] release failed", e.message);
        return false;
      })
    )
      n++;
  return n;
}

/** The consignor's statement for the sale, attached as PDF and CSV, with the release explained. */
async function mailStatement(
  inv: InvoiceRow,
  left: ReturnType<typeof remainingFigures>,
  payout: number,
  why: string,
): Promise<void> {
  const u = await User.findByPk(inv.consignor_id, { attributes: ["id", "email", "displayName", "roles"] });
  if (!u) return;
  const [sl] = await db().query<Pick<SaleLotRow, "sale_id">>(`SELECT sale_id FROM sale_lots WHERE id = :id`, {
    replacements: { id: inv.sale_lot_id },
    type: QueryTypes.SELECT,
  });
  const viewer = { id: u.id, email: u.email, name: u.displayName, roles: [...u.roles] };
  const st = await statementFor(viewer, sl!.sale_id);
  await sendMail({
    to: u.email,
    subject: "You have been paid: settlement statement",
    text: `Hello ${u.displayName},\n\nEscrow for invoice ${inv.number} is released (${why}). ${formatCents(payout)} is on its way to your payout account: hammer ${formatCents(left.hammerCents)} less commission ${formatCents(left.commissionCents)}${left.hammerCents !== inv.hammer_cents ? ` (after a refund to the buyer of ${formatCents(inv.hammer_cents - left.hammerCents)} of the hammer price, with the commission on it given back)` : ""}.\n\nYour statement for the sale is attached (PDF and CSV), and downloadable any time from ${env().NEXTAUTH_URL}/invoices/${inv.id}.\n\nGetterline Exchange`,
    attachments: [
      { filename: "statement.pdf", content: await statementPdf(st), contentType: "application/pdf" },
      { filename: "statement.csv", content: statementCsv(st), contentType: "text/csv" },
    ],
  });
}

async function mailParty(userId: string, subject: string, body: string): Promise<void> {
  await notify(userId, subject, null).catch((e: Error) => console.error("[notice]", e.message));
  const u = await User.findByPk(userId, { attributes: ["email", "displayName"] });
  if (!u) return;
  await sendMail({ to: u.email, subject, text: `Hello ${u.displayName},\n\n${body}\n\nGetterline Exchange` }).catch(
    (e: Error) => console.error("[mail]", e.message),
  );
}
