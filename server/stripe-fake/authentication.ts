// The end of a test authentication (the card issuer's check that the fake stands in for). Each
// requires_action confirmation starts a new authentication; only the intent's current one can complete.
// One superseded by a later confirmation (another card), or left over after the intent moved on, is
// refused, so finishing an abandoned check late never charges the buyer again.
import type Stripe from "stripe";
import type { Ctx } from "./context";
import { FakeError } from "./errors";
import type { ParamHash } from "./form";
import { endAuthentication, findIntent, succeed, unexpectedState } from "./intent-confirm";
import { oneOf, requiredStr, str } from "./params";

function superseded(pi: Stripe.PaymentIntent, auth: string): FakeError {
  return new FakeError(400, {
    type: "invalid_request_error",
    code: "payment_intent_authentication_failure",
    message: `Authentication ${auth} is no longer valid for this PaymentIntent: a later confirmation replaced it (status ${pi.status}).`,
    payment_intent: structuredClone(pi),
  });
}

/**
 * Ends a test authentication: "succeed" pays as a normal confirm would; "fail" returns the intent to the
 * buyer. With `auth` (the id in the page's address), only that authentication may end; without it, the
 * current one (code and tests).
 */
export function completeAuthentication(
  ctx: Ctx,
  id: string,
  outcome: "succeed" | "fail",
  auth?: string,
): Stripe.PaymentIntent {
  const pi = findIntent(ctx, id);
  if (auth !== undefined && ctx.state.authentications[pi.id] !== auth) throw superseded(pi, auth);
  if (pi.status !== "requires_action") throw unexpectedState(pi, "authenticate", ["requires_action"]);
  const pm = ctx.state.payment_methods[pi.payment_method as string];
  if (outcome === "succeed") {
    succeed(ctx, pi, pm, true);
    return pi;
  }
  endAuthentication(ctx, pi);
  pi.status = "requires_payment_method";
  pi.payment_method = null;
  pi.next_action = null;
  pi.last_payment_error = {
    type: "invalid_request_error",
    code: "payment_intent_authentication_failure",
    message:
      "The provided PaymentMethod has failed authentication. You can provide payment_method_data or a new PaymentMethod to attempt to fulfill this PaymentIntent again.",
    payment_method: structuredClone(pm),
  };
  ctx.emit("payment_intent.payment_failed", pi);
  return pi;
}

/** Whether `auth` is the intent's pending authentication. */
export function isCurrentAuthentication(ctx: Ctx, id: string, auth: string): boolean {
  return ctx.state.authentications[id] === auth;
}

/** Reads the required `outcome` of the authentication endpoints. */
export function readOutcome(p: ParamHash): "succeed" | "fail" {
  requiredStr(p, "outcome");
  return oneOf(p, "outcome", ["succeed", "fail"] as const)!;
}

/** Reads the optional `authentication` id of the JSON endpoint. */
export function readAuthentication(p: ParamHash): string | undefined {
  return str(p, "authentication");
}
