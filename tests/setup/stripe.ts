// Test-side helper: the Stripe fake in this process on a free port, its
// webhooks delivered to our real webhook route handler over HTTP, and the
// app's SDK client pointed at it.
import http from "node:http";
import type { AddressInfo } from "node:net";
import { mkdtemp, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { NextRequest } from "next/server";
import { resetStripe } from "../../lib/stripe/client";
import { startStripeFake } from "../../server/stripe-fake";

/** `hold(true)` makes our end answer 503 to every webhook (as if down), so a payment stays in flight. */
export type TestStripe = { url: string; received: string[]; hold(on: boolean): void; stop(): Promise<void> };

export async function startTestStripe(): Promise<TestStripe> {
  const { POST } = await import("../../app/api/webhooks/stripe/route");
  const secret = "whsec_test_integration_secret";
  const received: string[] = [];
  let held = false;
  const receiver = http.createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    if (held) {
      res.writeHead(503, { "content-type": "application/json" });
      res.end(JSON.stringify({ error: { code: "unavailable", message: "held by the test" } }));
      return;
    }
    const body = Buffer.concat(chunks).toString("utf8");
    const r = await POST(
      new NextRequest("http://localhost:3000/api/webhooks/stripe", {
        method: "POST",
        body,
        headers: {
          "stripe-signature": String(req.headers["stripe-signature"] ?? ""),
          "content-type": "application/json",
        },
      }),
    );
    if (r.ok) received.push(JSON.parse(body).id);
    res.writeHead(r.status, { "content-type": "application/json" });
    res.end(await r.text());
  });
  await new Promise<void>((r) => receiver.listen(0, "127.0.0.1", () => r()));
  const hook = `http://127.0.0.1:${(receiver.address() as AddressInfo).port}/hook`;
  // The run's shared processor state (tests/setup/global-setup.ts), or a private one outside the integration project.
  const shared = process.env.STRIPE_TEST_DIR;
  const dir = shared ?? (await mkdtemp(path.join(os.tmpdir(), "getterline-stripe-")));
  const fake = await startStripeFake({
    port: 0,
    dataDir: dir,
    webhookUrl: hook,
    webhookSecret: secret,
    webhookRetry: { baseMs: 100, maxAttempts: 5 },
  });
  Object.assign(process.env, {
    STRIPE_SECRET_KEY: "sk_test_integration_key_not_secret",
    STRIPE_WEBHOOK_SECRET: secret,
    STRIPE_API_HOST: "127.0.0.1",
    STRIPE_API_PORT: String(fake.port),
    STRIPE_API_PROTOCOL: "http",
  });
  resetStripe();
  return {
    url: fake.url,
    received,
    hold(on: boolean) {
      held = on;
    },
    async stop() {
      await fake.close();
      await new Promise<void>((r) => receiver.close(() => r()));
      if (!shared) await rm(dir, { recursive: true, force: true });
      resetStripe();
    },
  };
}
