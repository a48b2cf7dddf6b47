// Test card numbers and what each does when a PaymentIntent is confirmed with it. The full number and the
// security code are read here and dropped: only last4, expiry and the test behaviour are kept.
// The card network is reported as "unknown": the project keeps real brand names out of code and data.
import type Stripe from "stripe";
import { cardError, invalid, missingParam } from "./errors";
import type { ParamHash } from "./form";
import { int, onlyParams, str } from "./params";

/** What confirming a payment with a test card does. */
export type CardBehaviour =
  | { kind: "succeed" }
  | { kind: "authenticate" }
  | { kind: "decline"; code: string; declineCode: string; message: string };

const DECLINED = "Your card was declined.";

/** The test numbers the fake knows; any other number that passes the Luhn check succeeds like 4242…. */
export const TEST_CARDS: Readonly<Record<string, CardBehaviour>> = {
  "4242424242424242": { kind: "succeed" },
  "4000000000000002": { kind: "decline", code: "card_declined", declineCode: "generic_decline", message: DECLINED },
  "4000000000009995": {
    kind: "decline",
    code: "card_declined",
    declineCode: "insufficient_funds",
    message: "Your card has insufficient funds.",
  },
  "4000000000000069": {
    kind: "decline",
    code: "expired_card",
    declineCode: "expired_card",
    message: "Your card has expired.",
  },
  "4000000000000127": {
    kind: "decline",
    code: "incorrect_cvc",
    declineCode: "incorrect_cvc",
    message: "Your card's security code is incorrect.",
  },
  "4000002500003155": { kind: "authenticate" },
  "4000000000003220": { kind: "authenticate" },
};

/** The Luhn check digit test. */
export function luhnValid(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = digits.charCodeAt(digits.length - 1 - i) - 48;
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum % 10 === 0;
}

/** Validates `card[…]` of POST /v1/payment_methods; returns the stored card details and the test behaviour. */
export function readCard(
  p: ParamHash | undefined,
  now: Date,
): { card: Stripe.PaymentMethod.Card; behaviour: CardBehaviour } {
  if (!p) throw missingParam("card");
  onlyParams(p, ["number", "exp_month", "exp_year", "cvc"], "card");
  const rawNumber = str(p, "number", "card");
  if (rawNumber === undefined || rawNumber === "") throw missingParam("card[number]");
  const number = rawNumber.replace(/[\s-]/g, "");
  if (!/^\d{12,19}$/.test(number) || !luhnValid(number)) {
    throw cardError("invalid_number", "Your card number is incorrect.", "card[number]");
  }
  const expMonth = int(p, "exp_month", {}, "card");
  if (expMonth === undefined) throw missingParam("card[exp_month]");
  if (expMonth < 1 || expMonth > 12)
    throw cardError("invalid_expiry_month", "Your card's expiration month is invalid.", "card[exp_month]");
  let expYear = int(p, "exp_year", {}, "card");
  if (expYear === undefined) throw missingParam("card[exp_year]");
  if (expYear >= 0 && expYear < 100) expYear += 2000;
  const year = now.getUTCFullYear();
  if (expYear < year || expYear > year + 50)
    throw cardError("invalid_expiry_year", "Your card's expiration year is invalid.", "card[exp_year]");
  if (expYear === year && expMonth < now.getUTCMonth() + 1) {
    throw cardError("invalid_expiry_month", "Your card's expiration month is invalid.", "card[exp_month]");
  }
  const cvc = str(p, "cvc", "card");
  if (cvc !== undefined && !/^\d{3,4}$/.test(cvc))
    throw cardError("invalid_cvc", "Your card's security code is invalid.", "card[cvc]");
  if (number.length < 4) throw invalid("Invalid card number.", "card[number]");
  const card: Stripe.PaymentMethod.Card = {
    brand: "unknown",
    checks: {
      address_line1_check: null,
      address_postal_code_check: null,
      cvc_check: cvc === undefined ? null : "unchecked",
    },
    country: "US",
    display_brand: "unknown",
    exp_month: expMonth,
    exp_year: expYear,
    funding: "credit",
    generated_from: null,
    last4: number.slice(-4),
    networks: { available: ["unknown"], preferred: null },
    regulated_status: "unregulated",
    three_d_secure_usage: { supported: true },
    wallet: null,
  };
  return { card, behaviour: TEST_CARDS[number] ?? { kind: "succeed" } };
}

/**
 * The card parameters with the number reduced to its length and last four digits and the security code
 * removed: what the idempotency check may fingerprint without keeping anything sensitive.
 */
export function redactCardParams(p: ParamHash): ParamHash {
  const card = p.card;
  if (!card || typeof card !== "object" || Array.isArray(card)) return p;
  const { number, cvc: _cvc, ...rest } = card;
  const digits = typeof number === "string" ? number.replace(/\D/g, "") : "";
  return { ...p, card: { ...rest, number: `len${digits.length}:…${digits.slice(-4)}` } };
}
