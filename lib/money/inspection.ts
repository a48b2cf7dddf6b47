/**
 * Inspection periods, claim deadlines and the tester-tolerance test for
 * disputes. Times are epoch milliseconds; a "day" is exactly
 * 24 hours counted from the carrier-confirmed delivery time (no calendar or
 * time-zone rounding — the deadline is shown to people in their own zone).
 */

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** House settings for inspection and claims. */
export interface InspectionSettings {
  /** Base inspection period, days: 7 [SUG]. */
  baseDays: number;
  /** One extra day per this many tubes (whole groups only): 25 [SUG]. */
  tubesPerExtraDay: number;
  /** Longest period, days: 21 [SUG]. */
  maxDays: number;
  /** Breakage must be claimed within this many hours of delivery: 48 [CTP]. */
  breakageClaimHours: number;
}

/** Defaults [SUG, CTP as tagged]. */
export const DEFAULT_INSPECTION_SETTINGS: InspectionSettings = {
  baseDays: 7, // [SUG]
  tubesPerExtraDay: 25, // [SUG]
  maxDays: 21, // [SUG]
  breakageClaimHours: 48, // [CTP]
};

function checkTime(ms: number, label: string): void {
  if (!Number.isSafeInteger(ms)) throw new RangeError(`${label} must be whole epoch milliseconds`);
}

/**
 * Inspection days for a lot: base + one day per full group of
 * `tubesPerExtraDay` tubes, capped at `maxDays`. 120 tubes → 7 + 4 = 11.
 */
export function inspectionDays(tubeCount: number, settings: InspectionSettings = DEFAULT_INSPECTION_SETTINGS): number {
  if (!Number.isSafeInteger(tubeCount) || tubeCount < 0) throw new RangeError("tubeCount must be a whole number ≥ 0");
  const extra = Math.floor(tubeCount / settings.tubesPerExtraDay);
  return Math.min(settings.baseDays + extra, settings.maxDays);
}

/** End of the inspection period (exclusive), epoch ms: delivery + inspectionDays × 24 h. */
export function inspectionWindowEnd(
  deliveredAtMs: number,
  tubeCount: number,
  settings: InspectionSettings = DEFAULT_INSPECTION_SETTINGS,
): number {
  checkTime(deliveredAtMs, "deliveredAtMs");
  return deliveredAtMs + inspectionDays(tubeCount, settings) * DAY_MS;
}

/** Deadline for breakage claims (exclusive), epoch ms: delivery + 48 h by default [CTP]. */
export function breakageClaimDeadline(
  deliveredAtMs: number,
  settings: InspectionSettings = DEFAULT_INSPECTION_SETTINGS,
): number {
  checkTime(deliveredAtMs, "deliveredAtMs");
  return deliveredAtMs + settings.breakageClaimHours * HOUR_MS;
}

/** True when a claim made at `claimAtMs` is in time for a deadline (strictly before it, and not before delivery). */
export function isClaimInTime(deliveredAtMs: number, claimAtMs: number, deadlineMs: number): boolean {
  checkTime(claimAtMs, "claimAtMs");
  return claimAtMs >= deliveredAtMs && claimAtMs < deadlineMs;
}

/** Default tester-to-tester allowance, percent: 10 (10–15 is common practice [CTP]). */
export const DEFAULT_TESTER_TOLERANCE_PCT = 10;

/**
 * Whether a buyer's test claim stands [CTP]: it stands on an
 * absolute failure (short, gas, leakage, open heater) whatever the reading,
 * or when the buyer's "% of new" falls below the listed band's lower edge by
 * MORE than the tolerance, taken relative to that edge:
 *   buyerPct < listedBandMinPct × (1 − tolerancePct / 100).
 * Listed "good" (80 %), tolerance 10 %: 71 % stands; 72 % (exactly at the
 * edge) does not. Compared on integers scaled by 10,000 to avoid float drift.
 */
export function claimStandsOnReadings(
  listedBandMinPct: number,
  buyerPct: number,
  tolerancePct: number = DEFAULT_TESTER_TOLERANCE_PCT,
  hardFail = false,
): boolean {
  for (const [label, v] of [
    ["listedBandMinPct", listedBandMinPct],
    ["buyerPct", buyerPct],
    ["tolerancePct", tolerancePct],
  ] as const) {
    if (!Number.isFinite(v) || v < 0) throw new RangeError(`${label} must be a finite number ≥ 0`);
  }
  if (tolerancePct >= 100) throw new RangeError("tolerancePct must be below 100");
  if (hardFail) return true;
  const scale = (v: number) => BigInt(Math.round(v * 10_000));
  // buyer × 100 < listed × (100 − tolerance), all scaled by 10^4 per factor
  return scale(buyerPct) * 100n * 10_000n < scale(listedBandMinPct) * (100n * 10_000n - scale(tolerancePct));
}
