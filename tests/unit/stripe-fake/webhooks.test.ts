// Webhook delivery from the local Stripe fake to a tiny receiver, checked with the SDK's constructEvent;
// retries, redelivery, and what survives a restart on the same data directory.
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import http from "node:http";
import { tmpdir } from "node:os";
import path from "node:path";
import Stripe from "stripe";
import { afterEach, describe, expect, it, vi } from "vitest";
import { startStripeFake, type StripeFake, type StripeFakeOptions } from "@/server/stripe-fake";
import { listenOn } from "@/server/stripe-fake/ports";

const SECRET = "whsec_unit_webhooks";
const PORTS: [number, number] = [12111, 12199];
const EXP = { exp_month: 11, exp_year: new Date().getUTCFullYear() + 2 };
const verifier = new Stripe("sk_test_unit", { telemetry: false });

type Received = { body: string; signature: string; event: Stripe.Event };

/** A webhook endpoint that answers `statuses` in turn (then 200) and verifies every signature. */
class Receiver {
  readonly got: Received[] = [];
  url = "";
  private readonly server = http.createServer((req, res) => this.onRequest(req, res));
  private waiters: Array<{ n: number; resolve: () => void }> = [];

  constructor(private statuses: number[] = []) {}

  async start(): Promise<this> {
    const port = await listenOn(this.server, "127.0.0.1", PORTS);
    this.url = `http://127.0.0.1:${port}/api/webhooks/stripe`;
    return this;
  }

  answer(statuses: number[]): void {
    this.statuses = statuses;
  }

  private onRequest(req: http.IncomingMessage, res: http.ServerResponse): void {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      const body = Buffer.concat(chunks).toString("utf8");
      const signature = String(req.headers["stripe-signature"] ?? "");
      const event = verifier.webhooks.constructEvent(body, signature, SECRET); // throws on a bad signature
      this.got.push({ body, signature, event });
      res.writeHead(this.statuses.shift() ?? 200).end();
      this.waiters = this.waiters.filter((w) => (this.got.length >= w.n ? (w.resolve(), false) : true));
    });
  }

  /** Resolves once `n` deliveries have arrived. */
  received(n: number): Promise<void> {
    if (this.got.length >= n) return Promise.resolve();
    return new Promise((resolve) => this.waiters.push({ n, resolve }));
  }

  close(): Promise<void> {
    return new Promise((resolve) => {
      this.server.close(() => resolve());
      this.server.closeAllConnections();
    });
  }
}

const cleanup: Array<() => Promise<void> | void> = [];
afterEach(async () => {
  while (cleanup.length) await cleanup.pop()!();
});

function tempDir(): string {
  const dir = mkdtempSync(path.join(tmpdir(), "stripe-fake-hooks-"));
  cleanup.push(() => rmSync(dir, { recursive: true, force: true }));
  return dir;
}

async function boot(
  dataDir: string,
  webhookUrl: string,
  extra: Partial<StripeFakeOptions> = {},
): Promise<{ fake: StripeFake; stripe: Stripe }> {
  const fake = await startStripeFake({
    portRange: PORTS,
    dataDir,
    webhookUrl,
    webhookSecret: SECRET,
    webhookRetry: { baseMs: 20, maxAttempts: 8 },
    ...extra,
  });
  cleanup.push(() => fake.close());
  const stripe = new Stripe("sk_test_unit", {
    host: "127.0.0.1",
    port: fake.port,
    protocol: "http",
    maxNetworkRetries: 0,
    telemetry: false,
  });
  return { fake, stripe };
}

async function receiver(statuses: number[] = []): Promise<Receiver> {
  const r = await new Receiver(statuses).start();
  cleanup.push(() => r.close());
  return r;
}

async function pay(stripe: Stripe, number = "4242424242424242", amount = 4200): Promise<Stripe.PaymentIntent> {
  const pm = await stripe.paymentMethods.create({ type: "card", card: { number, cvc: "123", ...EXP } });
  return stripe.paymentIntents.create({
    amount,
    currency: "usd",
    payment_method: pm.id,
    confirm: true,
    metadata: { lot: "9" },
  });
}

type DeliveryRow = { event: string; state: string; attempts: number; type: string };

async function deliveries(fake: StripeFake, event: string): Promise<DeliveryRow[]> {
  const res = await fetch(`${fake.url}/_fake/deliveries?event=${event}`);
  return ((await res.json()) as { data: DeliveryRow[] }).data;
}

/** Polls the fake until its record of `event`'s delivery satisfies `done` (the receiver has already answered). */
async function deliveryWhere(
  fake: StripeFake,
  event: string,
  done: (row: DeliveryRow) => boolean,
): Promise<DeliveryRow> {
  return vi.waitFor(
    async () => {
      const [row] = await deliveries(fake, event);
      if (!row || !done(row)) throw new Error(`delivery of ${event} has not reached the expected state`);
      return row;
    },
    { timeout: 5_000, interval: 10 },
  );
}

function settled(fake: StripeFake, event: string): Promise<DeliveryRow> {
  return deliveryWhere(fake, event, (row) => row.state !== "pending");
}

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = path.join(dir, name);
    return statSync(p).isDirectory() ? filesUnder(p) : [p];
  });
}

describe("webhooks", () => {
  it("delivers a signed payment_intent.succeeded that constructEvent accepts", async () => {
    const hook = await receiver();
    const { fake, stripe } = await boot(tempDir(), hook.url);
    const pi = await pay(stripe);
    await hook.received(1);
    const { event, signature, body } = hook.got[0];
    expect(event.type).toBe("payment_intent.succeeded");
    expect(event.api_version).toBe(Stripe.API_VERSION);
    expect(event.livemode).toBe(false);
    expect(event.id).toMatch(/^evt_/);
    const object = event.data.object as Stripe.PaymentIntent;
    expect(object).toMatchObject({ id: pi.id, status: "succeeded", metadata: { lot: "9" } });
    expect(signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    expect(() => verifier.webhooks.constructEvent(body, signature, "whsec_someone_else")).toThrow();
    expect((await settled(fake, event.id)).state).toBe("delivered");
    expect((await stripe.events.retrieve(event.id)).pending_webhooks).toBe(0);
  });

  it("sends the failure and authentication events, and transfer events", async () => {
    const hook = await receiver();
    const { stripe } = await boot(tempDir(), hook.url);
    await pay(stripe, "4000000000000002").catch(() => undefined);
    await pay(stripe, "4000002500003155");
    const account = await stripe.accounts.create({ type: "custom", capabilities: { transfers: { requested: true } } });
    await pay(stripe, "4242424242424242", 10_000);
    const transfer = await stripe.transfers.create({ amount: 5000, currency: "usd", destination: account.id });
    await stripe.transfers.createReversal(transfer.id, { amount: 500 });
    await hook.received(5);
    const types = hook.got.map((g) => g.event.type).sort();
    expect(types).toEqual(
      [
        "payment_intent.payment_failed",
        "payment_intent.requires_action",
        "payment_intent.succeeded",
        "transfer.created",
        "transfer.reversed",
      ].sort(),
    );
    const reversed = hook.got.find((g) => g.event.type === "transfer.reversed")!.event.data.object as Stripe.Transfer;
    expect(reversed).toMatchObject({ id: transfer.id, amount_reversed: 500 });
  });

  it("retries a receiver that fails twice and records three attempts for one event", async () => {
    const hook = await receiver([500, 503]);
    const { fake, stripe } = await boot(tempDir(), hook.url);
    const pi = await pay(stripe, "4242424242424242", 8000);
    await hook.received(3);
    const succeeded = hook.got.filter((g) => g.event.type === "payment_intent.succeeded");
    expect(succeeded).toHaveLength(3);
    expect(new Set(succeeded.map((g) => g.event.id)).size).toBe(1);
    const row = await settled(fake, succeeded[0].event.id);
    expect(row).toMatchObject({ state: "delivered", attempts: 3 });
    await stripe.refunds.create({ payment_intent: pi.id, amount: 1000 });
    await hook.received(4);
    expect(hook.got[3].event.type).toBe("charge.refunded");
    expect(hook.got[3].event.data.object).toMatchObject({
      id: pi.latest_charge,
      amount_refunded: 1000,
      refunded: false,
    });
  });

  it("gives up after maxAttempts and sends again on request", async () => {
    const hook = await receiver([500, 500, 500]);
    const { fake, stripe } = await boot(tempDir(), hook.url, { webhookRetry: { baseMs: 5, maxAttempts: 3 } });
    await pay(stripe);
    await hook.received(3);
    const id = hook.got[0].event.id;
    expect(await settled(fake, id)).toMatchObject({ state: "failed", attempts: 3 });
    const res = await fetch(`${fake.url}/_fake/events/${id}/redeliver`, { method: "POST" });
    expect(res.status).toBe(200);
    await hook.received(4);
    expect(hook.got[3].event.id).toBe(id);
    expect(await settled(fake, id)).toMatchObject({ state: "delivered", attempts: 1 });
    const missing = await fetch(`${fake.url}/_fake/events/evt_nope/redeliver`, { method: "POST" });
    expect(missing.status).toBe(404);
  });
});

describe("restart", () => {
  it("keeps every object and resumes a pending delivery on the same data directory", async () => {
    const dir = tempDir();
    const hook = await receiver([503, 503, 503]);
    // A long retry delay: after the first failure the delivery waits, pending, until the restart.
    const first = await boot(dir, hook.url, { webhookRetry: { baseMs: 600_000, maxAttempts: 8 } });
    const pi = await pay(first.stripe, "4242424242424242", 9100);
    const account = await first.stripe.accounts.create({
      type: "custom",
      capabilities: { transfers: { requested: true } },
    });
    await hook.received(1);
    const eventId = hook.got[0].event.id;
    // The failed attempt is on record and the next one is ten minutes away when the fake stops.
    await deliveryWhere(first.fake, eventId, (row) => row.attempts === 1);
    await first.fake.close();
    const saved = JSON.parse(readFileSync(path.join(dir, "state.json"), "utf8")) as {
      deliveries: Record<string, { state: string; attempts: number; next_attempt_at: number }>;
    };
    expect(saved.deliveries[eventId]).toMatchObject({ state: "pending", attempts: 1 });
    expect(saved.deliveries[eventId].next_attempt_at).toBeGreaterThan(Date.now() + 60_000);

    hook.answer([]); // the receiver is healthy now
    const second = await boot(dir, hook.url, { webhookRetry: { baseMs: 600_000, maxAttempts: 8 } });
    await hook.received(2);
    expect(hook.got[1].event.id).toBe(eventId);
    expect(await settled(second.fake, eventId)).toMatchObject({ state: "delivered", attempts: 2 });

    const again = await second.stripe.paymentIntents.retrieve(pi.id, { expand: ["latest_charge"] });
    expect(again.status).toBe("succeeded");
    expect((again.latest_charge as Stripe.Charge).amount).toBe(9100);
    expect((await second.stripe.accounts.retrieve(account.id)).id).toBe(account.id);
    const balance = await second.stripe.balance.retrieve();
    expect(balance.available[0].amount).toBe(9100 - 294); // 263.9 → 264, + 30
    // The idempotency store survives too: the SDK's retry after a restart gets the stored answer.
    const key = `after-restart-${Date.now()}`;
    const a = await second.stripe.paymentIntents.create({ amount: 700, currency: "usd" }, { idempotencyKey: key });
    await second.fake.close();
    const third = await boot(dir, hook.url);
    const b = await third.stripe.paymentIntents.create({ amount: 700, currency: "usd" }, { idempotencyKey: key });
    expect(b.id).toBe(a.id);
  });

  it("refuses a second fake on a directory that is in use", async () => {
    const dir = tempDir();
    await boot(dir, "");
    await expect(boot(dir, "")).rejects.toThrow(/in use/);
  });
});

describe("card data", () => {
  it("never writes a full card number or a security code to the data directory", async () => {
    const dir = tempDir();
    const hook = await receiver();
    const { fake, stripe } = await boot(dir, hook.url);
    const numbers = ["4242424242424242", "4000000000000002", "4000002500003155", "4000000000009995"];
    for (const [i, number] of numbers.entries()) {
      const key = `pm-${i}`;
      const pm = await stripe.paymentMethods.create(
        { type: "card", card: { number, cvc: "123", ...EXP } },
        { idempotencyKey: key },
      );
      await stripe.paymentMethods.create(
        { type: "card", card: { number, cvc: "123", ...EXP } },
        { idempotencyKey: key },
      ); // replayed
      await stripe.paymentIntents
        .create({ amount: 1000, currency: "usd", payment_method: pm.id, confirm: true })
        .catch(() => undefined);
    }
    await hook.received(4);
    await fake.close();
    const files = filesUnder(dir);
    expect(files.some((f) => f.endsWith("state.json"))).toBe(true);
    const text = files.map((f) => readFileSync(f, "utf8")).join("\n");
    expect(text).toContain('"last4":"4242"'); // the store is what was read: the cards are in it
    for (const number of numbers) expect(text).not.toContain(number);
    expect(text).not.toContain('"cvc"');
    const received = hook.got.map((g) => g.body).join("\n");
    for (const number of numbers) expect(received).not.toContain(number);
  });
});
