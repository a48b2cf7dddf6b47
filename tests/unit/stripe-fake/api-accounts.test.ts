// The local Stripe fake driven by the real `stripe` SDK: idempotency, connected accounts, transfers, reversals,
// refunds, lists and events.
import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { available, card, caught, paid, startFakePerFile, stripe } from "./harness";

startFakePerFile();

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
