// Webhook delivery: each recorded event is POSTed to the webhook URL with a Stripe-Signature header
// (t=<unix>,v1=<hex HMAC-SHA256 of "t.payload" keyed with the whole whsec_… secret>), signed afresh on every
// attempt. A non-2xx answer, a connection error or a timeout is retried after base, 2×base, 4×base …
// (capped) until maxAttempts, then the delivery is "failed". State is saved after every attempt; on start,
// pending deliveries are sent at once. Attempts cut short by close() are not counted.
import { createHmac } from "node:crypto";
import http from "node:http";
import https from "node:https";
import { renderEvent } from "./events";
import type { Delivery, Store } from "./store";

/** Delivery settings; tests shorten the delays. */
export type WebhookSettings = {
  /** Where events are POSTed; null records events without delivering them. */
  url: string | null;
  secret: string;
  /** First retry delay in ms (default 1000); each further retry doubles it. */
  retryBaseMs: number;
  /** Largest retry delay in ms (default 1 hour). */
  retryMaxMs: number;
  /** Attempts before giving up (default 8). */
  maxAttempts: number;
  /** How long to wait for the receiver's answer, in ms (default 10 s). */
  timeoutMs: number;
};

/** The Stripe-Signature header value for `payload` signed at unix time `t`. */
export function signatureHeader(payload: string, secret: string, t = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac("sha256", secret).update(`${t}.${payload}`, "utf8").digest("hex");
  return `t=${t},v1=${v1}`;
}

type Result = { status: number | null; error: string | null };

function post(
  url: URL,
  body: string,
  headers: Record<string, string>,
  timeoutMs: number,
  onRequest: (r: http.ClientRequest) => void,
): Promise<Result> {
  return new Promise((resolve) => {
    const lib = url.protocol === "https:" ? https : http;
    const req = lib.request(
      url,
      { method: "POST", agent: false, headers: { ...headers, "content-length": String(Buffer.byteLength(body)) } },
      (res) => {
        res.resume();
        res.on("end", () => resolve({ status: res.statusCode ?? 0, error: null }));
        res.on("error", (e) => resolve({ status: res.statusCode ?? 0, error: e.message }));
      },
    );
    req.setTimeout(timeoutMs, () => req.destroy(new Error(`no answer within ${timeoutMs} ms`)));
    req.on("error", (e) => resolve({ status: null, error: e.message }));
    onRequest(req);
    req.end(body);
  });
}

/** Sends pending deliveries when they are due; one timer for the earliest. */
export class Dispatcher {
  private timer: NodeJS.Timeout | null = null;
  private readonly inflight = new Map<string, { req: http.ClientRequest | null; done: Promise<void> }>();
  private closed = false;

  constructor(
    private readonly store: Store,
    private readonly settings: WebhookSettings,
    private readonly log: (line: string) => void,
  ) {
    const now = Date.now();
    for (const d of Object.values(store.state.deliveries)) {
      if (d.state === "pending" && d.next_attempt_at > now) d.next_attempt_at = now;
    }
  }

  /** Whether events should get deliveries at all. */
  get enabled(): boolean {
    return this.settings.url !== null;
  }

  /** Whether an attempt for this event is on the wire now. */
  busy(eventId: string): boolean {
    return this.inflight.has(eventId);
  }

  /** Starts every due delivery and arms the timer for the next one. Call after state changes. */
  kick(): void {
    if (this.closed || !this.enabled) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    const now = Date.now();
    let next = Infinity;
    for (const d of Object.values(this.store.state.deliveries)) {
      if (d.state !== "pending" || this.inflight.has(d.event)) continue;
      if (d.next_attempt_at <= now) this.attempt(d);
      else next = Math.min(next, d.next_attempt_at);
    }
    if (next !== Infinity) {
      this.timer = setTimeout(() => this.kick(), Math.min(next - now, 2_147_000_000));
    }
  }

  private attempt(d: Delivery): void {
    const event = this.store.state.events[d.event];
    if (!event) {
      d.state = "failed";
      d.last_error = "event missing";
      return;
    }
    const payload = JSON.stringify(renderEvent(this.store.state, event), null, 2);
    const url = new URL(this.settings.url!);
    const slot: { req: http.ClientRequest | null; done: Promise<void> } = { req: null, done: Promise.resolve() };
    slot.done = post(
      url,
      payload,
      {
        "content-type": "application/json; charset=utf-8",
        "user-agent": "getterline-stripe-fake/1 (webhook)",
        "stripe-signature": signatureHeader(payload, this.settings.secret),
      },
      this.settings.timeoutMs,
      (req) => (slot.req = req),
    ).then((r) => this.finish(d.event, r));
    this.inflight.set(d.event, slot);
  }

  private finish(eventId: string, r: Result): void {
    this.inflight.delete(eventId);
    if (this.closed) return; // cut short by close(): not an attempt
    const d = this.store.state.deliveries[eventId];
    if (!d || d.state !== "pending") return;
    const now = Date.now();
    d.attempts += 1;
    d.last_attempt_at = now;
    d.last_status = r.status;
    const ok = r.status !== null && r.status >= 200 && r.status < 300 && !r.error;
    d.last_error = ok ? null : (r.error ?? `HTTP ${r.status}`);
    const type = this.store.state.events[eventId]?.type ?? "?";
    if (ok) {
      d.state = "delivered";
      d.delivered_at = now;
      this.log(`webhook ${eventId} ${type} delivered (attempt ${d.attempts}, HTTP ${r.status})`);
    } else if (d.attempts >= this.settings.maxAttempts) {
      d.state = "failed";
      this.log(`webhook ${eventId} ${type} failed after ${d.attempts} attempts: ${d.last_error}`);
    } else {
      const delay = Math.min(this.settings.retryBaseMs * 2 ** (d.attempts - 1), this.settings.retryMaxMs);
      d.next_attempt_at = now + delay;
      this.log(`webhook ${eventId} ${type} attempt ${d.attempts} failed (${d.last_error}); retry in ${delay} ms`);
    }
    try {
      this.store.save();
    } catch (e) {
      this.log(`could not save delivery state: ${(e as Error).message}`);
    }
    this.kick();
  }

  /** Stops the timer and cuts off attempts in flight (they stay pending and resume on the next start). */
  async close(): Promise<void> {
    this.closed = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    const slots = [...this.inflight.values()];
    for (const s of slots) s.req?.destroy(new Error("fake closing"));
    await Promise.all(slots.map((s) => s.done));
  }
}
