import Stripe from "stripe";
import { z } from "zod";

/**
 * The official Stripe SDK, made lazily (a missing key must not break imports).
 * In development, demo and tests it talks to our local fake (server/stripe-fake);
 * real Stripe is a change of keys and STRIPE_API_HOST only.
 */
const Config = z.object({
  STRIPE_SECRET_KEY: z.string().min(8, "STRIPE_SECRET_KEY must be set (scripts/ensure-env.sh writes a test key)"),
  STRIPE_WEBHOOK_SECRET: z.string().min(8, "STRIPE_WEBHOOK_SECRET must be set"),
  STRIPE_API_HOST: z.string().default("127.0.0.1"),
  STRIPE_API_PORT: z.coerce.number().int().positive().default(12111),
  STRIPE_API_PROTOCOL: z.enum(["http", "https"]).default("http"),
  CURRENCY: z.string().length(3).default("usd"),
});

const g = globalThis as unknown as { __getterlineStripe?: Stripe };

export function stripeConfig() {
  const r = Config.safeParse(process.env);
  if (!r.success)
    throw new Error(
      `Stripe configuration: ${r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}`,
    );
  return r.data;
}

export function stripe(): Stripe {
  if (!g.__getterlineStripe) {
    const c = stripeConfig();
    const real = c.STRIPE_API_HOST === "api.stripe.com";
    g.__getterlineStripe = new Stripe(c.STRIPE_SECRET_KEY, {
      ...(real ? {} : { host: c.STRIPE_API_HOST, port: c.STRIPE_API_PORT, protocol: c.STRIPE_API_PROTOCOL }),
      maxNetworkRetries: 1,
      telemetry: false,
    });
  }
  return g.__getterlineStripe;
}

/** Drop the client so the next call reads the environment again (tests). */
export function resetStripe(): void {
  g.__getterlineStripe = undefined;
}
