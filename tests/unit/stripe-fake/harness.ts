// One local Stripe fake per test file, driven by the real `stripe` SDK, with the small helpers the API tests share.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Stripe from "stripe";
import { afterAll, beforeAll } from "vitest";
import { startStripeFake, type StripeFake } from "@/server/stripe-fake";

export const SECRET = "whsec_unit_api";
export const PORTS: [number, number] = [12111, 12199];
export const EXP = { exp_month: 12, exp_year: new Date().getUTCFullYear() + 3 };

export let fake: StripeFake;
export let stripe: Stripe;

export function client(port: number, key = "sk_test_unit"): Stripe {
  return new Stripe(key, { host: "127.0.0.1", port, protocol: "http", maxNetworkRetries: 0, telemetry: false });
}

/** Start a fake for the calling test file and stop it after. */
export function startFakePerFile(): void {
  let dir: string;
  beforeAll(async () => {
    dir = mkdtempSync(path.join(tmpdir(), "stripe-fake-api-"));
    fake = await startStripeFake({ portRange: PORTS, dataDir: dir, webhookUrl: null, webhookSecret: SECRET });
    stripe = client(fake.port);
  });
  afterAll(async () => {
    await fake?.close();
    rmSync(dir, { recursive: true, force: true });
  });
}

export async function card(number: string): Promise<Stripe.PaymentMethod> {
  return stripe.paymentMethods.create({ type: "card", card: { number, cvc: "123", ...EXP } });
}

/** Paid PaymentIntent with the always-succeeding test card. */
export async function paid(
  amount: number,
  extra: Partial<Stripe.PaymentIntentCreateParams> = {},
): Promise<Stripe.PaymentIntent> {
  const pm = await card("4242424242424242");
  return stripe.paymentIntents.create({ amount, currency: "usd", payment_method: pm.id, confirm: true, ...extra });
}

export async function available(currency = "usd", account?: string): Promise<number> {
  const b = await stripe.balance.retrieve({}, account ? { stripeAccount: account } : {});
  return b.available.find((x) => x.currency === currency)?.amount ?? 0;
}

export async function caught(p: Promise<unknown>): Promise<Stripe.errors.StripeError> {
  try {
    await p;
  } catch (e) {
    return e as Stripe.errors.StripeError;
  }
  throw new Error("expected the call to fail");
}
