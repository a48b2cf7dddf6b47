/**
 * The settings form's units: house staff type percent and dollars, the API keeps basis points and cents. Each
 * conversion is exact (decimal text → integer, never through floating point): 1 % = 100 bp and $1 = 100 cents, so
 * both are "a decimal with at most two places" scaled by 100 [SUG].
 */
import { MoneyParseError, parseMoneyToCents } from "./cents";

/** A conversion's result: the integer, or why the text was refused (in words for the form). */
export type UnitParse = { ok: true; value: number } | { ok: false; error: string };

const refusal = (e: unknown, what: "percent" | "dollars"): UnitParse => {
  if (!(e instanceof MoneyParseError)) throw e;
  const unit = what === "percent" ? "a percentage" : "a dollar amount";
  const messages: Record<MoneyParseError["code"], string> = {
    empty: `Give ${unit}`,
    format: what === "percent" ? "Give a percentage such as 12.5" : "Give a dollar amount such as 1,234.56",
    "too-many-decimals":
      what === "percent" ? "At most two decimals (0.01 % is the smallest step)" : "At most two decimals (whole cents)",
    negative: "Cannot be negative",
    "too-large": "Too large",
  };
  return { ok: false, error: messages[e.code] };
};

/** "12.5" or "12.5 %" → 1250 bp; "0.01" → 1 bp; "12.345" is refused (no rounding). */
export function percentToBp(text: string): UnitParse {
  const t = text.trim().replace(/\s*%$/, "");
  if (t.includes(",")) return { ok: false, error: "Give a percentage such as 12.5" };
  try {
    return { ok: true, value: parseMoneyToCents(t) };
  } catch (e) {
    return refusal(e, "percent");
  }
}

/** "$1,234.56", "1234.56" or "7" → 123456, 123456, 700 cents; "1.005" is refused (no rounding). */
export function dollarsToCents(text: string): UnitParse {
  const t = text.trim().replace(/^\$\s*/, "");
  try {
    return { ok: true, value: parseMoneyToCents(t) };
  } catch (e) {
    return refusal(e, "dollars");
  }
}

const twoPlaces = (n: number, keepZeros: boolean) => {
  if (!Number.isSafeInteger(n) || n < 0) return "";
  const whole = Math.floor(n / 100);
  const frac = String(n % 100).padStart(2, "0");
  if (keepZeros) return `${whole}.${frac}`;
  const trimmed = frac.replace(/0+$/, "");
  return trimmed ? `${whole}.${trimmed}` : String(whole);
};

/** 1250 bp → "12.5"; 1000 → "10"; 1 → "0.01" (for the form's text input; the inverse of {@link percentToBp}). */
export const bpToPercentText = (bp: number): string => twoPlaces(bp, false);

/** 123456 cents → "1234.56"; 700 → "7.00" (for the form's text input; the inverse of {@link dollarsToCents}). */
export const centsToDollarText = (cents: number): string => twoPlaces(cents, true);
