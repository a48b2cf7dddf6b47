// A sample of the service-bench seed rows, each value with its source tag
// (lib/valves/sources.ts). Heater figures are registered [REG] or European
// data-book [EU-DS] values recalled from memory (MEM) unless marked otherwise.
import { describe, expect, it } from "vitest";
import { decodeDesignation } from "@/lib/valves/designation";
import { getReferenceType } from "@/lib/valves/reference-table";
import { SEED_REFERENCE_TYPES, seedReferenceTable } from "@/lib/valves/seed";
import { parseRowSource, SOURCES, SOURCE_TAGS } from "@/lib/valves/sources";

const SEED = seedReferenceTable();
const heater = (d: string) => {
  const h = getReferenceType(SEED, d)?.heater;
  return h ? [h.volts, h.amps] : h;
};

describe("coverage", () => {
  it("holds at least 400 types, every designation and alias once", () => {
    expect(SEED_REFERENCE_TYPES.length).toBeGreaterThanOrEqual(400);
    const names = SEED_REFERENCE_TYPES.flatMap((r) => [r.designation, ...r.aliases]);
    expect(new Set(names).size).toBe(names.length);
  });

  it("answers on file for the service-bench types that used to be flagged", () => {
    for (const d of [
      "PCL86",
      "UCL82",
      "ECF82",
      "EZ80",
      "PL36",
      "PY88",
      "ECC85",
      "EF80",
      "ECH81",
      "PCF80",
      "UY85",
      "12BE6",
      "5814",
    ]) {
      const r = decodeDesignation(SEED, d);
      expect(r.ok && r.knownType, d).toBe(true);
    }
  });

  it("every row names its source in a form the sources list knows", () => {
    for (const r of SEED_REFERENCE_TYPES)
      expect(parseRowSource(r.source), `${r.designation}: ${r.source}`).toBeDefined();
    expect(new Set(SOURCE_TAGS).size).toBe(SOURCES.length);
    for (const s of SOURCES) expect(s.publication.length, s.tag).toBeGreaterThan(20);
  });
});

describe("series-string sets [REG MEM]", () => {
  it("the 150 mA radio set: 12BE6, 12BA6, 12AV6 at 12.6 V, 50C5 at 50 V, 35W4 at 35 V, all 0.15 A (about 123 V in series)", () => {
    const set = ["12BE6", "12BA6", "12AV6", "50C5", "35W4"];
    for (const d of set) expect(heater(d)?.[1], d).toBe(0.15);
    expect(set.reduce((v, d) => v + heater(d)![0]!, 0)).toBeCloseTo(122.8, 5);
  });

  it("the 100 mA radio set: 18FX6, 18FW6, 18FY6, 34GD5, 36AM3 at 0.1 A sum to 124 V [REG MEM?]", () => {
    const set = ["18FX6", "18FW6", "18FY6", "34GD5", "36AM3"];
    for (const d of set) expect(heater(d)?.[1], d).toBe(0.1);
    expect(set.reduce((v, d) => v + heater(d)![0]!, 0)).toBe(124);
  });
});

describe("European radio and TV series", () => {
  it.each([
    // [designation, heater V, A, base]; P = 300 mA, U = 100 mA, E = 6.3 V [PE]
    ["PCL86", 13.3, 0.3, "noval"], // [EU-DS MEM?]
    ["PCF80", 9, 0.3, "noval"], // [EU-DS MEM]
    ["PL36", 25, 0.3, "octal"], // [EU-DS MEM]
    ["PY88", 30, 0.3, "noval"], // [EU-DS MEM?]
    ["UCL82", 50, 0.1, "noval"], // [EU-DS MEM?]
    ["UY85", 38, 0.1, "noval"], // [EU-DS MEM?]
    ["EZ80", 6.3, 0.6, "noval"], // [EU-DS MEM]
    ["ECC85", 6.3, 0.435, "noval"], // [EU-DS MEM]
    ["EF80", 6.3, 0.3, "noval"], // [EU-DS MEM]
    ["ECH81", 6.3, 0.3, "noval"], // [EU-DS MEM]
  ] as const)("%s: %s V %s A, %s", (d, v, a, base) => {
    expect(heater(d)).toEqual([v, a]);
    expect(getReferenceType(SEED, d)?.base).toBe(base);
  });

  it("US and European names printed as one type share a row [MEM: makers' cross-references]", () => {
    expect(getReferenceType(SEED, "ECF82")?.designation).toBe("6U8A");
    expect(getReferenceType(SEED, "EZ80")?.designation).toBe("6V4");
    expect(getReferenceType(SEED, "PCF80")?.aliases).toContain("9A8");
    expect(getReferenceType(SEED, "PCL82")?.aliases).toContain("16A8");
  });

  it("a heater with no trusted figure is left out, and the first letter still gives the series current [PE]", () => {
    expect(getReferenceType(SEED, "PCC85")?.heater).toBeUndefined();
    const d = decodeDesignation(SEED, "PCC85");
    expect(d.ok && d.heater.seriesCurrentMa).toBe(300);
  });
});

describe("review findings", () => {
  it("2.0 V battery types numbered 1 decode without a contradiction [REG MEM?: 1A6, 1C6, 1F4 filaments 2.0 V]", () => {
    for (const d of ["1A6", "1C6", "1F4"]) {
      const r = decodeDesignation(SEED, d);
      if (!r.ok) throw new Error(r.message);
      expect(r.heater.volts, d).toBe(2);
      expect(r.heater.voltsRange, d).toEqual([0, 2]);
      expect(
        r.reasons.some((x) => x.includes("suggests about")),
        d,
      ).toBe(false);
    }
  });

  it("5Y3GT is directly heated [REG MEM]; 5AR4 gives higher output voltage (lower drop) [MEM]", () => {
    expect(getReferenceType(SEED, "5Y3GT")?.heater).toMatchObject({ volts: 5, amps: 2, filament: true });
    expect(getReferenceType(SEED, "5AR4")?.note).toMatch(/higher output voltage \(lower drop\)/);
  });

  it("mercury-vapour and cold-cathode rows carry their cautions [MEM, verify]", () => {
    for (const d of ["83", "866A", "872A", "816"])
      expect(
        getReferenceType(SEED, d)?.hazards.map((h) => h.kind),
        d,
      ).toContain("mercury-vapour");
    for (const d of ["0A2", "0A3", "0B3"])
      expect(
        getReferenceType(SEED, d)?.hazards.map((h) => h.kind),
        d,
      ).toContain("radioactive");
  });
});
