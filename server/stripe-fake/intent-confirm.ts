// Confirming a PaymentIntent: the outcomes a test card leads to (success, decline, authentication), and the
// pending test authentication of each intent. A confirmation with another payment method while an
// authentication is pending supersedes it, as the real processor does: the old authentication can no longer
// complete, so an abandoned check finished late never charges the buyer a second time.
import type Stripe from "stripe";
import type { CardBehaviour } from "./cards";
import { makeCharge } from "./charges";
import type { Ctx } from "./context";
import { FakeError, invalid, noSuch } from "./errors";
import { processingFee } from "./fees";
import type { ParamHash } from "./form";
import { newId, randomText } from "./ids";
import { record } from "./ledger";
import { bool } from "./params";

export function findIntent(ctx: Ctx, id: string): Stripe.PaymentIntent {
  const pi = ctx.state.payment_intents[id];
  if (!pi) throw noSuch("payment_intent", id);
  return pi;
}

export function unexpectedState(pi: Stripe.PaymentIntent, action: string, allowed: string[]): FakeError {
  return new FakeError(400, {
    type: "invalid_request_error",
    code: "payment_intent_unexpected_state",
    message: `You cannot ${action} this PaymentIntent because it has a status of ${pi.status}. Only a PaymentIntent with one of the following statuses may be ${action === "confirm" ? "confirmed" : action + "d"}: ${allowed.join(", ")}.`,
    payment_intent: structuredClone(pi),
  });
}

/** Captured money reaches the balance: a charge balance transaction, with the fake's fee, on the charge. */
export function settleCharge(ctx: Ctx, charge: Stripe.Charge, amount: number): void {
  const txn = record(ctx.state, {
    amount,
    fee: processingFee(amount),
    currency: charge.currency,
    type: "charge",
    reportingCategory: "charge",
    source: charge.id,
    description: charge.description,
    created: ctx.now,
  });
  charge.balance_transaction = txn.id;
}

/** The intent's pending authentication ends (completed, superseded, cancelled or no longer needed). */
export function endAuthentication(ctx: Ctx, pi: Stripe.PaymentIntent): void {
  delete ctx.state.authentications[pi.id];
}

/** Money moves: a charge (succeeded), its balance transaction when captured, the intent's new status, the event. */
export function succeed(ctx: Ctx, pi: Stripe.PaymentIntent, pm: Stripe.PaymentMethod, authenticated: boolean): void {
  const captured = pi.capture_method !== "manual";
  const charge = makeCharge(ctx.state, pi, pm, { ok: true, captured, authenticated }, ctx.now);
  if (captured) settleCharge(ctx, charge, charge.amount);
  pi.latest_charge = charge.id;
  pi.next_action = null;
  pi.last_payment_error = null;
  endAuthentication(ctx, pi);
  if (captured) {
    pi.status = "succeeded";
    pi.amount_received = pi.amount;
    ctx.emit("payment_intent.succeeded", pi);
  } else {
    pi.status = "requires_capture";
    pi.amount_capturable = pi.amount;
    ctx.emit("payment_intent.amount_capturable_updated", pi);
  }
}

/** A decline: failed charge, intent back to requires_payment_method, event, then 402 (changes kept). */
function decline(
  ctx: Ctx,
  pi: Stripe.PaymentIntent,
  pm: Stripe.PaymentMethod,
  d: Extract<CardBehaviour, { kind: "decline" }>,
): never {
  endAuthentication(ctx, pi);
  const charge = makeCharge(
    ctx.state,
    pi,
    pm,
    { ok: false, code: d.code, declineCode: d.declineCode, message: d.message },
    ctx.now,
  );
  pi.latest_charge = charge.id;
  pi.status = "requires_payment_method";
  pi.payment_method = null;
  pi.next_action = null;
  pi.last_payment_error = {
    type: "card_error",
    code: d.code as Stripe.PaymentIntent.LastPaymentError.Code,
    decline_code: d.declineCode,
    message: d.message,
    charge: charge.id,
    payment_method: structuredClone(pm),
  };
  ctx.emit("payment_intent.payment_failed", pi);
  throw new FakeError(
    402,
    {
      type: "card_error",
      code: d.code,
      decline_code: d.declineCode,
      message: d.message,
      charge: charge.id,
      payment_intent: structuredClone(pi),
      payment_method: structuredClone(pm),
    },
    true,
  );
}

/** An off-session payment with a card that needs its holder: fails as Stripe does (authentication_required). */
function authenticationRequired(ctx: Ctx, pi: Stripe.PaymentIntent, pm: Stripe.PaymentMethod): never {
  const message = "Your card was declined. This transaction requires authentication.";
  endAuthentication(ctx, pi);
  pi.status = "requires_payment_method";
  pi.payment_method = null;
  pi.last_payment_error = {
    type: "card_error",
    code: "authentication_required",
    decline_code: "authentication_required",
    message,
    payment_method: structuredClone(pm),
  };
  ctx.emit("payment_intent.payment_failed", pi);
  throw new FakeError(
    402,
    {
      type: "card_error",
      code: "authentication_required",
      decline_code: "authentication_required",
      message,
      payment_intent: structuredClone(pi),
      payment_method: structuredClone(pm),
    },
    true,
  );
}

/**
 * A new test authentication for the intent, replacing any pending one; next_action points at its page
 * (`/_fake/3ds/{intent}/{authentication}`), so a page left open from an earlier attempt cannot complete.
 */
function nextAction(ctx: Ctx, pi: Stripe.PaymentIntent): Stripe.PaymentIntent.NextAction {
  const auth = newId("payatt");
  ctx.state.authentications[pi.id] = auth;
  const url = `${ctx.baseUrl}/_fake/3ds/${pi.id}/${auth}`;
  const returnUrl = ctx.state.return_urls[pi.id];
  if (returnUrl) return { type: "redirect_to_url", redirect_to_url: { url, return_url: returnUrl } };
  return {
    type: "use_stripe_sdk",
    use_stripe_sdk: { type: "three_d_secure_redirect", stripe_js: url, source: `src_${randomText(24)}` },
  };
}

export type ConfirmOptions = { offSession: boolean; errorOnRequiresAction: boolean };

export function confirm(ctx: Ctx, pi: Stripe.PaymentIntent, o: ConfirmOptions): void {
  const pmId = typeof pi.payment_method === "string" ? pi.payment_method : pi.payment_method?.id;
  if (!pmId) {
    throw invalid(
      "You cannot confirm this PaymentIntent because it's missing a payment method. Update the PaymentIntent with a payment_method and then confirm it again.",
      "payment_method",
      "payment_intent_unexpected_state",
    );
  }
  const pm = ctx.state.payment_methods[pmId];
  const behaviour = ctx.state.card_behaviour[pmId] ?? { kind: "succeed" };
  if (behaviour.kind === "decline") decline(ctx, pi, pm, behaviour);
  if (behaviour.kind === "authenticate") {
    if (o.offSession || o.errorOnRequiresAction) authenticationRequired(ctx, pi, pm);
    pi.status = "requires_action";
    pi.next_action = nextAction(ctx, pi);
    ctx.emit("payment_intent.requires_action", pi);
    return;
  }
  succeed(ctx, pi, pm, false);
}

export function readConfirmOptions(p: ParamHash): ConfirmOptions {
  return {
    offSession: bool(p, "off_session") ?? false,
    errorOnRequiresAction: bool(p, "error_on_requires_action") ?? false,
  };
}
