// The local Stripe fake driven by the real `stripe` SDK, as the app will drive it: payments, declines,
// authentication and keys.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { startStripeFake } from "@/server/stripe-fake";
import { card, caught, client, EXP, fake, paid, PORTS, SECRET, startFakePerFile, stripe } from "./harness";

startFakePerFile();

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
