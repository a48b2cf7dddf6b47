/**
 * Integer-cent money helpers: validation, parsing, formatting and rate
 * arithmetic. Every amount in lib/money is a safe integer number of cents.
 *
 * Rounding rule [SUG] (house decision): whenever an exact result falls
 * between two cents it is rounded once, at the end, "half-up" — half away
 * from zero, so 0.5 ¢ becomes 1 ¢ and −0.5 ¢ becomes −1 ¢. Callers may ask for
 * banker's rounding ("half-even") instead. Intermediate products are computed
 * in BigInt so nothing is lost before that single rounding step.
 */

/** How a result that falls between two cents is rounded. */
export type RoundingMode = "half-up" | "half-even";

/** The house default: half away from zero [SUG]. */
export const DEFAULT_ROUNDING: RoundingMode = "half-up";

/** Basis points in one whole (100 % = 10,000 bp). */
export const BASIS_POINTS_PER_WHOLE = 10_000;

/** Options for {@link assertCents}. */
export interface CentsCheckOptions {
  /** Allow amounts below zero (e.g. signed balance changes). Default false. */
  allowNegative?: boolean;
}

/**
 * Throws a RangeError unless `value` is a safe integer number of cents
 * (and non-negative unless `allowNegative`). Returns the value for chaining.
 */
export function assertCents(value: number, label = "amount", options: CentsCheckOptions = {}): number {
  if (typeof value !== "number" || !Number.isSafeInteger(value)) {
    throw new RangeError(`${label} must be a safe integer number of cents, got ${String(value)}`);
  }
  if (!options.allowNegative && value < 0) {
    throw new RangeError(`${label} must not be negative, got ${value}`);
  }
  return value;
}

/** Throws a RangeError unless `bp` is an integer rate from 0 to 10,000 basis points. */
export function assertBasisPoints(bp: number, label = "rate"): number {
  if (!Number.isSafeInteger(bp) || bp < 0 || bp > BASIS_POINTS_PER_WHOLE) {
    throw new RangeError(`${label} must be whole basis points from 0 to 10000, got ${String(bp)}`);
  }
  return bp;
}

/**
 * Divides two BigInts and rounds the quotient to an integer with `mode`
 * (half-up = half away from zero; half-even = banker's). Denominator ≠ 0.
 */
export function divideRounded(numerator: bigint, denominator: bigint, mode: RoundingMode = DEFAULT_ROUNDING): bigint {
  if (denominator === 0n) throw new RangeError("division by zero");
  let n = numerator;
  let d = denominator;
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  const negative = n < 0n;
  const magnitude = negative ? -n : n;
  let quotient = magnitude / d;
  const twiceRemainder = (magnitude % d) * 2n;
  const roundUp = twiceRemainder > d || (twiceRemainder === d && (mode === "half-up" || quotient % 2n === 1n));
  if (roundUp) quotient += 1n;
  return negative ? -quotient : quotient;
}

/** Converts a BigInt back to a number, throwing if it is outside the safe-integer range. */
export function toSafeCents(value: bigint, label = "amount"): number {
  if (value > BigInt(Number.MAX_SAFE_INTEGER) || value < BigInt(Number.MIN_SAFE_INTEGER)) {
    throw new RangeError(`${label} exceeds the safe-integer range`);
  }
  return Number(value);
}

/**
 * cents × numerator ÷ denominator, computed exactly and rounded once with
 * `mode`. All three inputs must be safe integers; the denominator positive.
 * Example: mulDivCents(100_000, 300, 2_000) = 15_000 (a 15 % share).
 */
export function mulDivCents(
  cents: number,
  numerator: number,
  denominator: number,
  mode: RoundingMode = DEFAULT_ROUNDING,
): number {
  assertCents(cents, "cents", { allowNegative: true });
  if (!Number.isSafeInteger(numerator)) throw new RangeError("numerator must be a safe integer");
  if (!Number.isSafeInteger(denominator) || denominator <= 0) {
    throw new RangeError("denominator must be a positive safe integer");
  }
  const exact = divideRounded(BigInt(cents) * BigInt(numerator), BigInt(denominator), mode);
  return toSafeCents(exact);
}

/**
 * A percentage of an amount given in basis points (1500 bp = 15 %), rounded
 * once with `mode` (default half-up). percentOfCents(100_000, 1500) = 15_000.
 */
export function percentOfCents(cents: number, basisPoints: number, mode: RoundingMode = DEFAULT_ROUNDING): number {
  assertBasisPoints(basisPoints);
  return mulDivCents(cents, basisPoints, BASIS_POINTS_PER_WHOLE, mode);
}

/** Why {@link parseMoneyToCents} refused its input. */
export type MoneyParseCode = "empty" | "format" | "too-many-decimals" | "negative" | "too-large";

/** Thrown by {@link parseMoneyToCents}; `code` says which rule failed. */
export class MoneyParseError extends Error {
  /** Machine-readable reason. */
  readonly code: MoneyParseCode;
  constructor(code: MoneyParseCode, message: string) {
    super(message);
    this.name = "MoneyParseError";
    this.code = code;
  }
}

/** Options for {@link parseMoneyToCents}. */
export interface ParseMoneyOptions {
  /** Accept a leading minus sign. Default false. */
  allowNegative?: boolean;
}

const MONEY_PATTERN = /^(-)?(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d+))?$/;

/**
 * Parses a decimal amount typed by a person ("123.45", "1,234.5", "7") into
 * cents without floating point. Thousands separators must be in groups of
 * three. Rejects: empty text, signs or symbols other than an allowed leading
 * "-", more than two decimals (no silent rounding), negatives unless allowed,
 * and amounts beyond the safe-integer range. Throws {@link MoneyParseError}.
 */
export function parseMoneyToCents(text: string, options: ParseMoneyOptions = {}): number {
  const trimmed = text.trim();
  if (trimmed === "") throw new MoneyParseError("empty", "amount is empty");
  const match = MONEY_PATTERN.exec(trimmed);
  if (!match) throw new MoneyParseError("format", `not a decimal amount: "${trimmed}"`);
  const [, minus, wholeText, fraction = ""] = match;
  if (fraction.length > 2) {
    throw new MoneyParseError("too-many-decimals", "amounts have at most two decimals");
  }
  const whole = BigInt(wholeText.replaceAll(",", ""));
  const cents = whole * 100n + BigInt(fraction.padEnd(2, "0"));
  const signed = minus && cents !== 0n ? -cents : cents;
  if (signed < 0n && !options.allowNegative) {
    throw new MoneyParseError("negative", "negative amounts are not allowed here");
  }
  if (signed > BigInt(Number.MAX_SAFE_INTEGER) || signed < BigInt(Number.MIN_SAFE_INTEGER)) {
    throw new MoneyParseError("too-large", "amount is too large");
  }
  return Number(signed);
}

/**
 * Formats cents for display with the locale's currency style, e.g.
 * formatCents(12345, "USD") = "$123.45". Only currencies with two minor
 * digits are accepted, because amounts are held in hundredths. The decimal
 * string is built from the integer, so no float rounding can creep in.
 */
export function formatCents(cents: number, currency = "USD", locale = "en-US"): string {
  assertCents(cents, "cents", { allowNegative: true });
  const format = new Intl.NumberFormat(locale, { style: "currency", currency });
  if (format.resolvedOptions().maximumFractionDigits !== 2) {
    throw new RangeError(`${currency} does not use two minor digits`);
  }
  const magnitude = Math.abs(cents);
  const whole = Math.floor(magnitude / 100);
  const fraction = String(magnitude % 100).padStart(2, "0");
  const decimal = `${cents < 0 ? "-" : ""}${whole}.${fraction}` as `${number}`;
  return format.format(decimal);
}
