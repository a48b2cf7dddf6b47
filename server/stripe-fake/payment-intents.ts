// PaymentIntents: create (optionally confirm), update, confirm, capture, cancel, retrieve, list, and the end of
// a test authentication (see authentication.ts). A successful capture makes a charge and a balance
// transaction with the fake fee; a decline answers 402 and leaves a failed charge; a card that needs
// authentication stops at requires_action with next_action pointing at the fake's authentication page.
import type Stripe from "stripe";
import type { CardBehaviour } from "./cards";
import { makeCharge } from "./charges";
import type { Ctx, Handler } from "./context";
import { FakeError, invalid, noSuch } from "./errors";
import { processingFee } from "./fees";
import type { ParamHash } from "./form";
import { newId, randomText } from "./ids";
import { record } from "./ledger";
import { LIST_PARAMS, page } from "./lists";
import { applyMetadata, bool, currency, hash, int, onlyParams, oneOf, requiredStr, str } from "./params";

/** Stripe's largest amount (eight digits) and the fake's smallest (50 minor units, as for usd). */
const MIN_AMOUNT = 50;
const MAX_AMOUNT = 99_999_999;
const CAPTURE_METHODS = ["automatic", "automatic_async", "manual"] as const;
const CONFIRM_PARAMS = ["payment_method", "return_url", "off_session", "error_on_requires_action", "receipt_email", "use_stripe_sdk", "expand"];
const CANCELABLE = ["requires_payment_method", "requires_capture", "requires_confirmation", "requires_action"];

function readAmount(p: ParamHash, required: boolean): number | undefined {
  const amount = int(p, "amount");
  if (amount === undefined) {
    if (required) throw invalid("Missing required param: amount.", "amount", "parameter_missing");
    return undefined;
  }
  if (amount < MIN_AMOUNT) throw invalid(`Amount must be at least ${MIN_AMOUNT} minor units.`, "amount", "amount_too_small");
  if (amount > MAX_AMOUNT) throw invalid(`Amount must be no more than ${MAX_AMOUNT} minor units.`, "amount", "amount_too_large");
  return amount;
}

function readReturnUrl(p: ParamHash): string | undefined {
  const url = str(p, "return_url");
  if (url === undefined) return undefined;
  try {
    const u = new URL(url);
    if (u.protocol !== "http:" && u.protocol !== "https:") throw new Error("scheme");
  } catch {
    throw invalid("Invalid URL: return_url must be an absolute http(s) URL.", "return_url", "url_invalid");
  }
  return url;
}

function findIntent(ctx: Ctx, id: string): Stripe.PaymentIntent {
  const pi = ctx.state.payment_intents[id];
  if (!pi) throw noSuch("payment_intent", id);
  return pi;
}

function unexpectedState(pi: Stripe.PaymentIntent, action: string, allowed: string[]): FakeError {
  return new FakeError(400, {
    type: "invalid_request_error",
    code: "payment_intent_unexpected_state",
    message: `You cannot ${action} this PaymentIntent because it has a status of ${pi.status}. Only a PaymentIntent with one of the following statuses may be ${action === "confirm" ? "confirmed" : action + "d"}: ${allowed.join(", ")}.`,
    payment_intent: structuredClone(pi),
  });
}

function setPaymentMethod(ctx: Ctx, pi: Stripe.PaymentIntent, id: string): void {
  if (!ctx.state.payment_methods[id]) throw noSuch("PaymentMethod", id, "payment_method", 400);
  pi.payment_method = id;
}

/** Money moves: a charge (succeeded), its balance transaction when captured, the intent's new status, the event. */
function succeed(ctx: Ctx, pi: Stripe.PaymentIntent, pm: Stripe.PaymentMethod, authenticated: boolean): void {
  const captured = pi.capture_method !== "manual";
  const charge = makeCharge(ctx.state, pi, pm, { ok: true, captured, authenticated }, ctx.now);
  if (captured) {
    const txn = record(ctx.state, {
      amount: charge.amount,
      fee: processingFee(charge.amount),
      currency: charge.currency,
      type: "charge",
      reportingCategory: "charge",
      source: charge.id,
      description: charge.description,
      created: ctx.now,
    });
    charge.balance_transaction = txn.id;
  }
  pi.latest_charge = charge.id;
  pi.next_action = null;
  pi.last_payment_error = null;
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
function decline(ctx: Ctx, pi: Stripe.PaymentIntent, pm: Stripe.PaymentMethod, d: Extract<CardBehaviour, { kind: "decline" }>): never {
  const charge = makeCharge(ctx.state, pi, pm, { ok: false, code: d.code, declineCode: d.declineCode, message: d.message }, ctx.now);
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

function nextAction(ctx: Ctx, pi: Stripe.PaymentIntent): Stripe.PaymentIntent.NextAction {
  const url = `${ctx.baseUrl}/_fake/3ds/${pi.id}`;
  const returnUrl = ctx.state.return_urls[pi.id];
  if (returnUrl) return { type: "redirect_to_url", redirect_to_url: { url, return_url: returnUrl } };
  return { type: "use_stripe_sdk", use_stripe_sdk: { type: "three_d_secure_redirect", stripe_js: url, source: `src_${randomText(24)}` } };
}

type ConfirmOptions = { offSession: boolean; errorOnRequiresAction: boolean };

function confirm(ctx: Ctx, pi: Stripe.PaymentIntent, o: ConfirmOptions): void {
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

function readConfirmOptions(p: ParamHash): ConfirmOptions {
  return { offSession: bool(p, "off_session") ?? false, errorOnRequiresAction: bool(p, "error_on_requires_action") ?? false };
}

/** POST /v1/payment_intents */
export const createPaymentIntent: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [
    ...CONFIRM_PARAMS,
    "amount",
    "currency",
    "confirm",
    "capture_method",
    "metadata",
    "transfer_group",
    "description",
    "statement_descriptor",
    "statement_descriptor_suffix",
    "automatic_payment_methods",
  ]);
  const amount = readAmount(p, true)!;
  const cur = currency(p)!;
  const confirmNow = bool(p, "confirm") ?? false;
  const apm = hash(p, "automatic_payment_methods");
  if (apm) onlyParams(apm, ["enabled", "allow_redirects"], "automatic_payment_methods");
  const allowRedirects = apm ? oneOf(apm, "allow_redirects", ["always", "never"] as const, "automatic_payment_methods") : undefined;
  if (apm && bool(apm, "enabled", "automatic_payment_methods") === false) {
    throw invalid("This local fake accepts card payments only through automatic_payment_methods[enabled]=true (the default).", "automatic_payment_methods[enabled]");
  }
  const returnUrl = readReturnUrl(p);
  if ((p.off_session !== undefined || p.error_on_requires_action !== undefined) && !confirmNow) {
    throw invalid("off_session and error_on_requires_action can only be used with confirm=true.", p.off_session !== undefined ? "off_session" : "error_on_requires_action");
  }
  const id = newId("pi");
  const pi: Stripe.PaymentIntent = {
    id,
    object: "payment_intent",
    allowed_payment_method_types: null,
    amount,
    amount_capturable: 0,
    amount_received: 0,
    application: null,
    application_fee_amount: null,
    automatic_payment_methods: { enabled: true, ...(allowRedirects ? { allow_redirects: allowRedirects } : {}) },
    canceled_at: null,
    cancellation_reason: null,
    capture_method: oneOf(p, "capture_method", CAPTURE_METHODS) ?? "automatic",
    client_secret: `${id}_secret_${randomText(25)}`,
    confirmation_method: "automatic",
    created: ctx.now,
    currency: cur,
    customer: null,
    customer_account: null,
    description: str(p, "description") ?? null,
    excluded_payment_method_types: null,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    managed_payments: null,
    metadata: applyMetadata(p),
    next_action: null,
    on_behalf_of: null,
    payment_method: null,
    payment_method_configuration_details: null,
    payment_method_options: null,
    payment_method_types: ["card"],
    payment_record: null,
    processing: null,
    receipt_email: str(p, "receipt_email") ?? null,
    review: null,
    setup_future_usage: null,
    shipping: null,
    source: null,
    statement_descriptor: str(p, "statement_descriptor") ?? null,
    statement_descriptor_suffix: str(p, "statement_descriptor_suffix") ?? null,
    status: "requires_payment_method",
    transfer_data: null,
    transfer_group: str(p, "transfer_group") ?? null,
  };
  const pmId = str(p, "payment_method");
  if (pmId) {
    setPaymentMethod(ctx, pi, pmId);
    pi.status = "requires_confirmation";
  }
  ctx.state.payment_intents[id] = pi;
  if (returnUrl) ctx.state.return_urls[id] = returnUrl;
  if (confirmNow) confirm(ctx, pi, readConfirmOptions(p));
  return pi;
};

/** GET /v1/payment_intents/:id */
export const retrievePaymentIntent: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand", "client_secret"]);
  return findIntent(ctx, id);
};

/** GET /v1/payment_intents — filter transfer_group (a fake extra, handy for escrow checks). */
export const listPaymentIntents: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [...LIST_PARAMS, "transfer_group"]);
  const group = str(p, "transfer_group");
  const items = Object.values(ctx.state.payment_intents).filter((x) => group === undefined || x.transfer_group === group);
  return page(items, p, "/v1/payment_intents");
};

/** POST /v1/payment_intents/:id — metadata, description, transfer_group any time; amount, currency, payment_method before payment. */
export const updatePaymentIntent: Handler = (ctx, id) => {
  const p = ctx.params;
  onlyParams(p, ["amount", "currency", "payment_method", "metadata", "description", "transfer_group", "receipt_email", "expand"]);
  const pi = findIntent(ctx, id);
  const amount = readAmount(p, false);
  const cur = currency(p, "currency", false);
  const pmId = str(p, "payment_method");
  const open = ["requires_payment_method", "requires_confirmation", "requires_action"];
  if ((amount !== undefined || cur !== undefined || pmId !== undefined) && !open.includes(pi.status)) {
    throw unexpectedState(pi, "update", open);
  }
  const metadata = applyMetadata(p, pi.metadata);
  if (pmId) setPaymentMethod(ctx, pi, pmId);
  if (amount !== undefined) pi.amount = amount;
  if (cur !== undefined) pi.currency = cur;
  if (amount !== undefined || cur !== undefined || pmId) {
    pi.next_action = null;
    pi.status = pi.payment_method ? "requires_confirmation" : "requires_payment_method";
  }
  pi.metadata = metadata;
  const description = str(p, "description");
  if (description !== undefined) pi.description = description || null;
  const group = str(p, "transfer_group");
  if (group !== undefined) pi.transfer_group = group || null;
  const email = str(p, "receipt_email");
  if (email !== undefined) pi.receipt_email = email || null;
  return pi;
};

/** POST /v1/payment_intents/:id/confirm */
export const confirmPaymentIntent: Handler = (ctx, id) => {
  const p = ctx.params;
  onlyParams(p, [...CONFIRM_PARAMS, "capture_method"]);
  const pi = findIntent(ctx, id);
  const allowed = ["requires_payment_method", "requires_confirmation", "requires_action"];
  if (!allowed.includes(pi.status)) throw unexpectedState(pi, "confirm", allowed);
  const returnUrl = readReturnUrl(p);
  const captureMethod = oneOf(p, "capture_method", CAPTURE_METHODS);
  const options = readConfirmOptions(p);
  const pmId = str(p, "payment_method");
  if (pmId) setPaymentMethod(ctx, pi, pmId);
  if (captureMethod) pi.capture_method = captureMethod;
  if (returnUrl) ctx.state.return_urls[id] = returnUrl;
  confirm(ctx, pi, options);
  return pi;
};

/** POST /v1/payment_intents/:id/capture — amount_to_capture ≤ amount_capturable (default all). */
export const capturePaymentIntent: Handler = (ctx, id) => {
  const p = ctx.params;
  onlyParams(p, ["amount_to_capture", "metadata", "expand"]);
  const pi = findIntent(ctx, id);
  if (pi.status !== "requires_capture") throw unexpectedState(pi, "capture", ["requires_capture"]);
  const amount = int(p, "amount_to_capture", { min: 1 }) ?? pi.amount_capturable;
  if (amount > pi.amount_capturable) {
    throw invalid(`The amount to capture (${amount}) is more than the amount capturable (${pi.amount_capturable}).`, "amount_to_capture", "amount_too_large");
  }
  pi.metadata = applyMetadata(p, pi.metadata);
  const charge = ctx.state.charges[pi.latest_charge as string];
  charge.captured = true;
  charge.amount_captured = amount;
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
  pi.amount_received = amount;
  pi.amount_capturable = 0;
  pi.status = "succeeded";
  ctx.emit("payment_intent.succeeded", pi);
  return pi;
};

/** POST /v1/payment_intents/:id/cancel — an uncaptured charge is released (marked refunded, no money moved). */
export const cancelPaymentIntent: Handler = (ctx, id) => {
  const p = ctx.params;
  onlyParams(p, ["cancellation_reason", "expand"]);
  const pi = findIntent(ctx, id);
  if (!CANCELABLE.includes(pi.status)) throw unexpectedState(pi, "cancel", [...CANCELABLE, "processing"]);
  const reason = oneOf(p, "cancellation_reason", ["duplicate", "fraudulent", "requested_by_customer", "abandoned"] as const);
  if (pi.status === "requires_capture" && pi.latest_charge) {
    const charge = ctx.state.charges[pi.latest_charge as string];
    charge.amount_refunded = charge.amount;
    charge.refunded = true;
  }
  pi.status = "canceled";
  pi.canceled_at = ctx.now;
  pi.cancellation_reason = reason ?? null;
  pi.amount_capturable = 0;
  pi.next_action = null;
  ctx.emit("payment_intent.canceled", pi);
  return pi;
};

/** Ends a test authentication: "succeed" pays as a normal confirm would; "fail" returns the intent to the buyer. */
export function completeAuthentication(ctx: Ctx, id: string, outcome: "succeed" | "fail"): Stripe.PaymentIntent {
  const pi = findIntent(ctx, id);
  if (pi.status !== "requires_action") throw unexpectedState(pi, "authenticate", ["requires_action"]);
  const pm = ctx.state.payment_methods[pi.payment_method as string];
  if (outcome === "succeed") {
    succeed(ctx, pi, pm, true);
    return pi;
  }
  pi.status = "requires_payment_method";
  pi.payment_method = null;
  pi.next_action = null;
  pi.last_payment_error = {
    type: "invalid_request_error",
    code: "payment_intent_authentication_failure",
    message:
      "The provided PaymentMethod has failed authentication. You can provide payment_method_data or a new PaymentMethod to attempt to fulfill this PaymentIntent again.",
    payment_method: structuredClone(pm),
  };
  ctx.emit("payment_intent.payment_failed", pi);
  return pi;
}

/** Reads the required `outcome` of the authentication endpoints. */
export function readOutcome(p: ParamHash): "succeed" | "fail" {
  requiredStr(p, "outcome");
  return oneOf(p, "outcome", ["succeed", "fail"] as const)!;
}
