// The fake's own endpoints under /_fake (no API key; the fake listens on 127.0.0.1 only):
//   GET  /_fake/health                              liveness, API version, counts
//   GET  /_fake/3ds/:pi/:auth                       test authentication page (next_action URL) for a browser
//   POST /_fake/3ds/:pi/:auth      outcome=succeed|fail   from that page; 303 to the return_url when one was given
//   POST /_fake/payment_intents/:pi/authenticate  outcome=succeed|fail [authentication=:auth]   the same for
//        code and tests (JSON answer); without `authentication`, the intent's current one
//   POST /_fake/events/:evt/redeliver               send an event again (full retry schedule)
//   GET  /_fake/deliveries[?event=evt_…]            webhook delivery state, newest first
import type { Ctx } from "./context";
import { FakeError, invalid, noSuch } from "./errors";
import { API_VERSION } from "./events";
import { completeAuthentication, isCurrentAuthentication, readAuthentication, readOutcome } from "./authentication";
import { onlyParams, str } from "./params";
import type { Dispatcher } from "./webhooks";

/** What a /_fake endpoint answers. */
export type TestReply = { status: number; json?: unknown; html?: string; location?: string };

/** A /_fake endpoint. */
export type TestHandler = (ctx: Ctx, webhooks: Dispatcher, ...ids: string[]) => TestReply;

/** One row of the /_fake route table; `writes` marks endpoints whose changes are saved. */
export type TestRoute = { method: "GET" | "POST"; pattern: RegExp; handler: TestHandler; writes: boolean };

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>body{font:16px system-ui,sans-serif;max-width:32rem;margin:3rem auto;padding:0 1rem}button{font:inherit;padding:.5rem 1rem;margin-right:.5rem}</style>
</head><body>${body}</body></html>`;
}

const health: TestHandler = (ctx, webhooks) => {
  const deliveries = Object.values(ctx.state.deliveries);
  return {
    status: 200,
    json: {
      ok: true,
      api_version: API_VERSION,
      webhooks: webhooks.enabled,
      pending_deliveries: deliveries.filter((d) => d.state === "pending").length,
      failed_deliveries: deliveries.filter((d) => d.state === "failed").length,
      counts: {
        payment_intents: Object.keys(ctx.state.payment_intents).length,
        charges: Object.keys(ctx.state.charges).length,
        transfers: Object.keys(ctx.state.transfers).length,
        events: Object.keys(ctx.state.events).length,
      },
    },
  };
};

const authenticationPage: TestHandler = (ctx, _w, id, auth) => {
  const pi = ctx.state.payment_intents[id];
  if (!pi) return { status: 404, html: page("Not found", `<p>No payment ${escapeHtml(id)}.</p>`) };
  if (pi.status !== "requires_action" || !isCurrentAuthentication(ctx, id, auth)) {
    return {
      status: 409,
      html: page(
        "Nothing to authenticate",
        `<p>This check is no longer open: payment ${escapeHtml(id)} has status ${escapeHtml(pi.status)}${pi.status === "requires_action" ? " with a newer check" : ""}.</p>`,
      ),
    };
  }
  const amount = `${(pi.amount / 100).toFixed(2)} ${pi.currency.toUpperCase()}`;
  return {
    status: 200,
    html: page(
      "Test payment authentication",
      `<h1>Test payment authentication</h1>
<p>This page stands in for the card issuer's check in local development. Payment <code>${escapeHtml(id)}</code> of ${escapeHtml(amount)}.</p>
<form method="post" action="/_fake/3ds/${escapeHtml(id)}/${escapeHtml(auth)}">
<button name="outcome" value="succeed" type="submit">Complete authentication</button>
<button name="outcome" value="fail" type="submit">Fail authentication</button>
</form>`,
    ),
  };
};

const authenticationForm: TestHandler = (ctx, _w, id, auth) => {
  onlyParams(ctx.params, ["outcome"]);
  const outcome = readOutcome(ctx.params);
  const pi = completeAuthentication(ctx, id, outcome, auth);
  const returnUrl = ctx.state.return_urls[id];
  if (returnUrl) {
    const u = new URL(returnUrl);
    u.searchParams.set("payment_intent", pi.id);
    u.searchParams.set("payment_intent_client_secret", pi.client_secret ?? "");
    u.searchParams.set("redirect_status", outcome === "succeed" ? "succeeded" : "failed");
    return { status: 303, location: u.toString() };
  }
  return {
    status: 200,
    html: page("Authentication finished", `<p>Payment ${escapeHtml(id)} is now ${escapeHtml(pi.status)}.</p>`),
  };
};

const authenticateJson: TestHandler = (ctx, _w, id) => {
  onlyParams(ctx.params, ["outcome", "authentication"]);
  return {
    status: 200,
    json: completeAuthentication(ctx, id, readOutcome(ctx.params), readAuthentication(ctx.params)),
  };
};

const redeliver: TestHandler = (ctx, webhooks, id) => {
  onlyParams(ctx.params, []);
  if (!ctx.state.events[id]) throw noSuch("event", id);
  if (!webhooks.enabled) throw invalid("This fake was started without a webhook URL; there is nowhere to deliver to.");
  if (webhooks.busy(id)) {
    throw new FakeError(409, {
      type: "invalid_request_error",
      message: `A delivery of ${id} is on the wire; try again when it has finished.`,
    });
  }
  const delivery = {
    event: id,
    state: "pending" as const,
    attempts: 0,
    next_attempt_at: Date.now(),
    last_attempt_at: null,
    last_status: null,
    last_error: null,
    delivered_at: null,
  };
  ctx.state.deliveries[id] = delivery;
  return { status: 200, json: { object: "delivery", ...delivery } };
};

const deliveries: TestHandler = (ctx) => {
  onlyParams(ctx.params, ["event"]);
  const event = str(ctx.params, "event");
  const data = Object.values(ctx.state.deliveries)
    .filter((d) => event === undefined || d.event === event)
    .reverse()
    .map((d) => ({ object: "delivery", type: ctx.state.events[d.event]?.type ?? null, ...d }));
  return { status: 200, json: { object: "list", data, has_more: false, url: "/_fake/deliveries" } };
};

const ID = "([A-Za-z0-9_]+)";

/** The /_fake route table. */
export const TEST_ROUTES: TestRoute[] = [
  { method: "GET", pattern: /^\/_fake\/health$/, handler: health, writes: false },
  { method: "GET", pattern: new RegExp(`^/_fake/3ds/${ID}/${ID}$`), handler: authenticationPage, writes: false },
  { method: "POST", pattern: new RegExp(`^/_fake/3ds/${ID}/${ID}$`), handler: authenticationForm, writes: true },
  {
    method: "POST",
    pattern: new RegExp(`^/_fake/payment_intents/${ID}/authenticate$`),
    handler: authenticateJson,
    writes: true,
  },
  { method: "POST", pattern: new RegExp(`^/_fake/events/${ID}/redeliver$`), handler: redeliver, writes: true },
  { method: "GET", pattern: /^\/_fake\/deliveries$/, handler: deliveries, writes: false },
];
