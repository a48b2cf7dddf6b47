import { describe, expect, it } from "vitest";
import {
  MAX_DESIGNATION_LENGTH,
  designationKey,
  designationStem,
  normaliseDesignation,
} from "@/lib/valves/designation";

// Cleaning rules are our own [SUG]; the designations used are registered type
// numbers [REG] and European names [PE].

function value(input: string): string | undefined {
  const r = normaliseDesignation(input);
  return r.ok ? r.value : undefined;
}

describe("normaliseDesignation", () => {
  it("upper-cases and joins what a consignor types", () => {
    expect(value("12ax7a")).toBe("12AX7A");
    expect(value("12AX7-A")).toBe("12AX7A");
    expect(value("ecc 83")).toBe("ECC83");
    expect(value("  6sn7gt \n")).toBe("6SN7GT");
    expect(value("VT-231")).toBe("VT231");
    expect(value("E.C.C.83")).toBe("ECC83");
  });

  it("folds full-width and compatibility forms (NFKC)", () => {
    expect(value("１２ＡＸ７")).toBe("12AX7");
    expect(value("ｅｃｃ８３")).toBe("ECC83");
  });

  it("folds Cyrillic and Greek look-alike capitals to Latin", () => {
    // "ЕСС83" typed with Cyrillic Е and С
    expect(value("\u0415\u0421\u042183")).toBe("ECC83");
    // Greek capital Kappa and Tau in "KT88"
    expect(value("\u039A\u03A488")).toBe("KT88");
  });

  it("treats typographic dashes like hyphens", () => {
    expect(value("12AX7\u2013A")).toBe("12AX7A");
    expect(value("12AX7\u2212A")).toBe("12AX7A");
  });

  it("reads a leading letter O as zero on cold-cathode shapes only", () => {
    const r = normaliseDesignation("oa2");
    expect(r.ok && r.value).toBe("0A2");
    expect(r.ok && r.changes.some((c) => c.includes("letter O"))).toBe(true);
    expect(value("OD3")).toBe("0D3");
    // Longer shapes are left alone.
    expect(value("OA81")).toBe("OA81");
  });

  it("keeps the GT/G slash", () => {
    expect(value("6v6gt/g")).toBe("6V6GT/G");
  });

  it("reports what it changed", () => {
    const r = normaliseDesignation("12ax7-a");
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.changes).toEqual(["upper-cased", "removed spaces, hyphens or dots"]);
    const clean = normaliseDesignation("ECC83");
    expect(clean.ok && clean.changes).toEqual([]);
  });

  it("refuses empty input", () => {
    for (const input of ["", "   ", " - ", "\t"]) {
      const r = normaliseDesignation(input);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toBe("empty");
    }
  });

  it("refuses control and invisible characters", () => {
    for (const input of ["12AX7\u0000", "12A\u0007X7", "12AX\u200B7", "EC\u00ADC83"]) {
      const r = normaliseDesignation(input);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toBe("bad-characters");
    }
  });

  it("refuses characters outside letters, digits and slash", () => {
    for (const input of ["12AX7!", "ECC83*", "6SN7<script>", "12AX7\u00E9"]) {
      const r = normaliseDesignation(input);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toBe("bad-characters");
    }
  });

  it("bounds the length", () => {
    expect(value("A".repeat(MAX_DESIGNATION_LENGTH))).toBe("A".repeat(MAX_DESIGNATION_LENGTH));
    const long = normaliseDesignation("A".repeat(MAX_DESIGNATION_LENGTH + 1));
    expect(long.ok).toBe(false);
    if (!long.ok) expect(long.error).toBe("too-long");
    const huge = normaliseDesignation("12AX7 ".repeat(10_000));
    expect(huge.ok).toBe(false);
    if (!huge.ok) expect(huge.error).toBe("too-long");
  });

  it("designationKey gives the normalised value or undefined", () => {
    expect(designationKey("ecc 83")).toBe("ECC83");
    expect(designationKey("")).toBeUndefined();
  });
});

describe("designationStem", () => {
  it("drops US suffixes and keeps four-digit numbers", () => {
    // [LS53] suffixes follow the element count
    expect(designationStem("6SN7GTB")).toBe("6SN7");
    expect(designationStem("6L6GC")).toBe("6L6");
    expect(designationStem("12AX7WA")).toBe("12AX7");
    expect(designationStem("5814A")).toBe("5814");
  });

  it("has no stem for European names or joined designations", () => {
    expect(designationStem("ECC83")).toBeUndefined();
    expect(designationStem("12AX7/ECC83")).toBeUndefined();
  });
});
