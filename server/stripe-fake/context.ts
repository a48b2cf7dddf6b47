// What an endpoint handler receives, and the shape of the route table.
import type { ParamHash } from "./form";
import type { State } from "./store";

/** One request's view of the fake. */
export type Ctx = {
  state: State;
  /** Unix seconds, fixed for the request. */
  now: number;
  /** Decoded body (POST) or query (GET). */
  params: ParamHash;
  /** http://127.0.0.1:<port> of this fake. */
  baseUrl: string;
  /** req_… of the API request; null for events raised by the /_fake pages. */
  requestId: string | null;
  idempotencyKey: string | null;
  /** The Stripe-Account header, when sent. */
  stripeAccount: string | null;
  /** Records an event (evt_…) with a snapshot of `object` and queues its webhook delivery. */
  emit(type: string, object: object): void;
};

/** An endpoint: returns the object answered with 200, or throws a FakeError. */
export type Handler = (ctx: Ctx, ...pathIds: string[]) => object;

/** One row of the route table. `account` marks endpoints that honour the Stripe-Account header. */
export type Route = { method: "GET" | "POST"; pattern: RegExp; handler: Handler; account?: boolean };
