// Refunds: POST /v1/refunds (payment_intent or charge; amount partial or the rest), GET one, GET list.
// A refund can never exceed what is left of the captured amount; the fee is not returned.
import type Stripe from "stripe";
import type { Handler } from "./context";
import { invalid, noSuch } from "./errors";
import { newId } from "./ids";
import { record } from "./ledger";
import { LIST_PARAMS, page } from "./lists";
import { applyMetadata, int, onlyParams, oneOf, str } from "./params";

function money(amount: number, currency: string): string {
  return `${(amount / 100).toFixed(2)} ${currency}`;
}

/** POST /v1/refunds */
export const createRefund: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, ["payment_intent", "charge", "amount", "reason", "metadata", "instructions_email", "expand"]);
  const piId = str(p, "payment_intent");
  const chargeId = str(p, "charge");
  if (!piId && !chargeId)
    throw invalid(
      "One of the following params should be provided for this request: payment_intent or charge.",
      "payment_intent",
      "parameter_missing",
    );
  let charge: Stripe.Charge | undefined;
  if (piId) {
    const pi = ctx.state.payment_intents[piId];
    if (!pi) throw noSuch("payment_intent", piId, "payment_intent", 400);
    charge = pi.latest_charge ? ctx.state.charges[pi.latest_charge as string] : undefined;
    if (pi.status !== "succeeded" || !charge) {
      throw invalid(
        `This PaymentIntent (${piId}) does not have a successful charge to refund.`,
        "payment_intent",
        "charge_not_refundable",
      );
    }
    if (chargeId && chargeId !== charge.id)
      throw invalid(`Charge ${chargeId} does not belong to PaymentIntent ${piId}.`, "charge");
  } else {
    charge = ctx.state.charges[chargeId!];
    if (!charge) throw noSuch("charge", chargeId!, "charge", 400);
    if (charge.status !== "succeeded" || !charge.captured)
      throw invalid(`Charge ${charge.id} has no captured funds to refund.`, "charge", "charge_not_refundable");
  }
  const remaining = charge.amount_captured - charge.amount_refunded;
  if (remaining <= 0)
    throw invalid(`Charge ${charge.id} has already been refunded.`, "charge", "charge_already_refunded");
  const amount = int(p, "amount", { min: 1 }) ?? remaining;
  if (amount > remaining) {
    throw invalid(
      `Refund amount (${money(amount, charge.currency)}) is greater than unrefunded amount on charge (${money(remaining, charge.currency)})`,
      "amount",
      "amount_too_large",
    );
  }
  const reason = oneOf(p, "reason", ["duplicate", "fraudulent", "requested_by_customer"] as const);
  const id = newId("re");
  const txn = record(ctx.state, {
    amount: -amount,
    fee: 0,
    currency: charge.currency,
    type: "refund",
    reportingCategory: "refund",
    source: id,
    description: "REFUND FOR CHARGE",
    created: ctx.now,
  });
  const refund: Stripe.Refund = {
    id,
    object: "refund",
    amount,
    balance_transaction: txn.id,
    charge: charge.id,
    created: ctx.now,
    currency: charge.currency,
    customer: null,
    customer_account: null,
    metadata: applyMetadata(p),
    payment_intent: charge.payment_intent,
    payment_method: charge.payment_method,
    reason: reason ?? null,
    receipt_number: null,
    source_transfer_reversal: null,
    status: "succeeded",
    transfer_reversal: null,
  };
  ctx.state.refunds[id] = refund;
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded >= charge.amount_captured;
  ctx.emit("charge.refunded", charge);
  return refund;
};

/** GET /v1/refunds/:id */
export const retrieveRefund: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand"]);
  const refund = ctx.state.refunds[id];
  if (!refund) throw noSuch("refund", id);
  return refund;
};

/** GET /v1/refunds — filters payment_intent, charge. */
export const listRefunds: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [...LIST_PARAMS, "payment_intent", "charge"]);
  const pi = str(p, "payment_intent");
  const charge = str(p, "charge");
  const items = Object.values(ctx.state.refunds).filter(
    (r) => (pi === undefined || r.payment_intent === pi) && (charge === undefined || r.charge === charge),
  );
  return page(items, p, "/v1/refunds");
};
