// Check values: [SUG] inspection period and [CTP] 48 h breakage / ±10–15 % tester tolerance,.
import { describe, expect, it } from "vitest";
import {
  breakageClaimDeadline,
  claimStandsOnReadings,
  inspectionDays,
  inspectionWindowEnd,
  isClaimInTime,
} from "@/lib/money/inspection";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const delivered = Date.UTC(2025, 2, 3, 15, 0, 0);

describe("inspection period", () => {
  it("is 7 days + 1 per full 25 tubes, max 21 [SUG]", () => {
    expect(inspectionDays(0)).toBe(7);
    expect(inspectionDays(24)).toBe(7);
    expect(inspectionDays(25)).toBe(8);
    expect(inspectionDays(120)).toBe(11); // worked example: the Voss box of 120 valves
    expect(inspectionDays(350)).toBe(21); // 7 + 14 = 21
    expect(inspectionDays(1_000)).toBe(21); // capped
    expect(() => inspectionDays(-1)).toThrow(RangeError);
  });

  it("ends that many 24-hour days after delivery", () => {
    expect(inspectionWindowEnd(delivered, 120)).toBe(delivered + 11 * DAY);
    expect(
      inspectionWindowEnd(delivered, 3, { baseDays: 3, tubesPerExtraDay: 10, maxDays: 5, breakageClaimHours: 24 }),
    ).toBe(delivered + 3 * DAY);
  });

  it("breakage claims close 48 h after delivery [CTP]", () => {
    const deadline = breakageClaimDeadline(delivered);
    expect(deadline).toBe(delivered + 48 * HOUR);
    expect(isClaimInTime(delivered, deadline - 1, deadline)).toBe(true);
    expect(isClaimInTime(delivered, deadline, deadline)).toBe(false);
    expect(isClaimInTime(delivered, delivered - 1, deadline)).toBe(false);
  });
});

describe("claimStandsOnReadings (tester-to-tester tolerance ±10–15 % [CTP])", () => {
  it("stands only when the reading is below the band edge by more than the tolerance", () => {
    // listed "good" = 80–99 % of new [CTP]; tolerance 10 % relative → edge 72 %
    expect(claimStandsOnReadings(80, 71, 10, false)).toBe(true);
    expect(claimStandsOnReadings(80, 72, 10, false)).toBe(false); // exactly at the edge: not "more than"
    expect(claimStandsOnReadings(80, 75, 10, false)).toBe(false);
    // 15 % tolerance → edge 68 %
    expect(claimStandsOnReadings(80, 69, 15, false)).toBe(false);
    expect(claimStandsOnReadings(80, 67.9, 15, false)).toBe(true);
  });

  it("stands on any absolute failure whatever the reading", () => {
    expect(claimStandsOnReadings(80, 110, 10, true)).toBe(true); // short/gas/leakage/open heater
  });

  it("is not fooled by float drift", () => {
    // 0.1 × 3 style values: 70 × (1 − 0.1) = 63 exactly
    expect(claimStandsOnReadings(70, 63, 10, false)).toBe(false);
    expect(claimStandsOnReadings(70, 62.99, 10, false)).toBe(true);
  });

  it("rejects nonsense input", () => {
    expect(() => claimStandsOnReadings(80, -1, 10, false)).toThrow(RangeError);
    expect(() => claimStandsOnReadings(80, 70, 100, false)).toThrow(RangeError);
  });
});
