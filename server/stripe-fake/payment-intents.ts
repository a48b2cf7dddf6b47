// PaymentIntents: create (optionally confirm), update, confirm, capture, cancel, retrieve, list. What a
// confirmation leads to is in intent-confirm.ts; the end of a test authentication in authentication.ts.
// A successful capture makes a charge and a balance transaction with the fake fee; a decline answers 402 and
// leaves a failed charge; a card that needs authentication stops at requires_action with next_action pointing
// at the fake's authentication page.
import type Stripe from "stripe";
import type { Ctx, Handler } from "./context";
import { invalid, noSuch } from "./errors";
import type { ParamHash } from "./form";
import { newId, randomText } from "./ids";
import {
  confirm,
  endAuthentication,
  findIntent,
  readConfirmOptions,
  settleCharge,
  unexpectedState,
} from "./intent-confirm";
import { LIST_PARAMS, page } from "./lists";
import { applyMetadata, bool, currency, hash, int, onlyParams, oneOf, str } from "./params";

/** Stripe's largest amount (eight digits) and the fake's smallest (50 minor units, as for usd). */
const MIN_AMOUNT = 50;
const MAX_AMOUNT = 99_999_999;
const CAPTURE_METHODS = ["automatic", "automatic_async", "manual"] as const;
const CONFIRM_PARAMS = [
  "payment_method",
  "return_url",
  "off_session",
  "error_on_requires_action",
  "receipt_email",
  "use_stripe_sdk",
  "expand",
];
const CANCELABLE = ["requires_payment_method", "requires_capture", "requires_confirmation", "requires_action"];

function readAmount(p: ParamHash, required: boolean): number | undefined {
  const amount = int(p, "amount");
  if (amount === undefined) {
    if (required) throw invalid("Missing required param: amount.", "amount", "parameter_missing");
    return undefined;
  }
  if (amount < MIN_AMOUNT)
    throw invalid(`Amount must be at least ${MIN_AMOUNT} minor units.`, "amount", "amount_too_small");
  if (amount > MAX_AMOUNT)
    throw invalid(`Amount must be no more than ${MAX_AMOUNT} minor units.`, "amount", "amount_too_large");
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

function setPaymentMethod(ctx: Ctx, pi: Stripe.PaymentIntent, id: string): void {
  if (!ctx.state.payment_methods[id]) throw noSuch("PaymentMethod", id, "payment_method", 400);
  pi.payment_method = id;
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
  const allowRedirects = apm
    ? oneOf(apm, "allow_redirects", ["always", "never"] as const, "automatic_payment_methods")
    : undefined;
  if (apm && bool(apm, "enabled", "automatic_payment_methods") === false) {
    throw invalid(
      "This local fake accepts card payments only through automatic_payment_methods[enabled]=true (the default).",
      "automatic_payment_methods[enabled]",
    );
  }
  const returnUrl = readReturnUrl(p);
  if ((p.off_session !== undefined || p.error_on_requires_action !== undefined) && !confirmNow) {
    throw invalid(
      "off_session and error_on_requires_action can only be used with confirm=true.",
      p.off_session !== undefined ? "off_session" : "error_on_requires_action",
    );
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
  const items = Object.values(ctx.state.payment_intents).filter(
    (x) => group === undefined || x.transfer_group === group,
  );
  return page(items, p, "/v1/payment_intents");
};

/** POST /v1/payment_intents/:id — metadata, description, transfer_group any time; amount, currency, payment_method before payment. */
export const updatePaymentIntent: Handler = (ctx, id) => {
  const p = ctx.params;
  onlyParams(p, [
    "amount",
    "currency",
    "payment_method",
    "metadata",
    "description",
    "transfer_group",
    "receipt_email",
    "expand",
  ]);
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
    endAuthentication(ctx, pi);
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
    throw invalid(
      `The amount to capture (${amount}) is more than the amount capturable (${pi.amount_capturable}).`,
      "amount_to_capture",
      "amount_too_large",
    );
  }
  pi.metadata = applyMetadata(p, pi.metadata);
  const charge = ctx.state.charges[pi.latest_charge as string];
  charge.captured = true;
  charge.amount_captured = amount;
  settleCharge(ctx, charge, amount);
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
  const reason = oneOf(p, "cancellation_reason", [
    "duplicate",
    "fraudulent",
    "requested_by_customer",
    "abandoned",
  ] as const);
  if (pi.status === "requires_capture" && pi.latest_charge) {
    const charge = ctx.state.charges[pi.latest_charge as string];
    charge.amount_refunded = charge.amount;
    charge.refunded = true;
  }
  endAuthentication(ctx, pi);
  pi.status = "canceled";
  pi.canceled_at = ctx.now;
  pi.cancellation_reason = reason ?? null;
  pi.amount_capturable = 0;
  pi.next_action = null;
  ctx.emit("payment_intent.canceled", pi);
  return pi;
};
