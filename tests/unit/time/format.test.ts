import { describe, expect, it } from "vitest";
import { formatLeft, formatWhen, safeZone } from "@/lib/time/format";

// Check values: the IANA tz database (Europe/Berlin is UTC+1 in December, America/Chicago UTC−6).
describe("formatWhen", () => {
  const iso = "2026-12-03T18:05:30Z";
  it("shows the moment in the named zone with the zone's name", () => {
    expect(formatWhen(iso, "UTC")).toBe("3 Dec 2026, 18:05 UTC");
    expect(formatWhen(iso, "Europe/Berlin", "time")).toBe("19:05:30 CET");
    expect(formatWhen(iso, "America/Chicago", "datetime")).toMatch(/^3 Dec 2026, 12:05 (CST|GMT-6)$/);
    expect(formatWhen(iso, "UTC", "date")).toBe("3 Dec 2026");
  });
  it("falls back to UTC for an unknown zone", () => {
    expect(safeZone("Mars/Olympus")).toBe("UTC");
  });
});

describe("formatLeft [SUG]", () => {
  it("counts down in hours, minutes and seconds", () => {
    expect(formatLeft(0)).toBe("closing");
    expect(formatLeft(12_400)).toBe("12 s");
    expect(formatLeft(249_000)).toBe("4 min 09 s");
    expect(formatLeft(3_900_000)).toBe("1 h 05 min");
  });
});
