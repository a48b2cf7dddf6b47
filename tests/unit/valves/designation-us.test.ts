import { describe, expect, it } from "vitest";
import { decodeDesignation, type DecodedDesignation } from "@/lib/valves/designation";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// Brief section 2.1: US RMA/RETMA/EIA receiving-tube numbers.

function decoded(input: string): DecodedDesignation {
  const r = decodeDesignation(SEED, input);
  if (!r.ok) throw new Error(`expected ${input} to decode: ${r.message}`);
  return r;
}

describe("first number = heater class [LS53]", () => {
  it("1 is a low-voltage (battery) class, 1.4 V types up to 1.6 V and earlier 2.0 V types", () => {
    // [LS53] 1 = above 0 to 1.6 V; 2.0 V battery types also carry 1 [MEM]
    const d = decoded("1T4");
    expect(d.heater.kind).toBe("battery");
    expect(d.heater.voltsRange).toEqual([0, 2]); // widened for the 2.0 V battery types (1A6, 1C6, 1F4) [MEM]
    expect(d.heater.volts).toBe(1.4); // [REG MEM] 1T4 filament 1.4 V 0.05 A
  });

  it("5 is 4.6-5.6 V, 6 is 5.6-6.6 V, 12 is 12.6 V", () => {
    // [LS53]
    expect(decoded("5Y3GT").heater.voltsRange).toEqual([4.6, 5.6]);
    expect(decoded("6V6GT").heater.voltsRange).toEqual([5.6, 6.6]);
    expect(decoded("12SN7GT").heater.volts).toBe(12.6);
  });

  it("25/35/50 numbers are series-string heaters of about that voltage", () => {
    // [MEM] series-string classes; [REG MEM] 35W4 35 V 0.15 A, 50C5 50 V 0.15 A
    const d = decoded("35W4");
    expect(d.heater.volts).toBe(35);
    expect(d.heater.amps).toBe(0.15);
    expect(d.reasons.some((r) => r.includes("series-string"))).toBe(true);
    expect(decoded("50C5").heater.volts).toBe(50);
    expect(decoded("25L6").heater.volts).toBe(25);
  });

  it("14 with one letter is a 12.6 V loktal", () => {
    // [MEM] 12.6 V loktals carry 14
    const d = decoded("14A7");
    expect(d.loktal).toBe(true);
    expect(d.heater.volts).toBe(12.6);
  });

  it("7 with two letters is not a loktal", () => {
    // [MEM] later 7-class series-string types (7DJ8 is 7 V)
    const d = decoded("7AU7");
    expect(d.loktal).toBeUndefined();
    expect(d.heater.volts).toBe(7);
  });

  it("the number alone cannot tell a tapped heater", () => {
    // [LS53] tapped heaters are numbered by full series voltage
    const unknown = decoded("12ZZ9");
    expect(unknown.heater.tapped).toBeUndefined();
    expect(unknown.reasons.some((r) => r.includes("the number alone cannot tell"))).toBe(true);
    // 12SN7GT is a 12.6 V 0.3 A single heater [REG MEM]; 12AU7 is tapped [REG MEM]
    expect(decoded("12SN7GT").heater.tapped).toBe(false);
    expect(decoded("12AU7").heater.configurations).toHaveLength(2);
  });
});

describe("serial letters [LS53]", () => {
  it("skip I and O", () => {
    for (const input of ["6IQ7", "6SO7"]) {
      const r = decodeDesignation(SEED, input);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message).toMatch(/skip I and O/);
    }
  });

  it("leading S on a two-letter group means single-ended; a lone S does not", () => {
    expect(decoded("6SK7").singleEnded).toBe(true);
    expect(decoded("6SL7GT").singleEnded).toBe(true);
    expect(decoded("6S4").singleEnded).toBe(false);
    expect(decoded("6K7").singleEnded).toBe(false);
  });

  it("leading L on a battery type means battery loktal", () => {
    // [LS53, MEM]
    expect(decoded("1LN5").loktal).toBe(true);
  });

  it("U-Z single letters hint at rectifiers, not always", () => {
    // [LS53] allocated backwards from Z; 6V6 is a beam tetrode
    expect(decoded("5Y3GT").reasons.some((r) => r.includes("often a rectifier"))).toBe(true);
    expect(decoded("6V6").reasons.some((r) => r.includes("not always"))).toBe(true);
    expect(decoded("6L6").reasons.some((r) => r.includes("rectifier"))).toBe(false);
  });

  it("a 12 V twin keeps the letters", () => {
    // [MEM] 6SN7GT / 12SN7GT
    expect(decoded("12SN7GT").parts.letters).toBe(decoded("6SN7GT").parts.letters);
  });
});

describe("suffixes [MEM]", () => {
  it("no suffix on an octal type: probably the original metal version", () => {
    expect(decoded("6L6").envelope?.kind).toBe("metal-probable");
    expect(decoded("6V6").envelope?.kind).toBe("metal-probable");
  });

  it("no suffix on a miniature: glass", () => {
    expect(decoded("12AX7").envelope?.kind).toBe("glass-miniature");
  });

  it("G shouldered glass, GT tubular, GT/G either", () => {
    expect(decoded("6V6G").envelope?.kind).toBe("glass-shouldered");
    expect(decoded("6V6GT").envelope?.kind).toBe("glass-tubular");
    expect(decoded("6V6GT/G").envelope?.kind).toBe("glass-tubular-or-shouldered");
  });

  it("A, B, C are improvement letters; GTA/GTB improved GT", () => {
    expect(decoded("12AX7A").envelope?.improvement).toBe("A");
    const gtb = decoded("6SN7GTB");
    expect(gtb.envelope?.kind).toBe("glass-tubular");
    expect(gtb.envelope?.improvement).toBe("B");
    expect(gtb.reasons.some((r) => r.includes("improved GT"))).toBe(true);
    const gc = decoded("6L6GC");
    expect(gc.envelope?.kind).toBe("glass-shouldered");
    expect(gc.envelope?.improvement).toBe("C");
  });

  it("W, WA, WB are ruggedised", () => {
    expect(decoded("6SN7W").envelope?.ruggedised).toBe(true);
    const wa = decoded("12AX7WA");
    expect(wa.envelope?.ruggedised).toBe(true);
    expect(wa.specialQuality).toBe(true);
    expect(wa.reasons.some((r) => r.includes("later ruggedised"))).toBe(true);
    expect(decoded("5Y3WGTB").envelope?.kind).toBe("glass-tubular");
    expect(decoded("5Y3WGTB").envelope?.ruggedised).toBe(true);
  });

  it("Y low-loss phenolic base, X low-loss ceramic base, M metal", () => {
    expect(decoded("6V6GTY").envelope?.baseMaterial).toBe("low-loss-phenolic");
    expect(decoded("6SN7GTX").envelope?.baseMaterial).toBe("low-loss-ceramic");
    expect(decoded("6SN7M").envelope?.kind).toBe("metal");
  });

  it("refuses an unknown suffix", () => {
    const r = decodeDesignation(SEED, "12AX7Q");
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error).toBe("not-a-designation");
      expect(r.candidates).toContain("12AX7");
    }
  });

  it("suffix variants we do not list take data from the same stem", () => {
    const d = decoded("6L6GB");
    expect(d.reference).toEqual({ designation: "6L6", match: "stem" });
    expect(d.heater.amps).toBe(0.9); // [REG MEM] 6L6 family heater 0.9 A
  });
});

describe("other US numbers", () => {
  it("four-digit registrations have no heater meaning, with or without suffix", () => {
    // [MEM]
    const d = decoded("5814A");
    expect(d.system).toBe("us-special");
    expect(d.specialQuality).toBe(true);
    expect(d.heater.configurations?.[0]).toEqual({ volts: 12.6, amps: 0.175, wiring: "halves-in-series" });
    expect(decoded("6550").heater.volts).toBe(6.3); // from data [REG MEM?], not the leading 6
    expect(decoded("7025").reference).toEqual({ designation: "12AX7", match: "alias" });
  });

  it("early numbers are accepted only when listed", () => {
    const d = decoded("83");
    expect(d.system).toBe("us-numeric");
    expect(d.heater).toMatchObject({ volts: 5, amps: 3 }); // [REG MEM]
    const r = decodeDesignation(SEED, "123");
    expect(r.ok).toBe(false);
  });

  it("military numbers: VT and CV", () => {
    // [MEM] VT-231 is the 6SN7GT; CV4004 a 12AX7 special-quality number
    const vt = decoded("VT-231");
    expect(vt.system).toBe("military-vt");
    expect(vt.reference?.designation).toBe("6SN7GT");
    const cv = decoded("CV4004");
    expect(cv.system).toBe("military-cv");
    expect(cv.knownType).toBe(true);
    expect(cv.heater.kind).toBe("unknown");
  });
});
