import { describe, expect, it } from "vitest";
import {
  closestNames,
  decodeDesignation,
  editDistance,
  isKnownDesignation,
  knownDesignations,
} from "@/lib/valves/designation";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// Error handling and suggestions are our own product rules [SUG]; the
// designations suggested are registered types [REG] and European names [PE].

describe("decodeDesignation failures", () => {
  it("empty, too long and bad characters", () => {
    const cases: [string, string][] = [
      ["", "empty"],
      ["   ", "empty"],
      ["X".repeat(33), "too-long"],
      ["12AX7\u0000", "bad-characters"],
      ["12AX7;DROP", "bad-characters"],
    ];
    for (const [input, error] of cases) {
      const r = decodeDesignation(SEED, input);
      expect(r.ok).toBe(false);
      if (!r.ok) {
        expect(r.error).toBe(error);
        expect(r.message.length).toBeGreaterThan(0);
      }
    }
  });

  it("not a designation, with the closest known ones", () => {
    const cases: [string, string][] = [
      ["12AXX7", "12AX7"],
      ["KT89", "KT88"],
      ["HELLO", "EL84"],
      ["ECC8", "ECC83"],
    ];
    for (const [input, expected] of cases) {
      const r = decodeDesignation(SEED, input);
      expect(r.ok, input).toBe(false);
      if (!r.ok) {
        expect(r.error).toBe("not-a-designation");
        if (input !== "HELLO") expect(r.candidates).toContain(expected);
      }
    }
  });

  it("two designations joined by a slash suggest both", () => {
    const r = decodeDesignation(SEED, "12AX7/ECC83");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.candidates.slice(0, 2)).toEqual(["12AX7", "ECC83"]);
  });
});

describe("well-formed but unknown designations", () => {
  it("12AX8 decodes, is flagged unknown and suggests 12AX7", () => {
    const r = decodeDesignation(SEED, "12AX8");
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.knownType).toBe(false);
      expect(r.candidates).toContain("12AX7");
    }
  });

  it("ECC38 suggests ECC83 (swapped digits)", () => {
    const r = decodeDesignation(SEED, "ECC38");
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.knownType).toBe(false);
      expect(r.candidates).toContain("ECC83");
    }
  });

  it("known types carry no candidates", () => {
    const r = decodeDesignation(SEED, "ECC83");
    expect(r.ok && r.knownType).toBe(true);
    expect(r.ok && r.candidates).toEqual([]);
  });
});

describe("edit distance", () => {
  it("counts insertions, deletions, substitutions and neighbour swaps", () => {
    expect(editDistance("12AX7", "12AX7")).toBe(0);
    expect(editDistance("12AX7", "12AX8")).toBe(1);
    expect(editDistance("ECC38", "ECC83")).toBe(1);
    expect(editDistance("12AX7", "12AX7A")).toBe(1);
    expect(editDistance("6SN7", "SN7")).toBe(1);
    expect(editDistance("", "EL34")).toBe(4);
    expect(editDistance("KT88", "EL34")).toBe(4);
  });

  it("closestNames orders by distance, then alphabetically, within the limit", () => {
    expect(closestNames("ECC38", ["ECC83", "ECC33", "EL34", "ECC81"])).toEqual(["ECC33", "ECC83", "ECC81"]);
    expect(closestNames("EL34", ["EL34"])).toEqual([]);
  });
});

describe("known designations", () => {
  it("cover reference rows, aliases and the equivalents table", () => {
    const names = knownDesignations(SEED);
    expect(names).toContain("12AX7");
    expect(names).toContain("ECC83");
    expect(names).toContain("CV4004");
    expect(isKnownDesignation(SEED, "7189A")).toBe(true);
    expect(isKnownDesignation(SEED, "12AX8")).toBe(false);
  });
});
