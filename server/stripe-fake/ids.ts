// Random object ids in Stripe's style: a type prefix and base-62 characters (pi_3Xk…).
import { randomBytes } from "node:crypto";

const ALPHABET = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

/** Random base-62 text of `length` characters (rejection sampling, so every character is equally likely). */
export function randomText(length: number): string {
  let out = "";
  while (out.length < length) {
    for (const b of randomBytes(length * 2)) {
      if (b < 248 && out.length < length) out += ALPHABET[b % 62];
    }
  }
  return out;
}

/** A new id such as `pi_…` (24 characters after the prefix; accounts use 16, as Stripe's do). */
export function newId(prefix: string): string {
  return `${prefix}_${randomText(prefix === "acct" ? 16 : 24)}`;
}
