import { QueryTypes, type Transaction } from "sequelize";
import type Stripe from "stripe";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { ATTEMPT_REFUSALS, nextAttemptStep, type IntentStatus } from "../money/payment-attempt";
import { stripe, stripeConfig } from "../stripe/client";
import type { CardPayment } from "../validation/payments";
import { db } from "../../models";
import type { InvoiceState } from "../money/invoice-states";
import type { InvoiceRow } from "./invoice-rows";

export type PayOutcome =
  { status: "succeeded" } | { status: "requires_action"; redirectUrl: string } | { status: "processing" };

type PayableInvoice = Pick<InvoiceRow, "id" | "number" | "buyer_id" | "state" | "total_cents" | "payment_intent_id">;

const PAYABLE_COLUMNS = "id, number, buyer_id, state, total_cents, payment_intent_id";

function notPayable(state: InvoiceState): ApiError {
  const paid = state !== "cancelled";
  return new ApiError(
    "conflict",
    paid ? ATTEMPT_REFUSALS.paid : "This invoice was cancelled and can no longer be paid.",
    undefined,
    undefined,
    { state, reason: paid ? "already-paid" : "cancelled" },
  );
}

/**
 * The buyer pays an invoice by card. The card becomes a PaymentMethod (the card data passes through memory
 * only; the key is the attempt's, so a retried request makes one method). Then, under the invoice's row
 * lock, the invoice's one PaymentIntent (created once, with a key derived from the invoice) is read fresh
 * from the processor and the attempt takes the step `nextAttemptStep` gives: confirm the intent with this
 * method (which supersedes an authentication another attempt left pending), send the buyer back to their
 * own pending check, answer from a charge already made, or refuse in words. Two tabs, two devices or a
 * retry can therefore never charge one invoice twice. Payment state itself changes only when the
 * processor's webhook arrives.
 */
export async function payInvoice(viewer: Viewer, invoiceId: string, card: CardPayment): Promise<PayOutcome> {
  const [inv] = await db().query<PayableInvoice>(`SELECT ${PAYABLE_COLUMNS} FROM invoices WHERE id = :invoiceId`, {
    replacements: { invoiceId },
    type: QueryTypes.SELECT,
  });
  if (!inv || inv.buyer_id !== viewer.id) throw new ApiError("not_found", "No such invoice");
  if (inv.state !== "awaiting-payment") throw notPayable(inv.state);
  const sdk = stripe();
  let pm: Stripe.PaymentMethod;
  try {
    pm = await sdk.paymentMethods.create(
      { type: "card", card: { number: card.number, exp_month: card.expMonth, exp_year: card.expYear, cvc: card.cvc } },
      { idempotencyKey: `invoice:${inv.id}:pm:${card.attemptKey}` },
    );
  } catch (e) {
    throw new ApiError("validation_failed", (e as Stripe.errors.StripeError).message ?? "The card was not accepted", {
      number: "Check the card details",
    });
  }
  const s = db();
  const result = await s.transaction(async (t): Promise<PayOutcome | { refusal: ApiError }> => {
    const [locked] = await s.query<PayableInvoice>(
      `SELECT ${PAYABLE_COLUMNS} FROM invoices WHERE id = :invoiceId FOR UPDATE`,
      { replacements: { invoiceId }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!locked || locked.state !== "awaiting-payment") throw notPayable(locked?.state ?? "cancelled");
    const current = locked.payment_intent_id ? await sdk.paymentIntents.retrieve(locked.payment_intent_id) : null;
    const step = nextAttemptStep(
      current && { status: current.status as IntentStatus, paymentMethodId: methodId(current) },
      pm.id,
    );
    switch (step.kind) {
      case "paid":
        return { status: "succeeded" as const };
      case "paid-by-other-attempt":
        throw new ApiError("conflict", ATTEMPT_REFUSALS.paid, undefined, undefined, {
          state: locked.state,
          reason: "already-paid",
        });
      case "in-progress":
        throw new ApiError("conflict", ATTEMPT_REFUSALS.inProgress, undefined, undefined, {
          state: locked.state,
          reason: "in-progress",
        });
      case "authenticate":
        return answer(current!);
      case "confirm":
        return confirmIntent(t, locked, current!, pm.id);
      case "create-and-confirm":
        return confirmIntent(t, locked, await createIntent(t, locked, current), pm.id);
    }
  });
  if ("refusal" in result) throw result.refusal; // after the commit, which keeps the decline on the invoice
  return result;
}

function methodId(pi: Stripe.PaymentIntent): string | null {
  return typeof pi.payment_method === "string" ? pi.payment_method : (pi.payment_method?.id ?? null);
}

function returnUrl(invoiceId: string): string {
  return `${env().NEXTAUTH_URL}/invoices/${invoiceId}?returned=1`;
}

/** The invoice's intent, made once: the key is the invoice's (and the cancelled intent's, should one be replaced). */
async function createIntent(
  t: Transaction,
  inv: PayableInvoice,
  replaced: Stripe.PaymentIntent | null,
): Promise<Stripe.PaymentIntent> {
  const pi = await stripe().paymentIntents.create(
    {
      amount: inv.total_cents,
      currency: stripeConfig().CURRENCY,
      return_url: returnUrl(inv.id),
      metadata: { invoice_id: inv.id, invoice_number: inv.number },
      transfer_group: `invoice:${inv.id}`,
    },
    { idempotencyKey: replaced ? `invoice:${inv.id}:intent:after:${replaced.id}` : `invoice:${inv.id}:intent` },
  );
  await db().query(`UPDATE invoices SET payment_intent_id = :pi, updated_at = now() WHERE id = :id`, {
    replacements: { pi: pi.id, id: inv.id },
    transaction: t,
  });
  return pi;
}

/** Confirm the invoice's intent with this attempt's method; a decline is kept on the invoice for the buyer. */
async function confirmIntent(
  t: Transaction,
  inv: PayableInvoice,
  pi: Stripe.PaymentIntent,
  pmId: string,
): Promise<PayOutcome | { refusal: ApiError }> {
  try {
    const confirmed = await stripe().paymentIntents.confirm(
      pi.id,
      { payment_method: pmId, return_url: returnUrl(inv.id) },
      { idempotencyKey: `invoice:${inv.id}:confirm:${pmId}` },
    );
    await db().query(`UPDATE invoices SET last_payment_error = NULL, updated_at = now() WHERE id = :id`, {
      replacements: { id: inv.id },
      transaction: t,
    });
    return answer(confirmed);
  } catch (e) {
    const err = e as Stripe.errors.StripeError;
    if (err.type !== "StripeCardError") throw e;
    await db().query(`UPDATE invoices SET last_payment_error = :msg, updated_at = now() WHERE id = :id`, {
      replacements: { msg: (err.message ?? "Declined").slice(0, 300), id: inv.id },
      transaction: t,
    });
    return {
      refusal: new ApiError(
        "conflict",
        `The card was declined: ${err.message ?? "no reason given"}. Try another card.`,
        undefined,
        undefined,
        { reason: "declined", declineCode: err.decline_code ?? err.code ?? null },
      ),
    };
  }
}

/** What the buyer's page does next, from the intent as it stands now. */
function answer(pi: Stripe.PaymentIntent): PayOutcome {
  if (pi.status === "succeeded" || pi.status === "requires_capture") return { status: "succeeded" };
  if (pi.status === "requires_action") {
    const next = pi.next_action;
    const url =
      next?.redirect_to_url?.url ??
      (next as { use_stripe_sdk?: { stripe_js?: string } } | null)?.use_stripe_sdk?.stripe_js;
    if (!url) throw new ApiError("internal", "The card asks for authentication we cannot show");
    return { status: "requires_action", redirectUrl: url };
  }
  return { status: "processing" };
}
