/**
 * One payment per invoice, whatever tabs, retries or abandoned authentications do. The invoice has one
 * payment intent at the processor (the processor's own practice); each attempt, from any tab or device,
 * brings a payment method and confirms that same intent. What an attempt does is decided here, from the
 * intent's current state as the processor reports it now (never a cached answer), under the invoice's row
 * lock, so two attempts are taken one after the other.
 */

/** The processor's intent statuses (a payment intent's lifecycle). */
export type IntentStatus =
  | "requires_payment_method"
  | "requires_confirmation"
  | "requires_action"
  | "processing"
  | "requires_capture"
  | "canceled"
  | "succeeded";

/** What we read of the invoice's intent: its status and the payment method it was last confirmed with. */
export type IntentView = { status: IntentStatus; paymentMethodId: string | null };

export type AttemptStep =
  /** No usable intent yet (none, or cancelled): create the invoice's intent, then confirm it. */
  | { kind: "create-and-confirm" }
  /** Confirm the intent with this attempt's method; `supersedes` when an authentication was pending for another. */
  | { kind: "confirm"; supersedes: boolean }
  /** The same attempt asks again while its authentication is pending: send the buyer to the current check. */
  | { kind: "authenticate" }
  /** This attempt's method has been charged: answer success (a retry after authentication, or a lost answer). */
  | { kind: "paid" }
  /** Another attempt's method has been charged: the invoice is paid; nothing more is charged. */
  | { kind: "paid-by-other-attempt" }
  /** The processor is still working on a payment: wait, never charge again. */
  | { kind: "in-progress" };

/**
 * The step an attempt with `paymentMethodId` takes against the invoice's intent `intent` (null when the
 * invoice has none yet).
 */
export function nextAttemptStep(intent: IntentView | null, paymentMethodId: string): AttemptStep {
  if (!intent || intent.status === "canceled") return { kind: "create-and-confirm" };
  const mine = intent.paymentMethodId === paymentMethodId;
  switch (intent.status) {
    case "succeeded":
    case "requires_capture":
      return mine ? { kind: "paid" } : { kind: "paid-by-other-attempt" };
    case "processing":
      return { kind: "in-progress" };
    case "requires_action":
      return mine ? { kind: "authenticate" } : { kind: "confirm", supersedes: true };
    case "requires_payment_method":
    case "requires_confirmation":
      return { kind: "confirm", supersedes: false };
  }
}

/** The words a buyer reads when their attempt charges nothing because the invoice is paid or being paid. */
export const ATTEMPT_REFUSALS = {
  paid: "This invoice has already been paid. Nothing more was charged; reload the page to see the payment.",
  inProgress:
    "A payment for this invoice is already in progress, perhaps from another tab or device. Nothing more was charged; wait a moment, then reload the page.",
} as const;
