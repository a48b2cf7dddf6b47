import { describe, expect, it } from "vitest";
import { familyMembers, typeFamily, UNIDENTIFIED_FAMILY_KEY } from "@/lib/lots/type-family";
import { describeDesignation } from "@/lib/lots/item";

describe("typeFamily", () => {
  it("groups 12AX7, ECC83, 12AX7A and 7025 as one family [MEM equivalents: exact/premium]", () => {
    for (const d of ["12AX7", "ECC83", "ecc-83", "12AX7A", "7025", "12AX7WA", "E83CC"]) {
      expect(typeFamily(d), d).toMatchObject({ key: "12AX7", label: "12AX7 family", match: "listed" });
    }
    expect(familyMembers("12AX7")).toEqual(expect.arrayContaining(["12AX7", "ECC83", "12AX7A", "7025"]));
  });

  it("keeps substitutes with caveats and near types out of the family [MEM]", () => {
    // 5751 (µ 70) and 12AY7 (µ ≈ 40) are substitutes with caveats, not 12AX7s.
    expect(typeFamily("5751").key).toBe("5751");
    expect(typeFamily("12AY7").key).toBe("12AY7");
    // 6922 ≈ 6DJ8 is "near" (0.3 A against 0.365 A heater ✓): priced apart; E88CC is 6922.
    expect(typeFamily("6922").key).not.toBe(typeFamily("6DJ8").key);
    expect(typeFamily("E88CC").key).toBe(typeFamily("6922").key);
    expect(typeFamily("ECC88").key).toBe("6DJ8");
    // KT88 ≈ 6550 near-equivalents only [CTP]; 6550A is the improved 6550.
    expect(typeFamily("KT88").key).not.toBe(typeFamily("6550").key);
    expect(typeFamily("6550A").key).toBe("6550");
  });

  it("groups European and US names of one type [MEM]", () => {
    expect(typeFamily("6CA7").key).toBe("EL34");
    expect(typeFamily("6BQ5").key).toBe("EL84");
    expect(typeFamily("GZ34").key).toBe("5AR4");
    expect(typeFamily("ECC82").key).toBe("12AU7");
    expect(typeFamily("5814A").key).toBe("12AU7");
  });

  it("sends unlisted suffix variants to their stem's family only when the stem has one family", () => {
    expect(typeFamily("6SN7")).toMatchObject({ key: "6SN7GT", match: "stem" });
    // 6L6GA/GB/GC are rated apart [MEM], so an unknown 6L6 suffix is not guessed.
    expect(typeFamily("6L6GD")).toMatchObject({ key: "6L6GD", label: "6L6GD", match: "unlisted" });
  });

  it("uses the normalised designation for unknown types and 'Unidentified' for unreadable ones", () => {
    expect(typeFamily("6zz 99")).toEqual({ key: "6ZZ99", label: "6ZZ99", match: "unlisted" });
    expect(typeFamily("12AX7!!")).toEqual({ key: UNIDENTIFIED_FAMILY_KEY, label: "Unidentified", match: "invalid" });
    expect(typeFamily("")).toMatchObject({ label: "Unidentified" });
  });
});

describe("describeDesignation", () => {
  it("flags unknown designations for review instead of rejecting them [SUG]", () => {
    expect(describeDesignation("ecc83")).toEqual({ typed: "ecc83", normalised: "ECC83", status: "known" });
    const unknown = describeDesignation("6ZZ99");
    expect(unknown).toMatchObject({ normalised: "6ZZ99", status: "unknown-flagged" });
    expect(unknown.reviewNote).toMatch(/not in our type lists/);
    const mistyped = describeDesignation("ECC38");
    expect(mistyped.status).toBe("unknown-flagged");
    expect(mistyped.candidates).toContain("ECC83");
  });
});
