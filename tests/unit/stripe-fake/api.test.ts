// The local Stripe fake driven by the real `stripe` SDK, as the app will drive it: payments, declines,
// authentication, idempotency, connected accounts, transfers, reversals, refunds and the ledger.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startStripeFake, type StripeFake } from "@/server/stripe-fake";

const SECRET = "whsec_unit_api";
const PORTS: [number, number] = [12111, 12199];
const EXP = { exp_month: 12, exp_year: new Date().getUTCFullYear() + 3 };

let dir: string;
let fake: StripeFake;
let stripe: Stripe;

function client(port: number, key = "sk_test_unit"): Stripe {
  return new Stripe(key, { host: "127.0.0.1", port, protocol: "http", maxNetworkRetries: 0, telemetry: false });
}

async function card(number: string): Promise<Stripe.PaymentMethod> {
  return stripe.paymentMethods.create({ type: "card", card: { number, cvc: "123", ...EXP } });
}

/** Paid PaymentIntent with the always-succeeding test card. */
async function paid(
  amount: number,
  extra: Partial<Stripe.PaymentIntentCreateParams> = {},
): Promise<Stripe.PaymentIntent> {
  const pm = await card("4242424242424242");
  return stripe.paymentIntents.create({ amount, currency: "usd", payment_method: pm.id, confirm: true, ...extra });
}

async function available(currency = "usd", account?: string): Promise<number> {
  const b = await stripe.balance.retrieve({}, account ? { stripeAccount: account } : {});
  return b.available.find((x) => x.currency === currency)?.amount ?? 0;
}

async function caught(p: Promise<unknown>): Promise<Stripe.errors.StripeError> {
  try {
    await p;
  } catch (e) {
    return e as Stripe.errors.StripeError;
  }
  throw new Error("expected the call to fail");
}

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "stripe-fake-api-"));
  fake = await startStripeFake({ portRange: PORTS, dataDir: dir, webhookUrl: null, webhookSecret: SECRET });
  stripe = client(fake.port);
});

afterAll(async () => {
  await fake?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("payments", () => {
  it("confirms a card payment: succeeded, a charge, a balance transaction with the fake fee", async () => {
    const pm = await card("4242424242424242");
    expect(pm.id).toMatch(/^pm_/);
    expect(pm.card).toMatchObject({ last4: "4242", exp_month: 12 });
    const created = await stripe.paymentIntents.create({
      amount: 12_345,
      currency: "usd",
      metadata: { lot: "L-7" },
      transfer_group: "lot-7",
    });
    expect(created).toMatchObject({
      object: "payment_intent",
      status: "requires_payment_method",
      livemode: false,
      capture_method: "automatic",
    });
    const pi = await stripe.paymentIntents.confirm(created.id, {
      payment_method: pm.id,
      expand: ["latest_charge.balance_transaction"],
    });
    expect(pi.status).toBe("succeeded");
    expect(pi.amount_received).toBe(12_345);
    expect(pi.metadata).toEqual({ lot: "L-7" });
    const charge = pi.latest_charge as Stripe.Charge;
    expect(charge.id).toMatch(/^ch_/);
    expect(charge).toMatchObject({
      status: "succeeded",
      paid: true,
      captured: true,
      amount_captured: 12_345,
      transfer_group: "lot-7",
    });
    const txn = charge.balance_transaction as Stripe.BalanceTransaction;
    // 2.9 % of 12 345 = 357.9 → 358, + 30
    expect(txn).toMatchObject({
      object: "balance_transaction",
      type: "charge",
      amount: 12_345,
      fee: 388,
      net: 11_957,
      source: charge.id,
    });
    expect(txn.id).toMatch(/^txn_/);
    const again = await stripe.paymentIntents.retrieve(pi.id);
    expect(again.latest_charge).toBe(charge.id);
    expect(typeof again.created).toBe("number");
  });

  it("answers a declined card with StripeCardError and decline_code, and leaves a failed charge", async () => {
    const pm = await card("4000000000000002");
    const err = await caught(
      stripe.paymentIntents.create({ amount: 5000, currency: "usd", payment_method: pm.id, confirm: true }),
    );
    expect(err).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(err.statusCode).toBe(402);
    expect(err.code).toBe("card_declined");
    expect(err.decline_code).toBe("generic_decline");
    const pi = err.payment_intent!;
    expect(pi.status).toBe("requires_payment_method");
    expect(pi.last_payment_error?.decline_code).toBe("generic_decline");
    const charge = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(charge).toMatchObject({
      status: "failed",
      paid: false,
      balance_transaction: null,
      failure_code: "card_declined",
    });
  });

  it("stops at requires_action and pays once the test authentication is completed", async () => {
    const pm = await card("4000002500003155");
    const pi = await stripe.paymentIntents.create({
      amount: 7000,
      currency: "usd",
      payment_method: pm.id,
      confirm: true,
    });
    expect(pi.status).toBe("requires_action");
    expect(pi.next_action?.type).toBe("use_stripe_sdk");
    expect(pi.latest_charge).toBeNull();
    const done = (await stripe.rawRequest("POST", `/_fake/payment_intents/${pi.id}/authenticate`, {
      outcome: "succeed",
    })) as unknown as Stripe.PaymentIntent;
    expect(done.status).toBe("succeeded");
    const charge = await stripe.charges.retrieve((await stripe.paymentIntents.retrieve(pi.id)).latest_charge as string);
    expect(charge.payment_method_details?.card?.three_d_secure?.result).toBe("authenticated");
    expect(charge.balance_transaction).toMatch(/^txn_/);
  });

  it("sends a browser through the authentication page back to the return_url", async () => {
    const pm = await card("4000002500003155");
    const pi = await stripe.paymentIntents.create({
      amount: 6000,
      currency: "usd",
      payment_method: pm.id,
      confirm: true,
      return_url: "http://127.0.0.1:3000/checkout/done",
    });
    expect(pi.next_action?.type).toBe("redirect_to_url");
    const url = pi.next_action!.redirect_to_url!.url!;
    expect(url).toMatch(new RegExp(`^${fake.url}/_fake/3ds/${pi.id}/payatt_[A-Za-z0-9]+$`));
    const page = await fetch(url);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('value="succeed"');
    const res = await fetch(url, {
      method: "POST",
      body: new URLSearchParams({ outcome: "succeed" }),
      redirect: "manual",
    });
    expect(res.status).toBe(303);
    const back = new URL(res.headers.get("location")!);
    expect(back.pathname).toBe("/checkout/done");
    expect(back.searchParams.get("payment_intent")).toBe(pi.id);
    expect(back.searchParams.get("redirect_status")).toBe("succeeded");
    expect((await stripe.paymentIntents.retrieve(pi.id)).status).toBe("succeeded");
  });

  it("returns a failed authentication to requires_payment_method", async () => {
    const pm = await card("4000000000003220");
    const pi = await stripe.paymentIntents.create({
      amount: 6000,
      currency: "usd",
      payment_method: pm.id,
      confirm: true,
    });
    const res = await fetch(`${fake.url}/_fake/payment_intents/${pi.id}/authenticate`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ outcome: "fail" }),
    });
    const failed = (await res.json()) as Stripe.PaymentIntent;
    expect(failed.status).toBe("requires_payment_method");
    expect(failed.last_payment_error?.code).toBe("payment_intent_authentication_failure");
    const twice = await fetch(`${fake.url}/_fake/payment_intents/${pi.id}/authenticate`, {
      method: "POST",
      body: new URLSearchParams({ outcome: "succeed" }),
    });
    expect(twice.status).toBe(400);
  });

  it("a confirmation with another card supersedes a pending authentication, which can then never complete", async () => {
    // The processor's documented practice: confirming a PaymentIntent again with a new payment method replaces
    // the next_action of the earlier confirmation [Stripe API reference, "Confirm a PaymentIntent"].
    const pi = await stripe.paymentIntents.create({
      amount: 5_000,
      currency: "usd",
      payment_method: (await card("4000002500003155")).id,
      confirm: true,
      return_url: "http://127.0.0.1:3000/done",
    });
    const oldPage = pi.next_action!.redirect_to_url!.url!;
    const oldAuth = oldPage.split("/").at(-1)!;
    const second = await stripe.paymentIntents.confirm(pi.id, { payment_method: (await card("4000000000003220")).id });
    expect(second.status).toBe("requires_action");
    expect(second.next_action!.redirect_to_url!.url).not.toBe(oldPage);
    expect((await fetch(oldPage)).status).toBe(409);
    const stale = await fetch(`${fake.url}/_fake/payment_intents/${pi.id}/authenticate`, {
      method: "POST",
      body: new URLSearchParams({ outcome: "succeed", authentication: oldAuth }),
    });
    expect(stale.status).toBe(400);
    expect((await stripe.paymentIntents.retrieve(pi.id)).status).toBe("requires_action");
    // Paid with a third card: the second check is gone too, and only one charge succeeded.
    const paidNow = await stripe.paymentIntents.confirm(pi.id, { payment_method: (await card("4242424242424242")).id });
    expect(paidNow.status).toBe("succeeded");
    const late = await fetch(second.next_action!.redirect_to_url!.url!, {
      method: "POST",
      body: new URLSearchParams({ outcome: "succeed" }),
      redirect: "manual",
    });
    expect(late.status).toBe(400);
    const charges = await stripe.charges.list({ payment_intent: pi.id });
    expect(charges.data.filter((c) => c.status === "succeeded")).toHaveLength(1);
  });

  it("holds with capture_method=manual and captures part of it", async () => {
    const pi = await paid(10_000, { capture_method: "manual" });
    expect(pi).toMatchObject({ status: "requires_capture", amount_capturable: 10_000, amount_received: 0 });
    const captured = await stripe.paymentIntents.capture(pi.id, {
      amount_to_capture: 4000,
      expand: ["latest_charge.balance_transaction"],
    });
    expect(captured.status).toBe("succeeded");
    const txn = (captured.latest_charge as Stripe.Charge).balance_transaction as Stripe.BalanceTransaction;
    expect(txn).toMatchObject({ amount: 4000, fee: 146, net: 3854 });
  });

  it("cancels an unpaid intent and refuses to cancel a paid one", async () => {
    const open = await stripe.paymentIntents.create({ amount: 900, currency: "usd" });
    expect((await stripe.paymentIntents.cancel(open.id, { cancellation_reason: "abandoned" })).status).toBe("canceled");
    const done = await paid(900);
    const err = await caught(stripe.paymentIntents.cancel(done.id));
    expect(err).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(err.code).toBe("payment_intent_unexpected_state");
  });

  it("refuses bad input in Stripe's error shape", async () => {
    const badNumber = await caught(
      stripe.paymentMethods.create({ type: "card", card: { number: "4242424242424241", ...EXP } }),
    );
    expect(badNumber).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(badNumber.code).toBe("invalid_number");
    const missing = await caught(stripe.paymentIntents.retrieve("pi_doesnotexist"));
    expect(missing.statusCode).toBe(404);
    expect(missing.code).toBe("resource_missing");
    const small = await caught(stripe.paymentIntents.create({ amount: 10, currency: "usd" }));
    expect(small.code).toBe("amount_too_small");
    const unknown = await caught(stripe.paymentIntents.create({ amount: 1000, currency: "usd", customer: "cus_1" }));
    expect(unknown.code).toBe("parameter_unknown");
    expect(unknown.param).toBe("customer");
    const wrongKey = await caught(client(fake.port, "rk_live_nope").balance.retrieve());
    expect(wrongKey).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    const route = await fetch(`${fake.url}/v1/nothing_here`, { headers: { authorization: "Bearer sk_test_unit" } });
    expect(route.status).toBe(404);
    expect(((await route.json()) as { error: { type: string } }).error.type).toBe("invalid_request_error");
    const noKey = await fetch(`${fake.url}/v1/balance`);
    expect(noKey.status).toBe(401);
  });

  it("accepts only the configured key when one is given", async () => {
    const strictDir = mkdtempSync(path.join(tmpdir(), "stripe-fake-key-"));
    const strict = await startStripeFake({
      portRange: PORTS,
      dataDir: strictDir,
      webhookSecret: SECRET,
      apiKey: "sk_test_only_this",
    });
    try {
      expect((await client(strict.port, "sk_test_only_this").balance.retrieve()).object).toBe("balance");
      const err = await caught(client(strict.port, "sk_test_another").balance.retrieve());
      expect(err.statusCode).toBe(401);
      expect(err.message).not.toContain("sk_test_another");
    } finally {
      await strict.close();
      rmSync(strictDir, { recursive: true, force: true });
    }
  });

  it("pages lists newest first with limit and starting_after", async () => {
    const group = `page-${Date.now()}`;
    const ids: string[] = [];
    for (let i = 0; i < 3; i++)
      ids.push((await stripe.paymentIntents.create({ amount: 1000 + i, currency: "usd", transfer_group: group })).id);
    const first = await stripe.paymentIntents.list({
      limit: 2,
      transfer_group: group,
    } as Stripe.PaymentIntentListParams);
    expect(first.object).toBe("list");
    expect(first.url).toBe("/v1/payment_intents");
    expect(first.data.map((x) => x.id)).toEqual([ids[2], ids[1]]);
    expect(first.has_more).toBe(true);
    const second = await stripe.paymentIntents.list({
      limit: 2,
      starting_after: ids[1],
      transfer_group: group,
    } as Stripe.PaymentIntentListParams);
    expect(second.data.map((x) => x.id)).toEqual([ids[0]]);
    expect(second.has_more).toBe(false);
  });
});

describe("idempotency", () => {
  it("replays the same key and refuses it with other parameters or on another endpoint", async () => {
    const key = `lot:1:charge:${Date.now()}`;
    const a = await stripe.paymentIntents.create(
      { amount: 2500, currency: "usd", metadata: { lot: "1" } },
      { idempotencyKey: key },
    );
    const b = await stripe.paymentIntents.create(
      { amount: 2500, currency: "usd", metadata: { lot: "1" } },
      { idempotencyKey: key },
    );
    expect(b.id).toBe(a.id);
    expect(b.lastResponse.headers["idempotent-replayed"]).toBe("true");
    const other = await caught(
      stripe.paymentIntents.create({ amount: 2600, currency: "usd", metadata: { lot: "1" } }, { idempotencyKey: key }),
    );
    expect(other).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(other.statusCode).toBe(400);
    const elsewhere = await caught(stripe.refunds.create({ payment_intent: a.id }, { idempotencyKey: key }));
    expect(elsewhere).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    const list = await stripe.paymentIntents.list({ limit: 100 });
    expect(list.data.filter((x) => x.id === a.id)).toHaveLength(1);
  });

  it("replays a decline as the same decline without charging again", async () => {
    const pm = await card("4000000000009995");
    const key = `decline:${Date.now()}`;
    const params = { amount: 3000, currency: "usd", payment_method: pm.id, confirm: true };
    const first = await caught(stripe.paymentIntents.create(params, { idempotencyKey: key }));
    const second = await caught(stripe.paymentIntents.create(params, { idempotencyKey: key }));
    expect(first.decline_code).toBe("insufficient_funds");
    expect(second.decline_code).toBe("insufficient_funds");
    expect(second.payment_intent?.id).toBe(first.payment_intent?.id);
    const charges = await stripe.charges.list({ payment_intent: first.payment_intent!.id });
    expect(charges.data).toHaveLength(1);
  });
});

describe("connected accounts, transfers, reversals, refunds", () => {
  it("moves the platform balance with charges, transfers and reversals", async () => {
    const account = await stripe.accounts.create({
      type: "custom",
      country: "US",
      capabilities: { transfers: { requested: true } },
      metadata: { dealer: "d-1" },
    });
    expect(account.id).toMatch(/^acct_/);
    expect(account.capabilities?.transfers).toBe("active");
    expect((await stripe.accounts.retrieve(account.id)).metadata).toEqual({ dealer: "d-1" });

    const before = await available();
    const pi = await paid(20_000, { transfer_group: "lot-20" }); // fee 610, net 19 390
    const afterCharge = await available();
    expect(afterCharge - before).toBe(19_390);

    const transfer = await stripe.transfers.create({
      amount: 15_000,
      currency: "usd",
      destination: account.id,
      transfer_group: "lot-20",
      metadata: { lot: "20" },
    });
    expect(transfer.id).toMatch(/^tr_/);
    expect(transfer).toMatchObject({ destination: account.id, amount_reversed: 0, reversed: false });
    expect(await available()).toBe(afterCharge - 15_000);
    expect(await available("usd", account.id)).toBe(15_000);

    const reversal = await stripe.transfers.createReversal(transfer.id, { amount: 4000 });
    expect(reversal.id).toMatch(/^trr_/);
    expect(await available()).toBe(afterCharge - 11_000);
    expect(await available("usd", account.id)).toBe(11_000);
    const t = await stripe.transfers.retrieve(transfer.id);
    expect(t).toMatchObject({ amount_reversed: 4000, reversed: false });
    expect(t.reversals.data.map((r) => r.id)).toEqual([reversal.id]);
    const tooMuch = await caught(stripe.transfers.createReversal(transfer.id, { amount: 11_001 }));
    expect(tooMuch.code).toBe("amount_too_large");

    const txns = await stripe.balanceTransactions.list({ limit: 100 });
    const bySource = new Map(txns.data.map((x) => [x.source as string, x]));
    expect(bySource.get(transfer.id)).toMatchObject({ type: "transfer", amount: -15_000, fee: 0, net: -15_000 });
    expect(bySource.get(reversal.id)).toMatchObject({
      type: "transfer_refund",
      reporting_category: "transfer_reversal",
      amount: 4000,
      net: 4000,
    });
    expect(bySource.get(pi.latest_charge as string)).toMatchObject({ type: "charge", fee: 610, net: 19_390 });
    const onlyTransfers = await stripe.balanceTransactions.list({ type: "transfer", limit: 100 });
    expect(onlyTransfers.data.every((x) => x.type === "transfer")).toBe(true);
    expect(onlyTransfers.data.some((x) => x.source === transfer.id)).toBe(true);
  });

  it("refuses a transfer larger than the available balance, and one to an account without the capability", async () => {
    const account = await stripe.accounts.create({ type: "express", capabilities: { transfers: { requested: true } } });
    const err = await caught(
      stripe.transfers.create({ amount: (await available()) + 1, currency: "usd", destination: account.id }),
    );
    expect(err).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(err.code).toBe("balance_insufficient");
    const bare = await stripe.accounts.create({ type: "custom" });
    const noCap = await caught(stripe.transfers.create({ amount: 100, currency: "usd", destination: bare.id }));
    expect(noCap.param).toBe("destination");
    const nobody = await caught(stripe.transfers.create({ amount: 100, currency: "usd", destination: "acct_nobody" }));
    expect(nobody.code).toBe("resource_missing");
  });

  it("caps transfers from a source_transaction at what is left of that charge", async () => {
    const account = await stripe.accounts.create({ type: "custom", capabilities: { transfers: { requested: true } } });
    const pi = await paid(8000);
    const charge = pi.latest_charge as string;
    await stripe.transfers.create({
      amount: 6000,
      currency: "usd",
      destination: account.id,
      source_transaction: charge,
    });
    const err = await caught(
      stripe.transfers.create({ amount: 2001, currency: "usd", destination: account.id, source_transaction: charge }),
    );
    expect(err.code).toBe("balance_insufficient");
    const rest = await stripe.transfers.create({
      amount: 2000,
      currency: "usd",
      destination: account.id,
      source_transaction: charge,
    });
    expect(rest.source_transaction).toBe(charge);
  });

  it("refunds part, refuses more than is left, then refunds the rest", async () => {
    const pi = await paid(10_000);
    const before = await available();
    const part = await stripe.refunds.create({ payment_intent: pi.id, amount: 3000, reason: "requested_by_customer" });
    expect(part.id).toMatch(/^re_/);
    expect(part).toMatchObject({ status: "succeeded", amount: 3000, payment_intent: pi.id, charge: pi.latest_charge });
    expect(await available()).toBe(before - 3000);
    const over = await caught(stripe.refunds.create({ payment_intent: pi.id, amount: 7001 }));
    expect(over).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(over.code).toBe("amount_too_large");
    expect(over.param).toBe("amount");
    const rest = await stripe.refunds.create({ payment_intent: pi.id });
    expect(rest.amount).toBe(7000);
    const charge = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(charge).toMatchObject({ amount_refunded: 10_000, refunded: true });
    const again = await caught(stripe.refunds.create({ payment_intent: pi.id, amount: 1 }));
    expect(again.code).toBe("charge_already_refunded");
    const refundTxn = await stripe.balanceTransactions.retrieve(part.balance_transaction as string);
    expect(refundTxn).toMatchObject({ type: "refund", amount: -3000, fee: 0, net: -3000, source: part.id });
    expect((await stripe.refunds.list({ payment_intent: pi.id })).data.map((r) => r.amount)).toEqual([7000, 3000]);
  });
});

describe("lists and expand", () => {
  it("expands the source of balance transactions and pages backwards with ending_before", async () => {
    for (const amount of [3100, 3200, 3300]) await paid(amount);
    const pi = await paid(3300);
    const page = await stripe.balanceTransactions.list({ type: "charge", limit: 3, expand: ["data.source"] });
    const mine = page.data.find((t) => (t.source as Stripe.Charge).id === pi.latest_charge);
    expect((mine?.source as Stripe.Charge).object).toBe("charge");
    const all = await stripe.balanceTransactions.list({ limit: 100 });
    const ids = all.data.map((t) => t.id);
    const back = await stripe.balanceTransactions.list({ limit: 2, ending_before: ids[3] });
    expect(back.data.map((t) => t.id)).toEqual([ids[1], ids[2]]);
    expect(back.has_more).toBe(true);
    const bad = await caught(stripe.paymentIntents.retrieve(pi.id, { expand: ["no_such_field"] }));
    expect(bad.statusCode).toBe(400);
  });

  it("honours Stripe-Account only where the fake supports it", async () => {
    const account = await stripe.accounts.create({ type: "custom", capabilities: { transfers: { requested: true } } });
    expect((await stripe.balance.retrieve({}, { stripeAccount: account.id })).object).toBe("balance");
    const err = await caught(stripe.paymentIntents.list({}, { stripeAccount: account.id }));
    expect(err.statusCode).toBe(400);
  });
});

describe("events", () => {
  it("records events with the SDK's pinned API version, filterable by type", async () => {
    const pi = await paid(1500);
    const list = await stripe.events.list({ type: "payment_intent.*", limit: 100 });
    const mine = list.data.find((e) => (e.data.object as { id?: string }).id === pi.id);
    expect(mine?.type).toBe("payment_intent.succeeded");
    expect(mine?.api_version).toBe(Stripe.API_VERSION);
    expect(mine?.id).toMatch(/^evt_/);
    expect(list.data.every((e) => e.type.startsWith("payment_intent."))).toBe(true);
    const one = await stripe.events.retrieve(mine!.id);
    expect((one.data.object as Stripe.PaymentIntent).status).toBe("succeeded");
    expect(one.pending_webhooks).toBe(0); // this fake has no webhook URL
  });
});
