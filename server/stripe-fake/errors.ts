// Stripe-shaped errors for the local Stripe fake: { error: { type, code?, message, param?, decline_code? } }
// with the HTTP status the real API uses (400 invalid request, 401 key, 402 card, 404 missing).

/** The body under `error` in a Stripe error response. */
export type StripeErrorBody = {
  type: "invalid_request_error" | "card_error" | "idempotency_error" | "api_error";
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
  charge?: string;
  payment_intent?: unknown;
  payment_method?: unknown;
};

/**
 * An error answered to the client. `keepChanges` marks errors raised after the request did its work
 * (a declined card leaves a failed charge and an event behind), so state is saved, not rolled back.
 */
export class FakeError extends Error {
  constructor(
    readonly status: number,
    readonly body: StripeErrorBody,
    readonly keepChanges = false,
  ) {
    super(body.message);
  }
}

/** 400 invalid_request_error. */
export function invalid(message: string, param?: string, code?: string): FakeError {
  return new FakeError(400, {
    type: "invalid_request_error",
    message,
    ...(code ? { code } : {}),
    ...(param ? { param } : {}),
  });
}

/** 400 for a required parameter that is absent. */
export function missingParam(param: string): FakeError {
  return invalid(`Missing required param: ${param}.`, param, "parameter_missing");
}

/** 404 resource_missing for an id that does not exist (400 when the id came in a parameter, as Stripe does). */
export function noSuch(kind: string, id: string, param = "id", status = 404): FakeError {
  return new FakeError(status, {
    type: "invalid_request_error",
    code: "resource_missing",
    message: `No such ${kind}: '${id}'`,
    param,
  });
}

/** 404 for a method and path the fake does not serve. */
export function unrecognized(method: string, path: string): FakeError {
  return new FakeError(404, {
    type: "invalid_request_error",
    message: `Unrecognized request URL (${method}: ${path}). This local Stripe fake serves only the endpoints listed at the top of server/stripe-fake/index.ts.`,
  });
}

/** 402 card_error. */
export function cardError(code: string, message: string, param?: string, declineCode?: string): FakeError {
  return new FakeError(402, {
    type: "card_error",
    code,
    message,
    ...(param ? { param } : {}),
    ...(declineCode ? { decline_code: declineCode } : {}),
  });
}
