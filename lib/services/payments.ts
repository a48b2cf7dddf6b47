import { QueryTypes } from "sequelize";
import type Stripe from "stripe";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { paymentCapturedEntries } from "../money/ledger";
import { stripe, stripeConfig } from "../stripe/client";
import type { CardPayment } from "../validation/payments";
import { db } from "../../models";
import type { InvoiceRow } from "./invoices";
import { post } from "./ledger";

export type PayOutcome =
  | { status: "succeeded" }
  | { status: "requires_action"; redirectUrl: string }
  | { status: "processing" };

/**
 * The buyer pays an invoice: a PaymentMethod is created from the card (the
 * card data passes through memory only), then a PaymentIntent is created and
 * confirmed with business idempotency keys. Payment state itself changes only
 * when the processor's webhook arrives.
 */
export async function payInvoice(viewer: Viewer, invoiceId: string, card: CardPayment): Promise<PayOutcome> {
  const [inv] = await db().query<InvoiceRow>(`SELECT * FROM invoices WHERE id = :invoiceId`, { replacements: { invoiceId }, type: QueryTypes.SELECT });
  if (!inv || inv.buyer_id !== viewer.id) throw new ApiError("not_found", "No such invoice");
  if (inv.state !== "awaiting-payment") throw new ApiError("conflict", "This invoice is already paid or closed");
  const sdk = stripe();
  let pm: Stripe.PaymentMethod;
  try {
    pm = await sdk.paymentMethods.create(
      { type: "card", card: { number: card.number, exp_month: card.expMonth, exp_year: card.expYear, cvc: card.cvc } },
      { idempotencyKey: `invoice:${inv.id}:pm:${card.attemptKey}` },
    );
  } catch (e) {
    throw new ApiError("validation_failed", (e as Stripe.errors.StripeError).message ?? "The card was not accepted", { number: "Check the card details" });
  }
  try {
    const pi = await sdk.paymentIntents.create(
      {
        amount: inv.total_cents, currency: stripeConfig().CURRENCY, payment_method: pm.id, confirm: true,
        return_url: `${env().NEXTAUTH_URL}/invoices/${inv.id}?returned=1`,
        metadata: { invoice_id: inv.id, invoice_number: inv.number }, transfer_group: `invoice:${inv.id}`,
      },
      { idempotencyKey: `invoice:${inv.id}:pay:${card.attemptKey}` },
    );
    await db().query(`UPDATE invoices SET payment_intent_id = :pi, last_payment_error = NULL, updated_at = now() WHERE id = :id AND state = 'awaiting-payment'`, { replacements: { pi: pi.id, id: inv.id } });
    if (pi.status === "succeeded") return { status: "succeeded" };
    if (pi.status === "requires_action") {
      const next = pi.next_action;
      const url = next?.redirect_to_url?.url ?? (next as { use_stripe_sdk?: { stripe_js?: string } } | null)?.use_stripe_sdk?.stripe_js;
      if (!url) throw new ApiError("internal", "The card asks for authentication we cannot show");
      return { status: "requires_action", redirectUrl: url };
    }
    return { status: "processing" };
  } catch (e) {
    if (e instanceof ApiError) throw e;
    const err = e as Stripe.errors.StripeError;
    if (err.type === "StripeCardError") {
      await db().query(`UPDATE invoices SET last_payment_error = :msg, updated_at = now() WHERE id = :id`, { replacements: { msg: (err.message ?? "Declined").slice(0, 300), id: inv.id } });
      throw new ApiError("conflict", `The card was declined: ${err.message ?? "no reason given"}. Try another card.`, undefined, undefined, { declineCode: err.decline_code ?? err.code ?? null });
    }
    throw e;
  }
}

/** The processor says the payment succeeded: the invoice is paid and the money held. Idempotent. */
export async function recordPaymentSucceeded(pi: Stripe.PaymentIntent): Promise<boolean> {
  const invoiceId = pi.metadata?.invoice_id;
  if (!invoiceId) return false;
  const fee = await processorFee(pi).catch(() => 0);
  const s = db();
  return s.transaction(async (t) => {
    const [inv] = await s.query<InvoiceRow>(`SELECT * FROM invoices WHERE id = :invoiceId FOR UPDATE`, { replacements: { invoiceId }, type: QueryTypes.SELECT, transaction: t });
    if (!inv || inv.total_cents !== pi.amount) return false;
    if (inv.state !== "awaiting-payment" && inv.state !== "cancelled") return false; // already moved on: a redelivery or a late event
    await s.query(`UPDATE invoices SET state = 'paid-held', paid_at = now(), payment_intent_id = :pi, processor_fee_cents = :fee, last_payment_error = NULL, updated_at = now() WHERE id = :invoiceId`,
      { replacements: { pi: pi.id, fee, invoiceId }, transaction: t });
    return post(t, "payment-captured", invoiceId, paymentCapturedEntries({
      hammerCents: inv.hammer_cents, premiumCents: inv.premium_cents, shippingCents: inv.shipping_cents, taxableCents: 0, taxCents: inv.tax_cents, totalCents: inv.total_cents,
    }, fee), pi.id);
  });
}

/** A failed attempt is noted for the buyer; the invoice stays payable. */
export async function recordPaymentFailed(pi: Stripe.PaymentIntent): Promise<void> {
  const invoiceId = pi.metadata?.invoice_id;
  if (!invoiceId) return;
  await db().query(`UPDATE invoices SET last_payment_error = :msg, updated_at = now() WHERE id = :invoiceId AND state = 'awaiting-payment'`,
    { replacements: { msg: (pi.last_payment_error?.message ?? "The payment failed").slice(0, 300), invoiceId } });
}

async function processorFee(pi: Stripe.PaymentIntent): Promise<number> {
  const chargeId = typeof pi.latest_charge === "string" ? pi.latest_charge : pi.latest_charge?.id;
  if (!chargeId) return 0;
  const charge = await stripe().charges.retrieve(chargeId, { expand: ["balance_transaction"] });
  const bt = charge.balance_transaction;
  return bt && typeof bt !== "string" ? bt.fee : 0;
}
