import { describe, expect, it } from "vitest";
import { hasIsoWeek53, readDateCode } from "../../../lib/valves/date-code";
import { parseEuropeanDateLine } from "../../../lib/valves/date-line-eu";

// 12AX7 introduced September 1947 [MEM, secondary histories].
const TWELVE_AX7 = { introducedYear: 1947 };

function years(result: ReturnType<typeof readDateCode>): number[] {
  if (!result.ok) throw new Error(result.error.message);
  return result.readings.map((r) => r.year);
}

describe("readDateCode: four digits (YYWW)", () => {
  it("5943 → 1959, week 43 [EIA-476]", () => {
    const result = readDateCode("5943");
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.readings).toHaveLength(1);
    expect(result.readings[0]).toMatchObject({ year: 1959, week: 43, form: "YYWW", rank: 1 });
    expect(result.flags).not.toContain("ambiguous-decade");
  });

  it("7749 → 1977 week 49; week-first is impossible, there is no week 77 [CTP]", () => {
    const result = readDateCode("7749");
    if (!result.ok) throw new Error("expected a reading");
    expect(result.readings.map((r) => [r.year, r.week, r.form])).toEqual([[1977, 49, "YYWW"]]);
    const weekFirst = result.rejected.find((r) => r.reading.form === "WWYY");
    expect(weekFirst?.reason).toMatch(/week 77 cannot exist/);
  });

  it.each(["5800", "5854"])("%s → invalid week [CTP]", (code) => {
    const result = readDateCode(code);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error.code).toBe("invalid-week");
  });

  it("4312 on a 12AX7 (introduced 1947) is flagged, not hidden [CTP]", () => {
    const result = readDateCode("4312", TWELVE_AX7);
    if (!result.ok) throw new Error("expected a reading");
    expect(result.flags).toContain("predates-type");
    expect(result.readings[0]).toMatchObject({ year: 1943, week: 12 });
    expect(result.readings[0].reasons.join(" ")).toMatch(/before the type was introduced \(1947\)/);
  });

  it("reads the date out of a joined source code sss-YYWW [CTP]", () => {
    const result = readDateCode("X46-5943", TWELVE_AX7);
    if (!result.ok) throw new Error("expected a reading");
    expect(result.sourceCode).toBe("X46");
    expect(result.flags).toContain("joined-source-code");
    expect(years(result)).toEqual([1959]);
  });

  it("week 53 is accepted and checked against the ISO 8601 calendar [EIA-476: occasionally 53; ISO 8601 Thursday rule]", () => {
    const result = readDateCode("5953");
    if (!result.ok) throw new Error("expected a reading");
    expect(result.flags).toContain("week-53");
    expect(result.readings[0].reasons.join(" ")).toMatch(/1959 has ISO week 53/);
    // ISO 8601: years starting on a Thursday (2015, 2020 leap from Wednesday) have 53 weeks.
    expect([2015, 2020, 2026].map(hasIsoWeek53)).toEqual([true, true, true]);
    expect([2019, 2021, 2023].map(hasIsoWeek53)).toEqual([false, false, false]);
  });

  it("reads week-first only on request, and only when the year is plausible", () => {
    const off = readDateCode("1252", TWELVE_AX7);
    if (!off.ok) throw new Error("expected a reading");
    expect(off.readings.map((r) => r.form)).toEqual(["YYWW"]);
    const on = readDateCode("1252", { ...TWELVE_AX7, considerWeekFirst: true });
    if (!on.ok) throw new Error("expected a reading");
    expect(on.readings.map((r) => [r.form, r.year, r.week])).toContainEqual(["WWYY", 1952, 12]);
    // The literal 1912 reading predates the type, so the week-first reading ranks first.
    expect(on.readings[0].form).toBe("WWYY");
  });
});

describe("readDateCode: three digits (YWW)", () => {
  it("digit 9 on a 12AX7, production to 1985 → 1949, 1959, 1969, 1979, never 1939 [CTP; MEM]", () => {
    const result = readDateCode("912", { ...TWELVE_AX7, endOfProductionYear: 1985 });
    if (!result.ok) throw new Error("expected a reading");
    expect(years(result)).toEqual([1949, 1959, 1969, 1979]);
    expect(result.flags).toContain("ambiguous-decade");
    const dropped = result.rejected.map((r) => r.reading.year);
    expect(dropped).toContain(1939);
    expect(dropped).toContain(1989);
  });

  it("never silently picks one decade: every reading carries reasons, ties say how they were ordered [SUG]", () => {
    const result = readDateCode("912", { ...TWELVE_AX7, endOfProductionYear: 1985 });
    if (!result.ok) throw new Error("expected a reading");
    expect(result.readings.map((r) => r.rank)).toEqual([1, 2, 3, 4]);
    for (const reading of result.readings) expect(reading.reasons.join(" ")).toMatch(/tied on evidence/);
  });

  it("drops decades before a GT envelope existed (late 1930s) for a 6SN7GT [MEM;]", () => {
    // 6SN7 introduced 1939 [MEM]; take a lower bound of 1930 to show the suffix rule acting alone.
    const noSuffix = readDateCode("712", { introducedYear: 1930, endOfProductionYear: 1960 });
    const withSuffix = readDateCode("712", { introducedYear: 1930, envelopeSuffix: "GT", endOfProductionYear: 1960 });
    expect(years(noSuffix)).toEqual([1937, 1947, 1957]);
    expect(years(withSuffix)).toEqual([1947, 1957]);
    if (withSuffix.ok) expect(withSuffix.rejected.find((r) => r.reading.year === 1937)?.reason).toMatch(/GT envelope/);
  });

  it("outside era evidence ranks or rules out decades", () => {
    const favoured = readDateCode("512", {
      ...TWELVE_AX7,
      eraEvidence: [{ earliest: 1960, latest: 1969, source: "box style" }],
    });
    expect(years(favoured)[0]).toBe(1965);
    const ruled = readDateCode("512", {
      ...TWELVE_AX7,
      eraEvidence: [{ latest: 1959, source: "shouldered bulb", rulesOut: true }],
    });
    expect(years(ruled)).toEqual([1955]);
  });

  it("warns that three digits may be a source code instead", () => {
    // [CTP] a bare three-digit number on the glass may be a source code rather than a YWW date
    const result = readDateCode("943", TWELVE_AX7);
    if (!result.ok) throw new Error("expected a reading");
    expect(result.flags).toContain("may-be-source-code");
  });
});

describe("readDateCode: not a date code", () => {
  it.each([
    ["", "empty"],
    ["59A3", "not-digits"],
    ["59431", "wrong-length"],
    ["12", "wrong-length"],
    ["900", "invalid-week"],
    ["955", "invalid-week"],
  ])("%j → %s", (code, error) => {
    const result = readDateCode(code);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.code).toBe(error);
  });
});

describe("parseEuropeanDateLine [CTP/MEM: factory symbol + year digit + month letter + week digit]", () => {
  it('splits factory symbol, year digit, month letter and week digit ("¤" is an invented factory symbol)', () => {
    const result = parseEuropeanDateLine("¤7C2", { introducedYear: 1953 });
    if (!result.ok) throw new Error(result.error.message);
    expect(result).toMatchObject({ factorySymbol: "¤", yearDigit: 7, monthLetter: "C", weekDigit: 2 });
    // EL84 introduced 1953 [MEM]; house end of production 1990 by default.
    expect(result.readings.map((r) => [r.year, r.month])).toEqual([
      [1957, 3],
      [1967, 3],
      [1977, 3],
      [1987, 3],
    ]);
    expect(result.flags).toContain("ambiguous-decade");
  });

  it("A–L = January–December in one scheme; a scheme skipping I moves J–L by one [CTP/MEM]", () => {
    const plain = parseEuropeanDateLine("X5L", { introducedYear: 1950, endOfProductionYear: 1959 });
    if (!plain.ok) throw new Error("expected a reading");
    expect(plain.readings.map((r) => r.month)).toEqual([12]);
    const both = parseEuropeanDateLine("X5K", {
      introducedYear: 1950,
      endOfProductionYear: 1959,
      schemes: ["A-L", "skip-I"],
    });
    if (!both.ok) throw new Error("expected a reading");
    expect(both.readings.map((r) => [r.month, r.scheme])).toEqual([
      [11, "A-L"],
      [10, "skip-I"],
    ]);
    expect(both.flags).toContain("month-scheme-ambiguous");
    const sameMonth = parseEuropeanDateLine("X5C", {
      introducedYear: 1950,
      endOfProductionYear: 1959,
      schemes: ["A-L", "skip-I"],
    });
    if (sameMonth.ok) expect(sameMonth.readings).toHaveLength(1);
  });

  it("refuses lines without a month letter, and M in the A–L scheme", () => {
    const noLetter = parseEuropeanDateLine("X57");
    expect(noLetter.ok).toBe(false);
    const m = parseEuropeanDateLine("X5M");
    expect(m.ok).toBe(false);
    if (!m.ok) expect(m.error.code).toBe("not-a-month-letter");
    expect(parseEuropeanDateLine("X5M", { schemes: ["skip-I"] }).ok).toBe(true);
  });
});
