import { describe, expect, it } from "vitest";
import { familyMembers, typeFamily, UNIDENTIFIED_FAMILY_KEY } from "@/lib/lots/type-family";
import { describeDesignation } from "@/lib/lots/item";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

describe("typeFamily", () => {
  it("groups 12AX7, ECC83, 12AX7A and 7025 as one family [MEM equivalents: exact/premium]", () => {
    for (const d of ["12AX7", "ECC83", "ecc-83", "12AX7A", "7025", "12AX7WA", "E83CC"]) {
      expect(typeFamily(SEED, d), d).toMatchObject({ key: "12AX7", label: "12AX7 family", match: "listed" });
    }
    expect(familyMembers(SEED, "12AX7")).toEqual(expect.arrayContaining(["12AX7", "ECC83", "12AX7A", "7025"]));
  });

  it("keeps substitutes with caveats and near types out of the family [MEM]", () => {
    // 5751 (µ 70) and 12AY7 (µ ≈ 40) are substitutes with caveats, not 12AX7s.
    expect(typeFamily(SEED, "5751").key).toBe("5751");
    expect(typeFamily(SEED, "12AY7").key).toBe("12AY7");
    // 6922 ≈ 6DJ8 is "near" (0.3 A against 0.365 A heater ✓): priced apart; E88CC is 6922.
    expect(typeFamily(SEED, "6922").key).not.toBe(typeFamily(SEED, "6DJ8").key);
    expect(typeFamily(SEED, "E88CC").key).toBe(typeFamily(SEED, "6922").key);
    expect(typeFamily(SEED, "ECC88").key).toBe("6DJ8");
    // KT88 ≈ 6550 near-equivalents only [CTP]; 6550A is the improved 6550.
    expect(typeFamily(SEED, "KT88").key).not.toBe(typeFamily(SEED, "6550").key);
    expect(typeFamily(SEED, "6550A").key).toBe("6550");
  });

  it("groups European and US names of one type [MEM]", () => {
    expect(typeFamily(SEED, "6CA7").key).toBe("EL34");
    expect(typeFamily(SEED, "6BQ5").key).toBe("EL84");
    expect(typeFamily(SEED, "GZ34").key).toBe("5AR4");
    expect(typeFamily(SEED, "ECC82").key).toBe("12AU7");
    expect(typeFamily(SEED, "5814A").key).toBe("12AU7");
  });

  it("sends unlisted suffix variants to their stem's family only when the stem has one family", () => {
    expect(typeFamily(SEED, "6SN7")).toMatchObject({ key: "6SN7GT", match: "stem" });
    // 6L6GA/GB/GC are rated apart [MEM], so an unknown 6L6 suffix is not guessed.
    expect(typeFamily(SEED, "6L6GD")).toMatchObject({ key: "6L6GD", label: "6L6GD", match: "unlisted" });
  });

  it("uses the normalised designation for unknown types and 'Unidentified' for unreadable ones", () => {
    expect(typeFamily(SEED, "6zz 99")).toEqual({ key: "6ZZ99", label: "6ZZ99", match: "unlisted" });
    expect(typeFamily(SEED, "12AX7!!")).toEqual({
      key: UNIDENTIFIED_FAMILY_KEY,
      label: "Unidentified",
      match: "invalid",
    });
    expect(typeFamily(SEED, "")).toMatchObject({ label: "Unidentified" });
  });
});

describe("describeDesignation", () => {
  it("gives the three answers, and flags only what is not a designation [SUG]", () => {
    expect(describeDesignation(SEED, "ecc83")).toEqual({ typed: "ecc83", normalised: "ECC83", status: "known" });
    // 5814 is the unsuffixed 5814A: on file through the US stem rule [MEM].
    expect(describeDesignation(SEED, "5814")).toMatchObject({ normalised: "5814", status: "known" });
    const unknown = describeDesignation(SEED, "6ZZ99");
    expect(unknown).toMatchObject({ normalised: "6ZZ99", status: "unknown-flagged" });
    expect(unknown.reviewNote).toMatch(/could not be read as a designation/);
    // ECC38 reads by the European scheme [PE] but has no figures on file: decoded, not flagged; ECC83 offered.
    const mistyped = describeDesignation(SEED, "ECC38");
    expect(mistyped.status).toBe("decoded");
    expect(mistyped.candidates).toContain("ECC83");
  });
});
