// Events: recorded when something happens, each with a snapshot of the object and the SDK's pinned
// API version; listed and retrieved through /v1/events. Delivery state lives beside them (webhooks.ts).
import Stripe from "stripe";
import type { Handler } from "./context";
import { invalid, noSuch } from "./errors";
import { newId } from "./ids";
import { LIST_PARAMS, page } from "./lists";
import { bool, onlyParams, str } from "./params";
import type { FakeEvent, State } from "./store";

/** The API version the installed SDK pins; every object and event is shaped for it. */
export const API_VERSION: string = Stripe.API_VERSION;

/** Records an event; when webhooks are on, queues its delivery (due now). */
export function recordEvent(
  state: State,
  e: {
    type: string;
    object: object;
    created: number;
    requestId: string | null;
    idempotencyKey: string | null;
    deliver: boolean;
  },
): FakeEvent {
  const event: FakeEvent = {
    id: newId("evt"),
    object: "event",
    api_version: API_VERSION,
    created: e.created,
    data: { object: structuredClone(e.object) as Record<string, unknown> },
    livemode: false,
    pending_webhooks: 0,
    request: { id: e.requestId, idempotency_key: e.idempotencyKey },
    type: e.type,
  };
  state.events[event.id] = event;
  if (e.deliver) {
    state.deliveries[event.id] = {
      event: event.id,
      state: "pending",
      attempts: 0,
      next_attempt_at: Date.now(),
      last_attempt_at: null,
      last_status: null,
      last_error: null,
      delivered_at: null,
    };
  }
  return event;
}

/** An event as answered: pending_webhooks reflects its delivery now. */
export function renderEvent(state: State, event: FakeEvent): FakeEvent {
  const copy = structuredClone(event);
  copy.pending_webhooks = state.deliveries[event.id]?.state === "pending" ? 1 : 0;
  return copy;
}

function typeMatcher(pattern: string): (type: string) => boolean {
  if (pattern.endsWith(".*")) {
    const prefix = pattern.slice(0, -1);
    return (t) => t.startsWith(prefix);
  }
  if (pattern.includes("*"))
    throw invalid(`Invalid type: ${pattern} (a wildcard may only end the pattern, as in payment_intent.*)`, "type");
  return (t) => t === pattern;
}

/** GET /v1/events — newest first; filters type (with a trailing .* wildcard), types[], created, delivery_success. */
export const listEvents: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [...LIST_PARAMS, "type", "types", "delivery_success"]);
  const type = str(p, "type");
  const typesRaw = p.types;
  if (type !== undefined && typesRaw !== undefined)
    throw invalid("You may only specify one of these parameters: type, types.", "types");
  let matchers: Array<(t: string) => boolean> = [];
  if (type !== undefined) matchers = [typeMatcher(type)];
  if (typesRaw !== undefined) {
    if (!Array.isArray(typesRaw) || typesRaw.some((x) => typeof x !== "string"))
      throw invalid("Invalid types: must be a list of event types.", "types");
    matchers = (typesRaw as string[]).map(typeMatcher);
  }
  const success = bool(p, "delivery_success");
  const items = Object.values(ctx.state.events).filter((e) => {
    if (matchers.length && !matchers.some((m) => m(e.type))) return false;
    if (success !== undefined) {
      const d = ctx.state.deliveries[e.id];
      if (!d || (d.state === "delivered") !== success) return false;
    }
    return true;
  });
  const result = page(items, p, "/v1/events");
  return { ...result, data: result.data.map((e) => renderEvent(ctx.state, e)) };
};

/** GET /v1/events/:id */
export const retrieveEvent: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand"]);
  const event = ctx.state.events[id];
  if (!event) throw noSuch("event", id);
  return renderEvent(ctx.state, event);
};
