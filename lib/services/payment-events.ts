import { QueryTypes } from "sequelize";
import { paymentCapturedEntries } from "../money/ledger";
import { stripe } from "../stripe/client";
import type { ProcessorIntent } from "../validation/payments";
import { db } from "../../models";
import { post } from "./ledger";
import type { UnexpectedWhy } from "../money/unexpected";
import { recordUnexpectedCharge, refundUnexpectedCharge } from "./unexpected-charges";
import type { InvoiceRow } from "./invoice-rows";

/** What we did with one processor event: kept for audit on the event's row. */
export type EventOutcome = { outcome: "handled" | "ignored"; reason?: string };

type PaidInvoice = Pick<
  InvoiceRow,
  | "id"
  | "number"
  | "sale_lot_id"
  | "state"
  | "paid_at"
  | "payment_intent_id"
  | "hammer_cents"
  | "premium_cents"
  | "shipping_cents"
  | "tax_cents"
  | "total_cents"
>;

/**
 * The processor says a payment succeeded. The invoice it names is paid and the money held, once. A charge
 * the invoice does not owe (the invoice was already paid by another payment, the amount differs, or the
 * invoice is closed and another took its place) is recorded as unexpected, posted, and refunded at once
 * after the commit, so the buyer is never charged twice. Redeliveries change nothing.
 */
export async function recordPaymentSucceeded(pi: ProcessorIntent, invoiceId: string): Promise<EventOutcome> {
  const fee = await processorFee(pi).catch(() => 0);
  const s = db();
  const result = await s.transaction(async (t): Promise<EventOutcome & { unexpected?: boolean }> => {
    const [inv] = await s.query<PaidInvoice>(
      `SELECT id, number, sale_lot_id, state, paid_at, payment_intent_id, hammer_cents, premium_cents, shipping_cents, tax_cents, total_cents
         FROM invoices WHERE id = :invoiceId FOR UPDATE`,
      { replacements: { invoiceId }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!inv) return { outcome: "ignored", reason: `names invoice ${invoiceId}, which we do not have` };
    if (inv.paid_at && inv.payment_intent_id === pi.id)
      return { outcome: "ignored", reason: `payment already recorded on invoice ${inv.number}` };
    const why = await unexpectedWhy(inv, pi, t);
    if (why) {
      const fresh = await recordUnexpectedCharge(t, {
        invoiceId: inv.id,
        paymentIntentId: pi.id,
        chargeId: chargeId(pi),
        amountCents: pi.amount,
        feeCents: fee,
        why,
      });
      return {
        outcome: "handled",
        reason: `unexpected charge (${why}) on invoice ${inv.number}${fresh ? "" : ", already recorded"}: refunded automatically`,
        unexpected: true,
      };
    }
    await s.query(
      `UPDATE invoices SET state = 'paid-held', paid_at = now(), payment_intent_id = :pi, processor_fee_cents = :fee, last_payment_error = NULL, updated_at = now() WHERE id = :invoiceId`,
      { replacements: { pi: pi.id, fee, invoiceId }, transaction: t },
    );
    await post(
      t,
      "payment-captured",
      invoiceId,
      paymentCapturedEntries(
        {
          hammerCents: inv.hammer_cents,
          premiumCents: inv.premium_cents,
          shippingCents: inv.shipping_cents,
          taxableCents: 0,
          taxCents: inv.tax_cents,
          totalCents: inv.total_cents,
        },
        fee,
      ),
      pi.id,
    );
    return { outcome: "handled" };
  });
  if (result.unexpected)
    await refundUnexpectedCharge(pi.id).catch((e: Error) =>
      console.error("[payments] refund of an unexpected charge failed; the sweeper retries", e.message),
    );
  return { outcome: result.outcome, ...(result.reason ? { reason: result.reason } : {}) };
}

/** Why this successful payment is one the invoice does not owe, or null when it pays the invoice. */
async function unexpectedWhy(
  inv: PaidInvoice,
  pi: ProcessorIntent,
  t: import("sequelize").Transaction,
): Promise<UnexpectedWhy | null> {
  if (inv.paid_at) return "second-payment";
  if (inv.total_cents !== pi.amount) return "wrong-amount";
  if (inv.state === "awaiting-payment") return null;
  if (inv.state !== "cancelled") return "invoice-closed";
  // A cancelled invoice paid late is still paid, unless the lot has since been offered to someone else.
  const [other] = await db().query<{ id: string }>(
    `SELECT id FROM invoices WHERE sale_lot_id = :sl AND id <> :id AND state <> 'cancelled' LIMIT 1`,
    { replacements: { sl: inv.sale_lot_id, id: inv.id }, type: QueryTypes.SELECT, transaction: t },
  );
  return other ? "invoice-closed" : null;
}

/** A failed attempt is noted for the buyer; the invoice stays payable. */
export async function recordPaymentFailed(pi: ProcessorIntent, invoiceId: string): Promise<EventOutcome> {
  const [, meta] = (await db().query(
    `UPDATE invoices SET last_payment_error = :msg, updated_at = now() WHERE id = :invoiceId AND state = 'awaiting-payment' AND payment_intent_id = :pi`,
    {
      replacements: {
        msg: (pi.last_payment_error?.message ?? "The payment failed").slice(0, 300),
        invoiceId,
        pi: pi.id,
      },
    },
  )) as [unknown, { rowCount?: number }];
  return meta?.rowCount
    ? { outcome: "handled" }
    : { outcome: "ignored", reason: `invoice ${invoiceId} is not awaiting this payment` };
}

function chargeId(pi: ProcessorIntent): string | null {
  const c = pi.latest_charge;
  return typeof c === "string" ? c : (c?.id ?? null);
}

async function processorFee(pi: ProcessorIntent): Promise<number> {
  const id = chargeId(pi);
  if (!id) return 0;
  const charge = await stripe().charges.retrieve(id, { expand: ["balance_transaction"] });
  const bt = charge.balance_transaction;
  return bt && typeof bt !== "string" ? bt.fee : 0;
}
