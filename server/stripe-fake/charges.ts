// Charges: made by confirming a PaymentIntent (never created directly), read through /v1/charges.
import type Stripe from "stripe";
import type { Handler } from "./context";
import { noSuch } from "./errors";
import { newId } from "./ids";
import { LIST_PARAMS, page } from "./lists";
import { onlyParams, str } from "./params";
import type { State } from "./store";

type Outcome =
  | { ok: true; captured: boolean; authenticated: boolean }
  | { ok: false; code: string; declineCode: string; message: string };

/** Records the charge of one payment attempt on `pi` with `pm`; balance transaction added by the caller. */
export function makeCharge(
  state: State,
  pi: Stripe.PaymentIntent,
  pm: Stripe.PaymentMethod,
  o: Outcome,
  now: number,
): Stripe.Charge {
  const card = pm.card!;
  const charge: Stripe.Charge = {
    id: newId("ch"),
    object: "charge",
    amount: pi.amount,
    amount_captured: o.ok && o.captured ? pi.amount : 0,
    amount_refunded: 0,
    application: null,
    application_fee: null,
    application_fee_amount: null,
    balance_transaction: null,
    billing_details: structuredClone(pm.billing_details),
    calculated_statement_descriptor: "GETTERLINE TEST",
    captured: o.ok && o.captured,
    created: now,
    currency: pi.currency,
    customer: null,
    description: pi.description,
    disputed: false,
    failure_balance_transaction: null,
    failure_code: o.ok ? null : o.code,
    failure_message: o.ok ? null : o.message,
    fraud_details: {},
    livemode: false,
    metadata: { ...pi.metadata },
    on_behalf_of: null,
    outcome: o.ok
      ? {
          advice_code: null,
          network_advice_code: null,
          network_decline_code: null,
          network_status: "approved_by_network",
          reason: null,
          risk_level: "normal",
          seller_message: "Payment complete.",
          type: "authorized",
        }
      : {
          advice_code: null,
          network_advice_code: null,
          network_decline_code: null,
          network_status: "declined_by_network",
          reason: o.declineCode,
          risk_level: "normal",
          seller_message: "The bank did not return any further details with this decline.",
          type: "issuer_declined",
        },
    paid: o.ok,
    payment_intent: pi.id,
    payment_method: pm.id,
    payment_method_details: {
      type: "card",
      card: {
        amount_authorized: o.ok ? pi.amount : null,
        authorization_code: o.ok ? "000000" : null,
        brand: card.brand,
        checks: card.checks,
        country: card.country,
        electronic_commerce_indicator: null,
        exp_month: card.exp_month,
        exp_year: card.exp_year,
        funding: card.funding,
        installments: null,
        last4: card.last4,
        mandate: null,
        network: "unknown",
        network_transaction_id: null,
        regulated_status: card.regulated_status,
        three_d_secure:
          o.ok && o.authenticated
            ? {
                authentication_flow: "challenge",
                electronic_commerce_indicator: "05",
                exemption_indicator: null,
                result: "authenticated",
                result_reason: null,
                transaction_id: null,
                version: "2.2.0",
              }
            : null,
        transaction_link_id: null,
        wallet: null,
      },
    },
    receipt_email: pi.receipt_email,
    receipt_number: null,
    receipt_url: null,
    refunded: false,
    review: null,
    shipping: null,
    source: null,
    source_transfer: null,
    statement_descriptor: pi.statement_descriptor,
    statement_descriptor_suffix: pi.statement_descriptor_suffix,
    status: o.ok ? "succeeded" : "failed",
    transfer_data: null,
    transfer_group: pi.transfer_group,
  };
  state.charges[charge.id] = charge;
  return charge;
}

/** GET /v1/charges/:id */
export const retrieveCharge: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand"]);
  const charge = ctx.state.charges[id];
  if (!charge) throw noSuch("charge", id);
  return charge;
};

/** GET /v1/charges — filters payment_intent, transfer_group. */
export const listCharges: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [...LIST_PARAMS, "payment_intent", "transfer_group"]);
  const pi = str(p, "payment_intent");
  const group = str(p, "transfer_group");
  const items = Object.values(ctx.state.charges).filter(
    (c) => (pi === undefined || c.payment_intent === pi) && (group === undefined || c.transfer_group === group),
  );
  return page(items, p, "/v1/charges");
};
