import { describe, expect, it } from "vitest";
import { normaliseDesignation } from "@/lib/valves/designation";
import { EQUIVALENT_GROUPS, composeLinks, findEquivalents, type LinkKind } from "@/lib/valves/equivalents";
import { getReferenceType } from "@/lib/valves/reference-table";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// Brief section 3 (common equivalents, mostly [MEM], heaters ✓ where marked)
// and section 9 items 2, 3, 12 and 14.

function link(from: string, to: string): LinkKind | undefined {
  return findEquivalents(from).matches.find((m) => m.designation === to)?.link;
}
function direction(from: string, to: string) {
  return findEquivalents(from).matches.find((m) => m.designation === to)?.direction;
}

describe("check values, each with its source tag", () => {
  it("9.14 5751 <-> 12AX7 is a substitute with caveats, never exact", () => {
    // [MEM] 5751 µ 70 against 100
    expect(link("5751", "12AX7")).toBe("caveat");
    expect(link("12AX7", "5751")).toBe("caveat");
  });

  it("9.14 KT88 <-> 6550 is near, never exact", () => {
    // [CTP] same pinout, rebias
    expect(link("KT88", "6550")).toBe("near");
    expect(link("6550", "KT88")).toBe("near");
  });

  it("9.14 6922 <-> 6DJ8 is near (heater 0.3 A against 0.365 A)", () => {
    // [✓] heaters differ
    expect(link("6922", "6DJ8")).toBe("near");
    expect(link("6DJ8", "6922")).toBe("near");
    expect(findEquivalents("6DJ8").matches.find((m) => m.designation === "6922")?.note).toMatch(/0\.3 A/);
  });

  it("9.2 PCC88 / 7DJ8 are not drop-ins for 6DJ8", () => {
    // [PE; ✓] 7 V 0.3 A
    expect(link("PCC88", "6DJ8")).toBe("sibling-heater");
    expect(link("7DJ8", "6DJ8")).toBe("sibling-heater");
    expect(link("6922", "PCC88")).toBe("sibling-heater");
    expect(link("PCC88", "7DJ8")).toBe("exact");
  });

  it("9.3 GZ34 = 5AR4", () => {
    // [PE; MEM]
    expect(link("GZ34", "5AR4")).toBe("exact");
    expect(link("5AR4", "GZ34")).toBe("exact");
  });

  it("9.12 6SN7GT / 12SN7GT: same pinout, heater differs", () => {
    // [REG ✓/MEM] 6.3 V 0.6 A against 12.6 V 0.3 A
    expect(link("6SN7GT", "12SN7GT")).toBe("sibling-heater");
    expect(link("12SN7GT", "6SN7GT")).toBe("sibling-heater");
    expect(getReferenceType(SEED, "6SN7GT")?.heater).toEqual({ volts: 6.3, amps: 0.6 });
    expect(getReferenceType(SEED, "12SN7GT")?.heater).toEqual({ volts: 12.6, amps: 0.3 });
  });
});

describe("equivalent families [MEM]", () => {
  const expected: [string, string, LinkKind][] = [
    // 12AX7 family
    ["12AX7", "ECC83", "exact"],
    ["12AX7", "12AX7A", "exact"],
    ["12AX7", "7025", "premium"],
    ["12AX7", "12AX7WA", "premium"],
    ["12AX7", "E83CC", "premium"],
    ["12AX7", "CV4004", "premium"],
    ["12AX7", "12AY7", "caveat"],
    // 12AU7 family
    ["12AU7", "ECC82", "exact"],
    ["12AU7", "12AU7A", "exact"],
    ["12AU7", "5814A", "premium"],
    ["12AU7", "6189", "premium"],
    ["12AU7", "E82CC", "premium"],
    ["12AU7", "CV4003", "premium"],
    ["12AU7", "5963", "caveat"],
    // 12AT7 family
    ["12AT7", "ECC81", "exact"],
    ["12AT7", "6201", "premium"],
    ["12AT7", "6679", "premium"],
    ["12AT7", "E81CC", "premium"],
    // 6DJ8 family
    ["6DJ8", "ECC88", "exact"],
    ["6DJ8", "7308", "near"],
    ["6DJ8", "E188CC", "near"],
    ["6922", "E88CC", "exact"],
    ["7308", "E188CC", "exact"],
    // 6SN7 family
    ["6SN7GT", "6SN7GTA", "exact"],
    ["6SN7GT", "6SN7GTB", "exact"],
    ["6SN7GT", "6SN7W", "premium"],
    ["6SN7GT", "6SN7WGT", "premium"],
    ["6SN7GT", "5692", "premium"],
    ["6SN7GT", "VT231", "premium"],
    ["6SN7GT", "6CG7", "different-base"],
    ["6SN7GT", "6F8G", "different-base"],
    ["12SN7GT", "6CG7", "different-base"],
    // EL34
    ["EL34", "6CA7", "exact"],
    ["EL34", "KT77", "caveat"],
    ["EL34", "E34L", "caveat"],
    // EL84
    ["EL84", "6BQ5", "exact"],
    ["EL84", "E84L", "premium"],
    ["6BQ5", "7189", "premium"],
    ["6BQ5", "7189A", "premium"],
    // 6V6
    ["6V6", "6V6G", "exact"],
    ["6V6", "6V6GT", "exact"],
    ["6V6", "6V6GTA", "exact"],
    ["6V6", "5871", "premium"],
    ["6V6GT", "6AQ5", "different-base"],
    ["6AQ5", "EL90", "exact"],
    // 6L6
    ["6L6", "6L6G", "exact"],
    ["6L6", "6L6GC", "near"],
    ["6L6", "5881", "premium"],
    ["6L6", "7581A", "premium"],
    ["6L6GC", "KT66", "caveat"],
    // 5AR4
    ["5AR4", "5U4GB", "caveat"],
    ["5AR4", "5Y3GT", "caveat"],
    // KT88
    ["KT88", "6550A", "near"],
    // exact pairs
    ["EF86", "6267", "exact"],
    ["6AU6", "EF94", "exact"],
    ["6BA6", "EF93", "exact"],
    ["6BE6", "EK90", "exact"],
    ["6X4", "EZ90", "exact"],
    ["6BM8", "ECL82", "exact"],
  ];
  it.each(expected)("%s -> %s is %s", (from, to, kind) => {
    expect(link(from, to)).toBe(kind);
  });

  it("6CA7 carries the beam-tetrode caveat in its note", () => {
    expect(findEquivalents("EL34").matches.find((m) => m.designation === "6CA7")?.note).toMatch(/beam tetrode/);
  });

  it("ECC32 / ECC33 are listed as not equivalent to 6SN7GT", () => {
    const r = findEquivalents("6SN7GT");
    expect(r.notEquivalent.map((w) => w.designation)).toEqual(["ECC32", "ECC33"]);
    expect(r.matches.some((m) => m.designation.startsWith("ECC3"))).toBe(false);
    const back = findEquivalents("ECC33");
    expect(back.matches).toEqual([]);
    expect(back.notEquivalent.map((w) => w.designation)).toEqual(["6SN7GT"]);
  });

  it("PL84 / UL84 are not EL84 equivalents", () => {
    expect(findEquivalents("EL84").notEquivalent.map((w) => w.designation)).toEqual(["PL84", "UL84"]);
  });
});

describe("replacement direction by rating", () => {
  it("7189 replaces 6BQ5, not necessarily the reverse", () => {
    // [MEM]
    expect(direction("6BQ5", "7189")).toBe("upgrade");
    expect(direction("7189", "6BQ5")).toBe("downgrade");
    expect(direction("7189", "7189A")).toBe("upgrade");
  });

  it("lower-rated 6L6 versions are downgrades from 6L6GC", () => {
    // [MEM] ratings rise with each suffix; 6L6GC 30 W ✓
    expect(direction("6L6GC", "6L6GB")).toBe("downgrade");
    expect(direction("6L6GC", "6L6")).toBe("downgrade");
    expect(direction("6L6GB", "6L6GC")).toBe("upgrade");
    expect(direction("6SN7GT", "6SN7GTB")).toBe("upgrade");
  });

  it("exact names of one type go both ways", () => {
    expect(direction("12AX7", "ECC83")).toBe("both-ways");
    expect(direction("ECC83", "12AX7")).toBe("both-ways");
  });
});

describe("lookup", () => {
  it("by any member and by normalised variants", () => {
    expect(link("ecc-83", "12AX7")).toBe("exact");
    expect(link(" e88cc ", "6DJ8")).toBe("near");
    expect(link("vt-231", "6SN7GT")).toBe("premium");
  });

  it("by US stem when the exact variant is not listed", () => {
    const r = findEquivalents("6sn7");
    expect(r.resolvedAs).toBe("6SN7GT");
    expect(r.matches.find((m) => m.designation === "12SN7GT")?.link).toBe("sibling-heater");
  });

  it("never lists the query itself", () => {
    for (const q of ["12ax7", "E88CC", "6L6GC", "gz34"]) {
      const key = q.toUpperCase();
      const r = findEquivalents(q);
      expect(r.matches.length).toBeGreaterThan(0);
      expect(r.matches.some((m) => m.designation === key)).toBe(false);
    }
  });

  it("returns nothing for unknown or malformed input", () => {
    expect(findEquivalents("12AX8").matches).toEqual([]);
    expect(findEquivalents("").matches).toEqual([]);
  });

  it("every match has a typed link, a note and a source", () => {
    const kinds = new Set(["exact", "premium", "near", "caveat", "sibling-heater", "different-base"]);
    for (const g of EQUIVALENT_GROUPS) {
      for (const q of [g.anchor, ...g.members.map((x) => x.designation)]) {
        const r = findEquivalents(q);
        expect(r.matches.length).toBeGreaterThan(0);
        for (const m of r.matches) {
          expect(kinds.has(m.link)).toBe(true);
          expect(m.note.length).toBeGreaterThan(0);
          expect(m.source.length).toBeGreaterThan(0);
        }
      }
    }
  });
});

describe("composeLinks", () => {
  it("keeps the weaker link", () => {
    expect(composeLinks("exact", "premium")).toBe("premium");
    expect(composeLinks("premium", "near")).toBe("near");
    expect(composeLinks("near", "sibling-heater")).toBe("sibling-heater");
    expect(composeLinks("sibling-heater", "different-base")).toBe("different-base");
    expect(composeLinks("caveat", "caveat")).toBe("caveat");
  });
});

describe("table structure", () => {
  it("names are normalised, unique per group, and sameAs points inside the group", () => {
    for (const g of EQUIVALENT_GROUPS) {
      const names = [g.anchor, ...g.members.map((x) => x.designation)];
      expect(new Set(names).size).toBe(names.length);
      for (const n of names) {
        const r = normaliseDesignation(n);
        expect(r.ok && r.value).toBe(n);
      }
      for (const x of g.members) {
        if (x.sameAs) expect(names).toContain(x.sameAs);
        expect(x.source.length).toBeGreaterThan(0);
      }
    }
  });

  it("group ids are unique", () => {
    const ids = EQUIVALENT_GROUPS.map((g) => g.id);
    expect(new Set(ids).size).toBe(ids.length);
  });
});
