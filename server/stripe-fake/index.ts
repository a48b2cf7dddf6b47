// Local Stripe fake for development, demo and tests: the official `stripe` SDK reaches it by configuration alone,
//   new Stripe(key, { host: "127.0.0.1", port, protocol: "http", maxNetworkRetries: 0, telemetry: false })
// and it answers in the object shapes of the API version that SDK pins (Stripe.API_VERSION).
//
//   node --import tsx server/stripe-fake/index.ts
//   STRIPE_FAKE_PORT (12111)  STRIPE_FAKE_DIR (.data/stripe-fake)
//   STRIPE_WEBHOOK_URL (http://127.0.0.1:3000/api/webhooks/stripe; "" = record events, deliver none)
//   STRIPE_WEBHOOK_SECRET (required)  STRIPE_SECRET_KEY (optional: then only that key is accepted)
//   STRIPE_FAKE_RETRY_BASE_MS (1000)  STRIPE_FAKE_MAX_ATTEMPTS (8)
// .env / .env.local are read first (variables already set win), as the custom server does.
//
// Endpoints (form-encoded bodies, bracket notation; Authorization: Bearer sk_test_…). Every POST honours
// Idempotency-Key for 24 h (keys the SDK makes up itself: 10 min): same key and same parameters replay the
// stored answer (header Idempotent-Replayed: true); other parameters or another endpoint give 400
// idempotency_error. Answers that did work (200, and 402 declines) are stored; refused requests are not.
//   POST /v1/payment_methods                       type=card, card[number|exp_month|exp_year|cvc], billing_details, metadata
//   GET  /v1/payment_methods/:id
//   POST /v1/payment_intents                       amount, currency, payment_method, confirm, capture_method
//                                                  (automatic default | automatic_async | manual), metadata,
//                                                  transfer_group, description, return_url, off_session,
//                                                  error_on_requires_action, receipt_email, statement_descriptor(_suffix)
//   GET  /v1/payment_intents[/:id]   POST /v1/payment_intents/:id (update)
//   POST /v1/payment_intents/:id/confirm | /capture (amount_to_capture) | /cancel (cancellation_reason)
//   GET  /v1/charges[/:id]                         charges come from confirming PaymentIntents
//   POST /v1/refunds                               payment_intent | charge, amount (default: what is left), reason, metadata
//   GET  /v1/refunds[/:id]
//   POST /v1/accounts                              type=custom|express|standard, capabilities[transfers][requested]=true, …
//   GET  /v1/accounts[/:id]   POST /v1/accounts/:id (email, business_profile, capabilities, metadata)
//   POST /v1/transfers                             amount, currency, destination, transfer_group, source_transaction, metadata
//   GET  /v1/transfers[/:id]   POST /v1/transfers/:id (description, metadata)
//   POST /v1/transfers/:id/reversals               amount (default: what is left), metadata
//   GET  /v1/transfers/:id/reversals[/:id]
//   GET  /v1/balance                               platform; with Stripe-Account: acct_… that account's
//   GET  /v1/balance_transactions[/:id]            filters type, source, currency
//   GET  /v1/events[/:id]                          filters type (payment_intent.*), types[], delivery_success
// Lists take limit (1–100, default 10), starting_after, ending_before, created[gt|gte|lt|lte]; any endpoint takes
// expand[] (e.g. latest_charge.balance_transaction, data.source). Unknown parameters are refused (400
// parameter_unknown), so the app cannot rely on something the fake silently ignores.
// Test-only endpoints (no key): see test-endpoints.ts — /_fake/health, /_fake/3ds/:pi/:auth (authentication page),
// POST /_fake/payment_intents/:pi/authenticate outcome=succeed|fail, POST /_fake/events/:evt/redeliver,
// GET /_fake/deliveries.
//
// Test cards (any future expiry; cvc optional): 4242424242424242 succeeds; 4000000000000002 declines
// (card_declined / generic_decline); 4000000000009995 insufficient_funds; 4000000000000069 expired_card;
// 4000000000000127 incorrect_cvc; 4000002500003155 and 4000000000003220 need authentication (requires_action).
// Any other Luhn-valid number succeeds. Only brand "unknown", last4 and expiry are kept; never the number or cvc.
//
// Authentication: a requires_action intent carries next_action — redirect_to_url { url, return_url } when a
// return_url was given, else use_stripe_sdk { stripe_js: url }. The url is this fake's page
// GET /_fake/3ds/:pi/:auth (buttons Complete / Fail; then 303 to return_url?payment_intent=…&redirect_status=…).
// Code and tests call POST /_fake/payment_intents/:pi/authenticate with outcome=succeed|fail (form or JSON;
// also reachable as stripe.rawRequest("POST", "/_fake/payment_intents/<id>/authenticate", { outcome })).
// Confirming the intent again with another payment method supersedes a pending authentication, as the real
// processor does: the old page answers 409 and the old check (authentication=:auth) is refused.
// "succeed" pays (payment_intent.succeeded); "fail" returns the intent to requires_payment_method with
// last_payment_error.code payment_intent_authentication_failure (payment_intent.payment_failed).
//
// Money: fee rule in fees.ts (the fake's own: 2.9 % + 30 minor units per captured charge); funds are available
// at once; transfers need available balance unless they name a source_transaction (then they may not exceed
// what is left of that charge); a transfer reversal's balance transaction has type transfer_refund and
// reporting_category transfer_reversal, as Stripe's do.
//
// Webhooks: payment_intent.succeeded | payment_intent.payment_failed | payment_intent.requires_action |
// payment_intent.amount_capturable_updated | payment_intent.canceled | charge.refunded | transfer.created |
// transfer.reversed, signed for stripe.webhooks.constructEvent; retried 1 s, 2 s, 4 s … up to 8 attempts;
// pending deliveries survive a restart and are sent at once on start.
import path from "node:path";
import { pathToFileURL } from "node:url";
import { startStripeFake } from "./server";

export { startStripeFake } from "./server";
export type { StripeFake, StripeFakeOptions } from "./server";
export { signatureHeader } from "./webhooks";
export { processingFee } from "./fees";
export { TEST_CARDS } from "./cards";

async function main(): Promise<void> {
  const { loadEnvConfig } = await import("@next/env");
  loadEnvConfig(process.cwd(), process.env.NODE_ENV !== "production", {
    info: () => {},
    error: (...a: unknown[]) => console.error(...a),
  });
  const secret = process.env.STRIPE_WEBHOOK_SECRET;
  if (!secret) throw new Error("STRIPE_WEBHOOK_SECRET is required (scripts/ensure-env.sh writes one to .env.local)");
  const fake = await startStripeFake({
    port: Number(process.env.STRIPE_FAKE_PORT ?? 12111),
    dataDir: process.env.STRIPE_FAKE_DIR ?? ".data/stripe-fake",
    webhookUrl: process.env.STRIPE_WEBHOOK_URL ?? "http://127.0.0.1:3000/api/webhooks/stripe",
    webhookSecret: secret,
    apiKey: process.env.STRIPE_SECRET_KEY || undefined,
    webhookRetry: {
      baseMs: process.env.STRIPE_FAKE_RETRY_BASE_MS ? Number(process.env.STRIPE_FAKE_RETRY_BASE_MS) : undefined,
      maxAttempts: process.env.STRIPE_FAKE_MAX_ATTEMPTS ? Number(process.env.STRIPE_FAKE_MAX_ATTEMPTS) : undefined,
    },
    log: (line) => console.log(`stripe-fake: ${line}`),
  });
  console.log(`stripe-fake: ${fake.url} (pid ${process.pid})`);
  const stop = (signal: string) => {
    console.log(`stripe-fake: ${signal} received, stopping`);
    setTimeout(() => process.exit(1), 5_000).unref();
    fake.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once("SIGTERM", () => stop("SIGTERM"));
  process.once("SIGINT", () => stop("SIGINT"));
}

// Run only as a script, not when a test imports startStripeFake.
if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  main().catch((e: Error) => {
    console.error(`stripe-fake: ${e.message}`);
    process.exit(1);
  });
}
