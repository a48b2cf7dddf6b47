// Money safety as buyers and processors really behave: two tabs, abandoned authentications finished late,
// retries after authentication, a second charge that arrives anyway, events from another integration, and a
// payment whose webhook is still on its way. The processor is our local stand-in behind the official SDK.
import { QueryTypes } from "sequelize";
import type Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { ApiError } from "../../lib/api/errors";
import { acceptDelivery, markDelivered, markShipped } from "../../lib/services/escrow";
import { getInvoice } from "../../lib/services/invoices";
import { payInvoice } from "../../lib/services/payments";
import { balances, trialBalance } from "../../lib/services/ledger";
import { reconcile } from "../../lib/services/reconcile";
import { listUnexpectedCharges } from "../../lib/services/unexpected-charges";
import { stripe } from "../../lib/stripe/client";
import { db } from "../../models";
import { startTestStripe, type TestStripe } from "../setup/stripe";
import { invoicedLot, viewerOf, waitForSubject } from "../support/factories";

let fake: TestStripe;
beforeAll(async () => {
  fake = await startTestStripe();
});
afterAll(async () => {
  await fake.stop();
});

// Test cards of the processor's published test-card table (stand-in: server/stripe-fake/cards.ts).
const PAYS = "4242424242424242";
const ASKS_AUTHENTICATION = "4000002500003155";
const card = (number: string, attemptKey: string) => ({ number, expMonth: 12, expYear: 2030, cvc: "123", attemptKey });

const one = async <T extends object>(sql: string, replacements: Record<string, unknown>) =>
  (await db().query<T>(sql, { replacements, type: QueryTypes.SELECT }))[0];
const invoice = (id: string) =>
  one<{ state: string; number: string; total_cents: number; payment_intent_id: string | null; paid_at: Date | null }>(
    `SELECT state, number, total_cents, payment_intent_id, paid_at FROM invoices WHERE id = :id`,
    { id },
  );
const paidHeld = (id: string) =>
  vi.waitFor(async () => expect((await invoice(id))!.state).toBe("paid-held"), { timeout: 10_000, interval: 100 });

/** Every successful, captured processor charge that names this invoice. */
async function chargesFor(invoiceId: string): Promise<Stripe.Charge[]> {
  const out: Stripe.Charge[] = [];
  for await (const c of stripe().charges.list({ limit: 100 }))
    if (c.metadata?.invoice_id === invoiceId && c.status === "succeeded") out.push(c);
  return out;
}

async function postSignedEvent(event: object): Promise<Response> {
  const { POST } = await import("../../app/api/webhooks/stripe/route");
  const { NextRequest } = await import("next/server");
  const payload = JSON.stringify(event);
  const signature = stripe().webhooks.generateTestHeaderString({ payload, secret: process.env.STRIPE_WEBHOOK_SECRET! });
  return POST(
    new NextRequest("http://localhost:3000/api/webhooks/stripe", {
      method: "POST",
      body: payload,
      headers: { "stripe-signature": signature, "content-type": "application/json" },
    }),
  );
}

describe("one charge per invoice", () => {
  it("two tabs paying at once with their own attempt keys make exactly one charge; the other tab is told why", async () => {
    const f = await invoicedLot();
    const tabs = await Promise.allSettled([
      payInvoice(viewerOf(f.buyer), f.invoiceId, card(PAYS, "tab-one-attempt")),
      payInvoice(viewerOf(f.buyer), f.invoiceId, card(PAYS, "tab-two-attempt")),
    ]);
    expect(
      tabs
        .filter((t) => t.status === "fulfilled")
        .map((t) => (t as PromiseFulfilledResult<{ status: string }>).value.status),
    ).toEqual(["succeeded"]);
    const refusal = (tabs.find((t) => t.status === "rejected") as PromiseRejectedResult).reason as ApiError;
    expect(refusal).toBeInstanceOf(ApiError);
    expect(refusal.status).toBe(409);
    expect(refusal.message).toMatch(/already been paid|already in progress/);
    await paidHeld(f.invoiceId);
    expect(await chargesFor(f.invoiceId)).toHaveLength(1);
    // A third try, later, from either tab: refused in words, nothing charged.
    const later = await payInvoice(viewerOf(f.buyer), f.invoiceId, card(PAYS, "tab-two-again")).catch(
      (e: unknown) => e,
    );
    expect((later as ApiError).code).toBe("conflict");
    expect((later as ApiError).details).toMatchObject({ reason: "already-paid", state: "paid-held" });
    expect(await chargesFor(f.invoiceId)).toHaveLength(1);
  }, 30_000);

  it("an abandoned authentication finished after another card paid charges nothing more", async () => {
    const f = await invoicedLot();
    const first = await payInvoice(viewerOf(f.buyer), f.invoiceId, card(ASKS_AUTHENTICATION, "card-needing-check"));
    expect(first.status).toBe("requires_action");
    const abandonedPage = (first as { redirectUrl: string }).redirectUrl;
    // The buyer gives up on the check and pays with another card: it confirms the same intent, superseding the check.
    expect((await payInvoice(viewerOf(f.buyer), f.invoiceId, card(PAYS, "second-card"))).status).toBe("succeeded");
    await paidHeld(f.invoiceId);
    // Much later the old check is completed in the tab left open: refused, and no second charge.
    const late = await fetch(abandonedPage, {
      method: "POST",
      body: new URLSearchParams({ outcome: "succeed" }),
      redirect: "manual",
    });
    expect(late.status).toBe(400);
    expect(((await late.json()) as { error: { message: string } }).error.message).toMatch(/no longer valid/);
    const page = await fetch(abandonedPage);
    expect(page.status).toBe(409);
    expect(await chargesFor(f.invoiceId)).toHaveLength(1);
    expect((await invoice(f.invoiceId))!.state).toBe("paid-held");
  }, 30_000);

  it("a retried attempt after authentication answers from the payment as it stands, not the first answer", async () => {
    const f = await invoicedLot();
    const attempt = card(ASKS_AUTHENTICATION, "retry-after-check");
    expect((await payInvoice(viewerOf(f.buyer), f.invoiceId, attempt)).status).toBe("requires_action");
    // Asked again before the check is done, the same attempt is sent back to the same open check.
    const again = await payInvoice(viewerOf(f.buyer), f.invoiceId, attempt);
    expect(again.status).toBe("requires_action");
    const pi = (await invoice(f.invoiceId))!.payment_intent_id!;
    const done = await fetch(`${fake.url}/_fake/payment_intents/${pi}/authenticate`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ outcome: "succeed" }),
    });
    expect(done.ok).toBe(true);
    expect(await payInvoice(viewerOf(f.buyer), f.invoiceId, attempt)).toEqual({ status: "succeeded" });
    await paidHeld(f.invoiceId);
    expect(await chargesFor(f.invoiceId)).toHaveLength(1);
  }, 30_000);
});

describe("defence in depth", () => {
  it("a second successful charge that arrives anyway is refunded automatically, posted both ways, listed and told", async () => {
    const f = await invoicedLot();
    expect((await payInvoice(viewerOf(f.buyer), f.invoiceId, card(PAYS, "the-real-payment"))).status).toBe("succeeded");
    await paidHeld(f.invoiceId);
    const inv = (await invoice(f.invoiceId))!;
    // Another integration on the same processor account charges the same invoice again (its own intent).
    const pm = await stripe().paymentMethods.create({
      type: "card",
      card: { number: PAYS, exp_month: 12, exp_year: 2030, cvc: "123" },
    });
    const stray = await stripe().paymentIntents.create({
      amount: inv.total_cents,
      currency: "usd",
      payment_method: pm.id,
      confirm: true,
      metadata: { invoice_id: f.invoiceId },
    });
    expect(stray.status).toBe("succeeded");
    await vi.waitFor(
      async () =>
        expect((await listUnexpectedCharges()).find((u) => u.paymentIntentId === stray.id)?.state).toBe("refunded"),
      { timeout: 10_000, interval: 100 },
    );
    const u = (await listUnexpectedCharges()).find((x) => x.paymentIntentId === stray.id)!;
    expect(u).toMatchObject({ invoiceId: f.invoiceId, amountCents: inv.total_cents, why: "second-payment" });
    // The processor refunded the whole second charge, and only it.
    expect((await stripe().refunds.list({ payment_intent: stray.id })).data.map((r) => r.amount)).toEqual([
      inv.total_cents,
    ]);
    expect(
      await stripe()
        .refunds.list({ payment_intent: inv.payment_intent_id! })
        .then((l) => l.data),
    ).toEqual([]);
    // Both movements are posted; the buyer is owed nothing more; the processor's fee is the house's cost.
    const kinds = await db().query<{ txn_kind: string }>(
      `SELECT DISTINCT txn_kind FROM ledger_entries WHERE invoice_id = :id`,
      { replacements: { id: f.invoiceId }, type: QueryTypes.SELECT },
    );
    expect(kinds.map((k) => k.txn_kind)).toEqual(
      expect.arrayContaining([`unexpected-charge:${stray.id}`, `unexpected-refund:${stray.id}`]),
    );
    expect((await balances(f.invoiceId))["unexpected-charges-payable"]).toBe(0);
    expect(await trialBalance()).toBe(0);
    // The invoice stays paid once; the buyer and the house are told, in the app and by e-mail.
    expect((await invoice(f.invoiceId))!.state).toBe("paid-held");
    await waitForSubject(f.buyer.email, /Refunded: a payment of .* that was not owed/);
    await waitForSubject(f.admin.email, /Unexpected charge refunded on invoice/);
    const notices = await db().query<{ user_id: string; text: string }>(
      `SELECT user_id, text FROM notices WHERE text LIKE :t`,
      { replacements: { t: `%${inv.number}%not owed%` }, type: QueryTypes.SELECT },
    );
    expect(notices.map((n) => n.user_id)).toContain(f.buyer.id);
    expect((await getInvoice(viewerOf(f.buyer), f.invoiceId)).unexpectedCharges).toEqual([
      { amountCents: inv.total_cents, state: "refunded", refundedAt: expect.any(String) },
    ]);
    expect((await getInvoice(viewerOf(f.consignor), f.invoiceId)).unexpectedCharges).toEqual([]);
    // A redelivery of the stray event changes nothing.
    const before = await balances();
    const evt = (await stripe().events.list({ type: "payment_intent.succeeded", limit: 100 })).data.find(
      (e) => (e.data.object as { id: string }).id === stray.id,
    )!;
    await fetch(`${fake.url}/_fake/events/${evt.id}/redeliver`, { method: "POST" });
    await vi.waitFor(
      async () =>
        expect(
          (
            (await (await fetch(`${fake.url}/_fake/deliveries?event=${evt.id}`)).json()) as {
              data: { state: string }[];
            }
          ).data[0]?.state,
        ).toBe("delivered"),
      { timeout: 10_000, interval: 100 },
    );
    expect(await balances()).toEqual(before);
    expect((await reconcile()).differences).toEqual([]);
  }, 40_000);
});

describe("webhooks refuse nothing valid and trust nothing unchecked", () => {
  const stored = (id: string) =>
    one<{ outcome: string; reason: string | null }>(`SELECT outcome, reason FROM payment_events WHERE event_id = :id`, {
      id,
    });

  it("a signed event from another integration is answered 2xx and kept as ignored, with the reason", async () => {
    const foreign = {
      id: `evt_foreign_${Date.now()}`,
      object: "event",
      type: "payment_intent.succeeded",
      data: {
        object: { id: "pi_OtherShop42", object: "payment_intent", amount: 4200, metadata: { invoice_id: "INV-0042" } },
      },
    };
    const r = await postSignedEvent(foreign);
    expect(r.status).toBe(200);
    expect(await r.json()).toMatchObject({ received: true, outcome: "ignored" });
    expect(await stored(foreign.id)).toEqual({ outcome: "ignored", reason: expect.stringContaining("INV-0042") });
    // The same once more is a duplicate, still 2xx.
    expect(((await (await postSignedEvent(foreign)).json()) as { outcome: string }).outcome).toBe("duplicate");
  });

  it("an invoice id we do not have, an unreadable payment and a type we do not act on are ignored too", async () => {
    const base = { object: "event", type: "payment_intent.succeeded" };
    const cases = [
      {
        ...base,
        id: `evt_unknown_${Date.now()}`,
        data: {
          object: {
            id: "pi_NotOurs1",
            object: "payment_intent",
            amount: 1000,
            metadata: { invoice_id: "7d1f0c52-9a3e-4b8e-8f51-2a0c6f1d9e77" },
          },
        },
        why: /do not have/,
      },
      {
        ...base,
        id: `evt_garbled_${Date.now()}`,
        data: { object: { id: 42, object: "payment_intent", amount: "lots", metadata: {} } },
        why: /could not be read/,
      },
      {
        ...base,
        id: `evt_nometa_${Date.now()}`,
        data: { object: { id: "pi_NoMeta1", object: "payment_intent", amount: 1000 } },
        why: /names no invoice/,
      },
      {
        ...base,
        id: `evt_other_${Date.now()}`,
        type: "customer.created",
        data: { object: { id: "cus_1" } },
        why: /do not act on customer.created/,
      },
    ];
    for (const { why, ...event } of cases) {
      const r = await postSignedEvent(event);
      expect(r.status, event.id).toBe(200);
      expect((await stored(event.id))?.reason).toMatch(why);
    }
  });
});

describe("reconciliation", () => {
  it("keeps a payment whose webhook has not arrived apart from real differences, and is clean once it lands", async () => {
    const f = await invoicedLot();
    fake.hold(true);
    try {
      expect((await payInvoice(viewerOf(f.buyer), f.invoiceId, card(PAYS, "while-our-end-is-down"))).status).toBe(
        "succeeded",
      );
      expect((await invoice(f.invoiceId))!.state).toBe("awaiting-payment");
      const pending = await reconcile();
      expect(pending.differences).toEqual([]);
      expect(pending.inFlight?.map((c) => c.invoiceId)).toEqual([f.invoiceId]);
    } finally {
      fake.hold(false);
    }
    const pi = (await invoice(f.invoiceId))!.payment_intent_id!;
    const evt = (await stripe().events.list({ type: "payment_intent.succeeded", limit: 100 })).data.find(
      (e) => (e.data.object as { id: string }).id === pi,
    )!;
    await fetch(`${fake.url}/_fake/events/${evt.id}/redeliver`, { method: "POST" }).catch(() => undefined); // in case its retries ran out
    await paidHeld(f.invoiceId);
    const after = await reconcile();
    expect(after.inFlight).toEqual([]);
    expect(after.differences).toEqual([]);
  }, 30_000);
});

describe("double clicks", () => {
  it("accepting a delivered lot twice at once releases once; the other click gets 409 with the invoice as it stands", async () => {
    const f = await invoicedLot();
    await payInvoice(viewerOf(f.buyer), f.invoiceId, card(PAYS, "pay-before-accepting"));
    await paidHeld(f.invoiceId);
    await markShipped(f.invoiceId, "Demo Parcel Co.", "DP777000111");
    const twice = await Promise.allSettled([markDelivered(f.invoiceId), markDelivered(f.invoiceId)]);
    expect(twice.map((t) => t.status).sort()).toEqual(["fulfilled", "rejected"]);
    expect(((twice.find((t) => t.status === "rejected") as PromiseRejectedResult).reason as ApiError).details).toEqual({
      state: "delivered",
    });
    const clicks = await Promise.allSettled([
      acceptDelivery(viewerOf(f.buyer), f.invoiceId),
      acceptDelivery(viewerOf(f.buyer), f.invoiceId),
    ]);
    expect(clicks.filter((c) => c.status === "fulfilled")).toHaveLength(1);
    const second = (clicks.find((c) => c.status === "rejected") as PromiseRejectedResult).reason as ApiError;
    expect(second).toBeInstanceOf(ApiError);
    expect(second.status).toBe(409);
    expect(second.details).toEqual({ state: "released" });
    const transfers = await stripe().transfers.list({ transfer_group: `invoice:${f.invoiceId}` });
    expect(transfers.data).toHaveLength(1);
    expect(await trialBalance()).toBe(0);
  }, 30_000);
});
