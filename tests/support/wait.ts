// The one polling helper for tests: wait for a condition with vi.waitFor instead of sleeping a fixed time.
import { vi } from "vitest";

type Options = { timeout?: number; interval?: number };

/**
 * Poll `fn` until `ok` holds for its value (or, without `ok`, until `fn` stops throwing) and return that value.
 * On timeout it throws, naming the last value seen, so the test fails where it waited.
 */
export function until<T>(fn: () => T | Promise<T>, ok?: (v: T) => boolean, opts: Options | number = {}): Promise<T> {
  const { timeout = 8_000, interval = 100 } = typeof opts === "number" ? { timeout: opts } : opts;
  return vi.waitFor(
    async () => {
      const v = await fn();
      if (ok && !ok(v)) throw new Error(`still waiting: the last value was ${describe(v)}`);
      return v;
    },
    { timeout, interval },
  );
}

function describe(v: unknown): string {
  try {
    return JSON.stringify(v) ?? String(v);
  } catch {
    return String(v);
  }
}
