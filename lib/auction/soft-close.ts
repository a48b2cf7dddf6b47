/**
 * Soft close and staggered closing times [CTP]: a bid inside the
 * final window moves the lot's end to bid time + window, so nobody can win
 * by bidding in the last second; lots in a sale close one after another.
 * Times are epoch milliseconds; a lot is closed AT its closing time, so a
 * bid must arrive strictly before it.
 */

/** House settings for soft close. */
export interface SoftCloseSettings {
  /** Final window, seconds: 120 [CTP]. */
  windowSeconds: number;
  /** Most extensions a lot may get, or null for no cap [CTP "optionally cap extensions"]. */
  maxExtensions: number | null;
}

/** Defaults: a 2-minute window, no cap [SUG house setting]. */
export const DEFAULT_SOFT_CLOSE: SoftCloseSettings = { windowSeconds: 120, maxExtensions: null };

/** Default gap between consecutive lots' closing times, seconds: 30 [CTP]. */
export const DEFAULT_STAGGER_SECONDS = 30;

/** A lot's closing clock. */
export interface CloseClock {
  /** Current closing time, epoch ms. */
  closesAtMs: number;
  /** Extensions granted so far. */
  extensionCount: number;
}

/** The clock after a bid, and whether the bid moved it. */
export interface ExtensionResult extends CloseClock {
  /** True when this bid moved the closing time later. */
  extended: boolean;
}

function checkWhole(value: number, label: string, min: number): void {
  if (!Number.isSafeInteger(value) || value < min) throw new RangeError(`${label} must be a whole number ≥ ${min}`);
}

/** Lists what is wrong with the settings (empty = valid). */
export function validateSoftClose(settings: SoftCloseSettings): string[] {
  const problems: string[] = [];
  if (!Number.isSafeInteger(settings.windowSeconds) || settings.windowSeconds <= 0) {
    problems.push("windowSeconds must be a whole number > 0");
  }
  if (
    settings.maxExtensions !== null &&
    (!Number.isSafeInteger(settings.maxExtensions) || settings.maxExtensions < 0)
  ) {
    problems.push("maxExtensions must be a whole number ≥ 0 or null");
  }
  return problems;
}

/** True once `nowMs` has reached the closing time. */
export function isClosed(clock: CloseClock, nowMs: number): boolean {
  return nowMs >= clock.closesAtMs;
}

/**
 * Applies an accepted bid at `bidAtMs` (strictly before the closing time) to
 * the clock: a bid inside the final window moves the close to
 * bidAtMs + window, never earlier than the current close; once
 * `maxExtensions` extensions have been granted the close no longer moves.
 */
export function extendOnBid(
  clock: CloseClock,
  bidAtMs: number,
  settings: SoftCloseSettings = DEFAULT_SOFT_CLOSE,
): ExtensionResult {
  const problems = validateSoftClose(settings);
  if (problems.length > 0) throw new RangeError(`invalid soft-close settings: ${problems.join("; ")}`);
  checkWhole(clock.closesAtMs, "closesAtMs", 0);
  checkWhole(clock.extensionCount, "extensionCount", 0);
  checkWhole(bidAtMs, "bidAtMs", 0);
  if (isClosed(clock, bidAtMs)) throw new RangeError("the bid arrived at or after the closing time");

  const capped = settings.maxExtensions !== null && clock.extensionCount >= settings.maxExtensions;
  const proposed = bidAtMs + settings.windowSeconds * 1000;
  if (capped || proposed <= clock.closesAtMs) return { ...clock, extended: false };
  return { closesAtMs: proposed, extensionCount: clock.extensionCount + 1, extended: true };
}

/**
 * Closing times for the lots of a sale: the first at `startCloseMs`, each
 * next one `gapSeconds` later. (30 s gap, 3 lots → start, +30 s, +60 s.)
 */
export function staggeredCloseTimes(startCloseMs: number, gapSeconds: number, lotCount: number): number[] {
  checkWhole(startCloseMs, "startCloseMs", 0);
  checkWhole(gapSeconds, "gapSeconds", 0);
  checkWhole(lotCount, "lotCount", 0);
  return Array.from({ length: lotCount }, (_, index) => startCloseMs + index * gapSeconds * 1000);
}
