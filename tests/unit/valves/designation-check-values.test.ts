import { describe, expect, it } from "vitest";
import { decodeDesignation, type DecodedDesignation } from "@/lib/valves/designation";
import { findEquivalents } from "@/lib/valves/equivalents";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// Brief section 9, items 1-10: designation check values, each with its source.

function decoded(input: string): DecodedDesignation {
  const r = decodeDesignation(SEED, input);
  if (!r.ok) throw new Error(`expected ${input} to decode: ${r.message}`);
  return r;
}
const systems = (d: DecodedDesignation) => d.electrodes.map((e) => e.system);

describe("designation check values [PE, LS53, MEM as tagged]", () => {
  it("9.1 ECC83: E 6.3 V, CC two signal triodes, 8 noval", () => {
    // [PE] European designation scheme
    const d = decoded("ECC83");
    expect(d.system).toBe("european");
    expect(d.heater.kind).toBe("voltage");
    expect(d.heater.volts).toBe(6.3);
    expect(systems(d)).toEqual(["signal triode", "signal triode"]);
    expect(d.base?.family).toBe("noval");
    expect(d.base?.from).toBe("designation");
  });

  it("9.2 PCC88: 300 mA series heater, double triode, noval; 7DJ8 is 7 V 0.3 A and not equivalent to 6DJ8", () => {
    // [PE] P = 300 mA series; [✓] 7 V 0.3 A heater, not a drop-in
    const d = decoded("PCC88");
    expect(d.heater.kind).toBe("series-current");
    expect(d.heater.seriesCurrentMa).toBe(300);
    expect(systems(d)).toEqual(["signal triode", "signal triode"]);
    expect(d.base?.family).toBe("noval");
    const twin = decoded("7DJ8");
    expect(twin.heater.volts).toBe(7);
    expect(twin.heater.amps).toBe(0.3);
    expect(twin.loktal).toBe(false);
    const link = findEquivalents("PCC88").matches.find((m) => m.designation === "6DJ8");
    expect(link?.link).toBe("sibling-heater");
    const twinLink = findEquivalents("7DJ8").matches.find((m) => m.designation === "6DJ8");
    expect(twinLink?.link).not.toBe("exact");
  });

  it("9.3 GZ34: G 5 V, Z full-wave vacuum rectifier, 3 octal; = 5AR4", () => {
    // [PE]; equivalence [MEM]
    const d = decoded("GZ34");
    expect(d.heater.volts).toBe(5);
    expect(systems(d)).toEqual(["full-wave vacuum rectifier"]);
    expect(d.base?.family).toBe("octal");
    expect(findEquivalents("GZ34").matches.find((m) => m.designation === "5AR4")?.link).toBe("exact");
  });

  it("9.4 UCH81: 100 mA series, triode + hexode/heptode, noval", () => {
    // [PE]
    const d = decoded("UCH81");
    expect(d.heater.seriesCurrentMa).toBe(100);
    expect(systems(d)).toEqual(["signal triode", "hexode or hexode-type heptode"]);
    expect(d.base?.family).toBe("noval");
  });

  it("9.5 EABC80: 6.3 V, diode + double diode + triode, noval", () => {
    // [PE]
    const d = decoded("EABC80");
    expect(d.heater.volts).toBe(6.3);
    expect(systems(d)).toEqual(["signal diode", "double diode (common cathode)", "signal triode"]);
    expect(d.base?.family).toBe("noval");
  });

  it("9.6 6SN7GT: class 6 (6.3 V), S single-ended, 7 elements, GT glass tubular", () => {
    // [LS53] heater class and S; [MEM] suffix and element count
    const d = decoded("6SN7GT");
    expect(d.system).toBe("us-rma");
    expect(d.heater.volts).toBe(6.3);
    expect(d.heater.voltsRange).toEqual([5.6, 6.6]);
    expect(d.singleEnded).toBe(true);
    expect(d.elementCount).toBe(7);
    expect(d.envelope?.kind).toBe("glass-tubular");
    expect(d.reasons.some((r) => /never derive a pinout/.test(r))).toBe(true);
  });

  it("9.7 7N7: loktal, heater 6.3 V, not 7 V", () => {
    // [LS53] 6.3 V loktals carry 7
    const d = decoded("7N7");
    expect(d.loktal).toBe(true);
    expect(d.base?.family).toBe("loktal");
    expect(d.heater.volts).toBe(6.3);
    expect(d.heater.volts).not.toBe(7);
  });

  it("9.8 12AX7: tapped heater, 12.6 V 0.15 A or 6.3 V 0.3 A", () => {
    // [LS53] numbered by full series voltage; [REG ✓] 0.15 / 0.3 A
    const d = decoded("12AX7");
    expect(d.heater.tapped).toBe(true);
    expect(d.heater.configurations).toEqual([
      { volts: 12.6, amps: 0.15, wiring: "halves-in-series" },
      { volts: 6.3, amps: 0.3, wiring: "halves-in-parallel" },
    ]);
    expect(d.reasons.some((r) => r.includes("centre-tapped") && r.includes("[REG ✓]"))).toBe(true);
  });

  it("9.9 0A2: cold cathode, no heater", () => {
    // [LS53] first number 0
    const d = decoded("0A2");
    expect(d.coldCathode).toBe(true);
    expect(d.heater.kind).toBe("none");
    expect(d.heater.volts).toBeUndefined();
  });

  it("9.10 5751: four-digit registration, no 5 V heater inferred", () => {
    // [MEM] four-digit EIA numbers carry no heater meaning
    const d = decoded("5751");
    expect(d.system).toBe("us-special");
    expect(d.heater.volts).not.toBe(5);
    expect(d.heater.volts).toBe(12.6); // from reference data, not the number [MIL-E-1/REG MEM]
    expect(d.reasons[0]).toMatch(/says nothing about the heater/);
    // A four-digit number we do not list: heater stays unknown.
    const unknown = decoded("5999");
    expect(unknown.system).toBe("us-special");
    expect(unknown.heater.kind).toBe("unknown");
    expect(unknown.heater.volts).toBeUndefined();
  });
});

describe("every reason carries a source tag", () => {
  it.each(["ECC83", "PCC88", "6SN7GT", "7N7", "12AX7", "0A2", "5751", "E88CC", "CV4004", "KT88", "12AX8", "83"])(
    "%s",
    (input) => {
      const d = decoded(input);
      expect(d.reasons.length).toBeGreaterThan(0);
      for (const r of d.reasons) expect(r).toMatch(/\[(REG|MIL-E-1|EU-DS|PE|LS53|EIA-476|CTP|MEM|SUG)[^\]]*\]/);
    },
  );
});
