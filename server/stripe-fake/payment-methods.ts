// PaymentMethods: POST /v1/payment_methods (type=card only), GET /v1/payment_methods/:id.
// The card number and security code never leave readCard(); only last4, expiry and the test behaviour stay.
import type Stripe from "stripe";
import { readCard } from "./cards";
import type { Handler } from "./context";
import { invalid, noSuch } from "./errors";
import { newId } from "./ids";
import { applyMetadata, hash, onlyParams, requiredStr, str } from "./params";

const BILLING_FIELDS = ["name", "email", "phone"] as const;

/** POST /v1/payment_methods */
export const createPaymentMethod: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, ["type", "card", "billing_details", "metadata", "expand"]);
  const type = requiredStr(p, "type");
  if (type !== "card")
    throw invalid(`Invalid type: this local fake creates only card PaymentMethods, not '${type}'.`, "type");
  const { card, behaviour } = readCard(hash(p, "card"), new Date(ctx.now * 1000));
  const billing = hash(p, "billing_details") ?? {};
  onlyParams(billing, [...BILLING_FIELDS], "billing_details");
  const pm: Stripe.PaymentMethod = {
    id: newId("pm"),
    object: "payment_method",
    billing_details: {
      address: null,
      email: str(billing, "email", "billing_details") ?? null,
      name: str(billing, "name", "billing_details") ?? null,
      phone: str(billing, "phone", "billing_details") ?? null,
      tax_id: null,
    },
    card,
    created: ctx.now,
    customer: null,
    customer_account: null,
    livemode: false,
    metadata: applyMetadata(p),
    type: "card",
  };
  ctx.state.payment_methods[pm.id] = pm;
  ctx.state.card_behaviour[pm.id] = behaviour;
  return pm;
};

/** GET /v1/payment_methods/:id */
export const retrievePaymentMethod: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand"]);
  const pm = ctx.state.payment_methods[id];
  if (!pm) throw noSuch("PaymentMethod", id);
  return pm;
};
