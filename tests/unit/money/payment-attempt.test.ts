// One payment per invoice: what each attempt does against the invoice's one payment intent.
// Check values: the processor's published PaymentIntent lifecycle (statuses requires_payment_method,
// requires_confirmation, requires_action, processing, requires_capture, canceled, succeeded; a new payment
// method may be confirmed while requires_payment_method, requires_confirmation or requires_action)
// [Stripe API reference, "The PaymentIntent object: status" and "Confirm a PaymentIntent"]. The refusals in
// words are our own product rule [SUG].
import { describe, expect, it } from "vitest";
import { ATTEMPT_REFUSALS, nextAttemptStep, type IntentStatus } from "@/lib/money/payment-attempt";

const MINE = "pm_this_attempt";
const OTHER = "pm_other_tab";
const at = (status: IntentStatus, paymentMethodId: string | null = OTHER) => ({ status, paymentMethodId });

describe("nextAttemptStep", () => {
  it("creates the invoice's intent when there is none, or the one there is was cancelled", () => {
    expect(nextAttemptStep(null, MINE)).toEqual({ kind: "create-and-confirm" });
    expect(nextAttemptStep(at("canceled"), MINE)).toEqual({ kind: "create-and-confirm" });
  });

  it("confirms the same intent again after a decline or before any confirmation", () => {
    expect(nextAttemptStep(at("requires_payment_method", null), MINE)).toEqual({ kind: "confirm", supersedes: false });
    expect(nextAttemptStep(at("requires_confirmation", OTHER), MINE)).toEqual({ kind: "confirm", supersedes: false });
  });

  it("a new card supersedes another attempt's pending authentication; the same attempt goes back to its own check", () => {
    expect(nextAttemptStep(at("requires_action", OTHER), MINE)).toEqual({ kind: "confirm", supersedes: true });
    expect(nextAttemptStep(at("requires_action", MINE), MINE)).toEqual({ kind: "authenticate" });
  });

  it("never charges again once a charge is made or under way", () => {
    for (const status of ["succeeded", "requires_capture"] as const) {
      expect(nextAttemptStep(at(status, MINE), MINE)).toEqual({ kind: "paid" });
      expect(nextAttemptStep(at(status, OTHER), MINE)).toEqual({ kind: "paid-by-other-attempt" });
    }
    expect(nextAttemptStep(at("processing", MINE), MINE)).toEqual({ kind: "in-progress" });
    expect(nextAttemptStep(at("processing", OTHER), MINE)).toEqual({ kind: "in-progress" });
  });

  it("says why nothing was charged, in words a buyer reads", () => {
    expect(ATTEMPT_REFUSALS.paid).toMatch(/already been paid.*Nothing more was charged/);
    expect(ATTEMPT_REFUSALS.inProgress).toMatch(/already in progress.*another tab/);
  });
});
