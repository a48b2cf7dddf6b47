import { describe, expect, it } from "vitest";
import { decodeDesignation, normaliseDesignation } from "@/lib/valves/designation";
import { findReferenceType, getReferenceType } from "@/lib/valves/reference-table";
import type { NominalCharacteristics, ReferenceType } from "@/lib/valves/reference-row";
import { SEED_REFERENCE_TYPES, seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// Brief section 4 (published nominal characteristics, class A1, per section)
// and section 9 items 8, 11, 12 and 13.

function row(designation: string): ReferenceType {
  const r = getReferenceType(SEED, designation);
  if (!r) throw new Error(`no reference row for ${designation}`);
  return r;
}
function amp(r: ReferenceType): Extract<NominalCharacteristics, { kind: "amplifier" }> {
  if (r.characteristics?.kind !== "amplifier") throw new Error(`${r.designation} has no amplifier figures`);
  return r.characteristics;
}

describe("check values, each with its source tag", () => {
  it("9.8 12AX7 heater: 12.6 V 0.15 A or 6.3 V 0.3 A", () => {
    // [LS53; REG ✓]
    expect(row("12AX7").heater).toEqual({ volts: 12.6, amps: 0.15, tapped: { volts: 6.3, amps: 0.3 } });
  });

  it("9.11 12AX7 at 250 V, -2 V: µ 100, Gm 1,600 µmho, Ip 1.2 mA", () => {
    // [REG ✓]
    expect(amp(row("12AX7"))).toMatchObject({
      plateVolts: 250,
      gridVolts: -2,
      mu: 100,
      gmMicromho: 1600,
      plateCurrentMa: 1.2,
    });
    expect(row("12AX7").source).toBe("REG ✓");
  });

  it("9.12 6SN7GT 6.3 V 0.6 A; 12SN7GT 12.6 V 0.3 A; same base and characteristics", () => {
    // [REG ✓/MEM]
    const a = row("6SN7GT");
    const b = row("12SN7GT");
    expect(a.heater).toEqual({ volts: 6.3, amps: 0.6 });
    expect(b.heater).toEqual({ volts: 12.6, amps: 0.3 });
    expect(a.base).toBe(b.base);
    expect(a.characteristics).toEqual(b.characteristics);
    // Same heater power, different voltage: not interchangeable without a heater change.
    expect(a.heater!.volts * a.heater!.amps).toBeCloseTo(b.heater!.volts * b.heater!.amps, 2);
    expect(a.heater!.volts).not.toBe(b.heater!.volts);
  });

  it("9.13 triodes with rp listed obey |µ - Gm·rp| / µ <= 5 %", () => {
    // [LS53] µ ≈ Gm × rp; 12AX7: 0.0016 × 62,500 = 100
    const triodes = SEED_REFERENCE_TYPES.filter(
      (r) => r.characteristics?.kind === "amplifier" && r.characteristics.rpOhms !== undefined,
    );
    expect(triodes.length).toBeGreaterThanOrEqual(15);
    for (const r of triodes) {
      const c = amp(r);
      expect(c.mu, r.designation).toBeDefined();
      const product = (c.gmMicromho! / 1e6) * c.rpOhms!;
      expect(Math.abs(c.mu! - product) / c.mu!, r.designation).toBeLessThanOrEqual(0.05);
    }
    expect((1600 / 1e6) * 62500).toBeCloseTo(100, 6);
  });
});

describe("published nominal characteristics [REG, EU-DS, MIL-E-1 as tagged]", () => {
  type Expect = {
    heater: [number, number] | null;
    base: string;
    plate?: number;
    grid?: number;
    rk?: number;
    screen?: number;
    mu?: number;
    gm?: number;
    ip?: number;
    rp?: number;
  };
  // Values with their source tags (lib/valves/sources.ts).
  const table: [string, Expect][] = [
    ["12AX7", { heater: [12.6, 0.15], base: "noval", plate: 250, grid: -2, mu: 100, gm: 1600, ip: 1.2, rp: 62500 }], // [REG ✓]
    ["ECC83", { heater: [12.6, 0.15], base: "noval", plate: 250, grid: -2, mu: 100, gm: 1600, ip: 1.2 }], // [REG ✓]
    ["12AU7", { heater: [12.6, 0.15], base: "noval", plate: 250, grid: -8.5, mu: 17, gm: 2200, ip: 10.5, rp: 7700 }], // [REG MEM]
    ["12AT7", { heater: [12.6, 0.15], base: "noval", plate: 250, grid: -2, mu: 60, gm: 5500, ip: 10, rp: 10900 }], // [REG MEM]
    ["12AY7", { heater: [12.6, 0.15], base: "noval", plate: 250, grid: -4, gm: 1750, ip: 3.0 }], // [REG MEM?] µ 40-44?
    ["5751", { heater: [12.6, 0.175], base: "noval", plate: 250, grid: -3, mu: 70, gm: 1200, ip: 1.0, rp: 58000 }], // [MIL-E-1/REG MEM]
    ["6DJ8", { heater: [6.3, 0.365], base: "noval", plate: 90, grid: -1.3, mu: 33, gm: 12500, ip: 15, rp: 2600 }], // [EU-DS MEM], heater ✓
    ["6922", { heater: [6.3, 0.3], base: "noval", plate: 90, grid: -1.3, mu: 33, gm: 12500, ip: 15 }], // [EU-DS MEM], heater ✓
    ["6SN7GT", { heater: [6.3, 0.6], base: "octal", plate: 250, grid: -8, mu: 20, gm: 2600, ip: 9, rp: 7700 }], // [REG ✓]
    ["12SN7GT", { heater: [12.6, 0.3], base: "octal", plate: 250, grid: -8, mu: 20, gm: 2600, ip: 9 }], // [REG MEM]
    ["6SL7GT", { heater: [6.3, 0.3], base: "octal", plate: 250, grid: -2, mu: 70, gm: 1600, ip: 2.3, rp: 44000 }], // [REG MEM]
    ["EF86", { heater: [6.3, 0.2], base: "noval", plate: 250, screen: 140, grid: -2, gm: 2000, ip: 3.0 }], // [EU-DS MEM?]
    ["6267", { heater: [6.3, 0.2], base: "noval", plate: 250, screen: 140, grid: -2, gm: 2000, ip: 3.0 }], // [EU-DS MEM?]
    ["6AU6", { heater: [6.3, 0.3], base: "miniature-7-pin", plate: 250, screen: 150, rk: 68, gm: 5200, ip: 10.6 }], // [REG MEM]
    ["6V6GT", { heater: [6.3, 0.45], base: "octal", plate: 250, screen: 250, grid: -12.5, gm: 4100, ip: 45 }], // [REG MEM]
    ["6L6GC", { heater: [6.3, 0.9], base: "octal", plate: 250, screen: 250, grid: -14, gm: 6000, ip: 72 }], // [REG MEM], heater ✓
    ["EL34", { heater: [6.3, 1.5], base: "octal", plate: 250, screen: 250, grid: -12.2, gm: 11000, ip: 100 }], // [EU-DS MEM]
    ["6CA7", { heater: [6.3, 1.5], base: "octal", plate: 250, screen: 250, grid: -12.2, gm: 11000, ip: 100 }], // [EU-DS MEM]
    ["EL84", { heater: [6.3, 0.76], base: "noval", plate: 250, screen: 250, grid: -7.3, gm: 11300, ip: 48 }], // [EU-DS MEM], heater ✓
    ["6BQ5", { heater: [6.3, 0.76], base: "noval", plate: 250, screen: 250, grid: -7.3, gm: 11300, ip: 48 }], // [EU-DS MEM]
    ["6550", { heater: [6.3, 1.6], base: "octal", plate: 250, screen: 250, grid: -14, gm: 11000, ip: 140 }], // [REG MEM?]
    ["KT88", { heater: [6.3, 1.6], base: "octal", plate: 250, screen: 250, grid: -15, gm: 11500, ip: 140 }], // [EU-DS MEM?], heater ✓
    ["5AR4", { heater: [5, 1.9], base: "octal" }], // [MEM?]
    ["GZ34", { heater: [5, 1.9], base: "octal" }], // [MEM?]
    ["0A2", { heater: null, base: "miniature-7-pin" }], // [MEM]
  ];

  it.each(table)("%s", (name, e) => {
    const r = row(name);
    expect(r.heater == null ? null : [r.heater.volts, r.heater.amps]).toEqual(e.heater);
    expect(r.base).toBe(e.base);
    if (e.plate === undefined) return;
    const c = amp(r);
    expect(c.plateVolts).toBe(e.plate);
    if (e.grid !== undefined) expect(c.gridVolts).toBe(e.grid);
    if (e.rk !== undefined) expect(c.cathodeResistorOhms).toBe(e.rk);
    if (e.screen !== undefined) expect(c.screenVolts).toBe(e.screen);
    if (e.mu !== undefined) expect(c.mu).toBe(e.mu);
    if (e.gm !== undefined) expect(c.gmMicromho).toBe(e.gm);
    if (e.ip !== undefined) expect(c.plateCurrentMa).toBe(e.ip);
    if (e.rp !== undefined) expect(c.rpOhms).toBe(e.rp);
  });

  it("12AY7 µ lies in the 40-44 range of secondary sources [REG MEM?]", () => {
    // [REG MEM?]
    const mu = amp(row("12AY7")).mu!;
    expect(mu).toBeGreaterThanOrEqual(40);
    expect(mu).toBeLessThanOrEqual(44);
  });

  it("0A2 regulates at 150 V over 5-30 mA", () => {
    // [MEM]
    expect(row("0A2").characteristics).toEqual({ kind: "regulator", regulatedVolts: 150, currentRangeMa: [5, 30] });
  });

  it("figures marked ≈ or ? in our sources are flagged approximate", () => {
    for (const name of ["6550", "KT88", "EF86"]) expect(amp(row(name)).approximate, name).toBe(true);
    expect(row("5AR4").characteristics).toMatchObject({ kind: "rectifier", approximate: true });
  });

  it("years of introduction from secondary histories", () => {
    // [MEM, secondary histories] 12AX7 1947, 6SN7 1939, 6L6 1936, EL84 1953
    expect(row("12AX7").introduced).toEqual({ year: 1947, source: "MEM" });
    expect(row("6SN7GT").introduced?.year).toBe(1939);
    expect(row("6L6").introduced?.year).toBe(1936);
    expect(row("EL84").introduced?.year).toBe(1953);
  });
});

describe("structure", () => {
  it("has at least 45 types across receiving, audio, rectifier and regulator kinds", () => {
    expect(SEED_REFERENCE_TYPES.length).toBeGreaterThanOrEqual(45);
    const kinds = new Set(SEED_REFERENCE_TYPES.map((r) => r.kind));
    for (const k of [
      "dual-triode",
      "pentode",
      "beam-tetrode",
      "power-pentode",
      "full-wave-rectifier",
      "voltage-regulator",
    ]) {
      expect(kinds.has(k as ReferenceType["kind"])).toBe(true);
    }
  });

  it("every row has an honest source tag", () => {
    for (const r of SEED_REFERENCE_TYPES) {
      expect(r.source, r.designation).toMatch(/^((REG|EU-DS|MIL-E-1\/REG) )?(✓|MEM\??)$/);
    }
  });

  it("designations and aliases are unique and already normalised", () => {
    const names = SEED_REFERENCE_TYPES.flatMap((r) => [r.designation, ...r.aliases]);
    expect(new Set(names).size).toBe(names.length);
    for (const n of names) {
      const res = normaliseDesignation(n);
      expect(res.ok && res.value, n).toBe(n);
    }
  });

  it("every row has a heater unless it is cold-cathode; a heater we have no figure for is left out, never guessed", () => {
    // [LS53] first number 0 = cold cathode, no heater
    for (const r of SEED_REFERENCE_TYPES) {
      if (r.kind === "voltage-regulator") expect(r.heater, r.designation).toBeNull();
      else if (r.heater === null) expect(r.designation, r.designation).toMatch(/^0/);
      else if (r.heater !== undefined) {
        expect(r.heater.volts).toBeGreaterThan(0);
        expect(r.heater.amps).toBeGreaterThan(0);
      }
    }
  });

  it("tapped heaters: halves in parallel at half the voltage and twice the current", () => {
    for (const r of SEED_REFERENCE_TYPES) {
      const t = r.heater?.tapped;
      if (!t) continue;
      expect(t.volts * 2).toBeCloseTo(r.heater!.volts, 5);
      expect(t.amps).toBeCloseTo(r.heater!.amps * 2, 5);
    }
  });

  it("every row decodes, and US heater classes agree with the data", () => {
    // [LS53] 5 = 4.6-5.6 V, 6 = 5.6-6.6 V, 12 = 12.6 V; 0 = no heater
    for (const r of SEED_REFERENCE_TYPES) {
      const d = decodeDesignation(SEED, r.designation);
      expect(d.ok, r.designation).toBe(true);
      if (!d.ok) continue;
      expect(d.knownType).toBe(true);
      if (d.system === "us-rma") {
        const code = d.parts.heaterCode;
        if (code === "0") expect(r.heater).toBeNull();
        if (code === "5") expect(r.heater!.volts).toBeGreaterThanOrEqual(4.6);
        if (code === "6") expect(r.heater!.volts).toBeGreaterThanOrEqual(5.6);
        if (code === "6") expect(r.heater!.volts).toBeLessThanOrEqual(6.6);
        if (code === "12") expect(r.heater!.volts).toBe(12.6);
      }
    }
  });

  it("European heater letters agree with the data", () => {
    // [PE] E = 6.3 V (either wiring of a tapped heater), G = 5 V, P = 300 mA
    for (const r of SEED_REFERENCE_TYPES) {
      for (const name of [r.designation, ...r.aliases]) {
        const first = name[0];
        if (!/^[A-Z]{2}/.test(name) || name.startsWith("KT") || name.startsWith("VR")) continue;
        if (!r.heater) continue;
        const volts = [r.heater.volts, r.heater.tapped?.volts];
        if (first === "E") expect(volts, name).toContain(6.3);
        if (first === "G") expect(volts, name).toContain(5);
        if (first === "P") expect(r.heater.amps, name).toBe(0.3);
        if (first === "U") expect(r.heater.amps, name).toBe(0.1); // [PE] U = 100 mA
        if (first === "D") expect(volts, name).toContain(1.4); // either wiring of a 2.8/1.4 V filament
      }
    }
  });

  it("mercury-vapour rectifiers carry their hazard", () => {
    // [MEM, verify] 83, 866A contain liquid mercury
    for (const n of ["83", "866A"]) expect(row(n).hazards.map((h) => h.kind)).toContain("mercury-vapour");
    expect(row("12AX7").hazards).toEqual([]);
  });
});

describe("lookup", () => {
  it("resolves aliases and normalisation", () => {
    expect(getReferenceType(SEED, "ecc 83")?.designation).toBe("12AX7");
    expect(getReferenceType(SEED, "gz-34")?.designation).toBe("5AR4");
    expect(getReferenceType(SEED, "E88CC")?.designation).toBe("6922");
    expect(getReferenceType(SEED, "12AX8")).toBeUndefined();
    expect(getReferenceType(SEED, "")).toBeUndefined();
  });

  it("matches unlisted suffix variants by stem only through findReferenceType", () => {
    expect(getReferenceType(SEED, "6L6GB")).toBeUndefined();
    expect(findReferenceType(SEED, "6L6GB")).toMatchObject({ row: { designation: "6L6" }, match: "stem" });
    expect(findReferenceType(SEED, "ECC83")?.match).toBe("alias");
    expect(findReferenceType(SEED, "12AX7")?.match).toBe("exact");
  });
});
