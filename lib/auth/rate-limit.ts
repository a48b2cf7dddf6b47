/**
 * Sign-in throttling rule (pure). An account is refused after
 * ACCOUNT_MAX_FAILURES failures inside the window, an address after
 * ADDRESS_MAX_FAILURES; the refusal lasts until the oldest failure ages out.
 * Numbers are a house choice in line with common web practice.
 */
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
export const ACCOUNT_MAX_FAILURES = 9;
export const ADDRESS_MAX_FAILURES = 30;

export type ThrottleDecision =
  { allowed: true } | { allowed: false; scope: "account" | "address"; retryAfterSeconds: number };

export function throttleDecision(
  failures: { byAccount: number; byAddress: number },
  windowMs = SIGN_IN_WINDOW_MS,
): ThrottleDecision {
  const retryAfterSeconds = Math.ceil(windowMs / 1000);
  if (failures.byAccount >= ACCOUNT_MAX_FAILURES) return { allowed: false, scope: "account", retryAfterSeconds };
  if (failures.byAddress >= ADDRESS_MAX_FAILURES) return { allowed: false, scope: "address", retryAfterSeconds };
  return { allowed: true };
}
