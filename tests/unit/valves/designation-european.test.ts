import { describe, expect, it } from "vitest";
import { decodeDesignation, type DecodedDesignation } from "@/lib/valves/designation";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// Brief section 2.2: European designations [PE].

function decoded(input: string): DecodedDesignation {
  const r = decodeDesignation(SEED, input);
  if (!r.ok) throw new Error(`expected ${input} to decode: ${r.message}`);
  return r;
}

describe("first letter = heater [PE]", () => {
  // Values from the European heater-letter table [PE]; test designations are built as
  // <letter>F80 (a signal pentode on noval) so only the letter varies.
  const voltage: [string, number, string][] = [
    ["A", 4, "voltage"],
    ["E", 6.3, "voltage"],
    ["F", 12.6, "voltage"],
    ["G", 5, "voltage"],
    ["D", 1.4, "battery"],
    ["K", 2, "battery"],
  ];
  it.each(voltage)("%s: %s V (%s)", (letter, volts, kind) => {
    const d = decoded(`${letter}F80`);
    expect(d.heater.volts).toBe(volts);
    expect(d.heater.kind).toBe(kind);
  });

  const series: [string, number][] = [
    ["B", 180],
    ["C", 200],
    ["H", 150],
    ["P", 300],
    ["U", 100],
    ["V", 50],
  ];
  it.each(series)("%s: %s mA series string", (letter, ma) => {
    const d = decoded(`${letter}F80`);
    expect(d.heater.kind).toBe("series-current");
    expect(d.heater.seriesCurrentMa).toBe(ma);
  });

  it("rarer letters are marked from memory, and disputed values are left open", () => {
    // [MEM] L 450 mA; X/Y/W 450 or 600 mA depending on the source
    const l = decoded("LF80");
    expect(l.heater.seriesCurrentMa).toBe(450);
    expect(l.reasons[0]).toMatch(/\[PE, MEM\]/);
    const x = decoded("XF80");
    expect(x.heater.kind).toBe("series-current");
    expect(x.heater.seriesCurrentMa).toBeUndefined();
    expect(x.reasons[0]).toMatch(/sources differ/);
  });
});

describe("following letters = systems [PE]", () => {
  const table: [string, RegExp][] = [
    ["A", /signal diode/],
    ["B", /double diode/],
    ["C", /signal triode/],
    ["D", /power triode/],
    ["E", /signal tetrode/],
    ["F", /signal pentode/],
    ["H", /hexode/],
    ["K", /octode/],
    ["L", /output tetrode or pentode/],
    ["M", /tuning indicator/],
    ["N", /thyratron/],
    ["P", /secondary-emission/],
    ["Q", /nonode/],
    ["X", /gas-filled full-wave rectifier/],
    ["Y", /half-wave vacuum rectifier/],
    ["Z", /full-wave vacuum rectifier/],
  ];
  it.each(table)("%s", (letter, meaning) => {
    const d = decoded(`E${letter}80`);
    expect(d.electrodes).toHaveLength(1);
    expect(d.electrodes[0].letter).toBe(letter);
    expect(d.electrodes[0].system).toMatch(meaning);
  });

  it("decodes every letter of a multi-system valve", () => {
    expect(decoded("ECL82").electrodes.map((e) => e.letter)).toEqual(["C", "L"]);
    expect(decoded("ECL82").electrodes[1].system).toMatch(/output/);
  });

  it("notes letters out of alphabetical order", () => {
    expect(decoded("ECA80").reasons.some((r) => r.includes("alphabetical order"))).toBe(true);
    expect(decoded("ECC83").reasons.some((r) => r.includes("alphabetical order"))).toBe(false);
  });

  it("refuses letters that are not systems", () => {
    const r = decodeDesignation(SEED, "EGG83");
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.message).toMatch(/not a European system letter/);
      expect(r.candidates.length).toBeGreaterThan(0);
    }
  });
});

describe("digits = base [PE]", () => {
  const bases: [string, string][] = [
    ["EL34", "octal"],
    ["GZ34", "octal"],
    ["EF40", "rimlock"],
    ["EL84", "noval"],
    ["EF86", "noval"],
    ["EL90", "miniature-7-pin"],
    ["EZ90", "miniature-7-pin"],
    ["EF22", "loktal-b10b"],
    ["EF50", "b9g"],
    ["EF183", "noval"], // 18x [PE, MEM]
    ["ECC808", "noval"], // 8xx [PE, MEM]
    ["PL504", "magnoval"], // 5xx [PE, MEM]
  ];
  it.each(bases)("%s -> %s", (input, family) => {
    expect(decoded(input).base?.family).toBe(family);
  });

  it("leaves other three-digit numbers undecoded", () => {
    const d = decoded("EF300");
    expect(d.base).toBeUndefined();
    expect(d.reasons.some((r) => r.includes("base not decoded"))).toBe(true);
  });
});

describe("special-quality order [PE]", () => {
  it.each(["E88CC", "E83CC", "E80F", "E188CC", "E34L"])("%s is a special-quality form", (input) => {
    const d = decoded(input);
    expect(d.system).toBe("european-special");
    expect(d.specialQuality).toBe(true);
  });

  it("E88CC: 6.3 V, two triodes, noval; E80F one pentode; E34L octal", () => {
    const d = decoded("E88CC");
    expect(d.heater.volts).toBe(6.3);
    expect(d.electrodes.map((e) => e.system)).toEqual(["signal triode", "signal triode"]);
    expect(d.base?.family).toBe("noval");
    expect(decoded("E80F").electrodes.map((e) => e.system)).toEqual(["signal pentode"]);
    expect(decoded("E34L").base?.family).toBe("octal");
    expect(decoded("E188CC").base?.family).toBe("noval");
  });

  it("reference data adds the heater current: E88CC 0.3 A, ECC88 0.365 A", () => {
    // [✓] heaters differ
    expect(decoded("E88CC").heater.amps).toBe(0.3);
    expect(decoded("ECC88").heater.amps).toBe(0.365);
  });
});

describe("same letters, other heater letter", () => {
  it("PL84 and UL84 decode as output pentodes with series heaters", () => {
    // [PE]; that they are not EL84 equivalents is in the equivalents table [MEM]
    expect(decoded("PL84").heater.seriesCurrentMa).toBe(300);
    expect(decoded("UL84").heater.seriesCurrentMa).toBe(100);
  });
});
