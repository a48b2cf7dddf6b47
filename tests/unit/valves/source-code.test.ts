import { describe, expect, it } from "vitest";
import {
  lookupSourceCode,
  parseMakerRegistryCsv,
  splitJoinedCode,
  validateSourceCodeFormat,
  type MakerRegistryEntry,
} from "../../../lib/valves/source-code";

// Demo registry: invented makers with the invented demo codes of the demo seeder, marked demo.
const DEMO_REGISTRY: MakerRegistryEntry[] = [
  { code: "X17", makerName: "Aldergrove Electron Works", isDemo: true, notes: "demo" },
  { code: "X31", makerName: "Kestrel Valve Company", isDemo: true, notes: "demo" },
  { code: "X46", makerName: "Pellham Radio Tube Corp.", isDemo: true, notes: "demo" },
];

describe("validateSourceCodeFormat [EIA-476 registers: a registered three-digit number]", () => {
  it.each([
    ["X46", { ok: true, code: "X46" }],
    ["EIA X46", { ok: true, code: "X46", prefix: "EIA" }],
    ["rma-X46", { ok: true, code: "X46", prefix: "RMA" }],
    ["X46-5943", { ok: true, code: "X46", dateCode: "5943" }],
    ["EIA X46 943", { ok: true, code: "X46", prefix: "EIA", dateCode: "943" }],
  ])("accepts %j", (text, expected) => {
    expect(validateSourceCodeFormat(text)).toEqual(expected);
  });

  it.each([
    ["", /empty/],
    ["90", /exactly three digits, got 2/],
    ["EIA 9461", /exactly three digits, got 4/],
    ["9O6", /not a source code/],
    ["X46-59431", /not a source code/],
  ])("refuses %j", (text, reason) => {
    const result = validateSourceCodeFormat(text);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(reason);
  });

  it("splits the joined sss-YYWW form [CTP]", () => {
    expect(splitJoinedCode("X46-5943")).toEqual({ sourcePart: "X46", datePart: "5943" });
    expect(splitJoinedCode("5943")).toBeNull();
  });
});

describe("lookupSourceCode", () => {
  it("finds the registered holder and says the code is evidence, not proof [EIA-476: vendor assuming responsibility]", () => {
    const result = lookupSourceCode("EIA X46", DEMO_REGISTRY);
    if (!result.ok) throw new Error(result.reason);
    expect(result.found).toBe(true);
    expect(result.entries.map((e) => e.makerName)).toEqual(["Pellham Radio Tube Corp."]);
    expect(result.strength).toBe("evidence");
    expect(result.caveat).toMatch(/brand owner/);
    expect(result.demoOnly).toBe(true);
    expect(result.flags).toContain("demo-data");
  });

  it("reports unknown codes as not found, and malformed ones as errors", () => {
    const unknown = lookupSourceCode("X58", DEMO_REGISTRY);
    expect(unknown.ok && unknown.found).toBe(false);
    expect(lookupSourceCode("ABC", DEMO_REGISTRY).ok).toBe(false);
  });

  it("flags a code held by several registry entries", () => {
    const registry = [
      ...DEMO_REGISTRY,
      { code: "X46", makerName: "Vireo Lamp & Valve", isDemo: true, notes: "demo, later holder" },
    ];
    const result = lookupSourceCode("X46", registry);
    if (!result.ok) throw new Error(result.reason);
    expect(result.entries).toHaveLength(2);
    expect(result.flags).toContain("several-entries");
  });
});

describe("parseMakerRegistryCsv [RFC-4180 quoting]", () => {
  it("reads rows with quoted commas, doubled quotes and line breaks inside quotes", () => {
    const text = [
      "code,maker_name,is_demo,notes",
      'X17,Aldergrove Electron Works,true,"plain row"',
      'X31,"Kestrel Valve Company","yes","notes with a comma, and ""quotes"""',
      'X46,Pellham Radio Tube Corp.,TRUE,"two',
      'lines"',
      "X58,Vireo Lamp & Valve,false,",
    ].join("\r\n");
    const { rows, errors } = parseMakerRegistryCsv(text);
    expect(errors).toEqual([]);
    expect(rows.map((r) => r.code)).toEqual(["X17", "X31", "X46", "X58"]);
    expect(rows[1].notes).toBe('notes with a comma, and "quotes"');
    expect(rows[2].notes).toBe("two\r\nlines");
    expect(rows.map((r) => r.isDemo)).toEqual([true, true, true, false]);
  });

  it("accepts columns in any order and a byte-order mark", () => {
    const { rows, errors } = parseMakerRegistryCsv(
      "\uFEFFnotes,is_demo,maker_name,code\nx,true,Aldergrove Electron Works,EIA X17\n",
    );
    expect(errors).toEqual([]);
    expect(rows).toEqual([{ code: "X17", makerName: "Aldergrove Electron Works", isDemo: true, notes: "x" }]);
  });

  it("reports bad rows with the line they start on and keeps the good ones", () => {
    const text = [
      "code,maker_name,is_demo,notes", // line 1
      "X17,Aldergrove Electron Works,true,ok", // 2
      "90,Short Code Co,true,", // 3
      "X31,,true,", // 4
      "X46,Pellham Radio Tube Corp.,maybe,", // 5
      "X17,Duplicate Works,true,", // 6
      "X58,Too,Many,Fields,here", // 7
      '905,"Unclosed,true,', // 8
    ].join("\n");
    const { rows, errors } = parseMakerRegistryCsv(text);
    expect(rows.map((r) => r.code)).toEqual(["X17"]);
    const byLine = Object.fromEntries(errors.map((e) => [e.line, e.message]));
    expect(byLine[3]).toMatch(/three digits/);
    expect(byLine[4]).toMatch(/maker_name is required/);
    expect(byLine[5]).toMatch(/is_demo must be true or false/);
    expect(byLine[6]).toMatch(/already given on line 2/);
    expect(byLine[7]).toMatch(/expected 4 fields, found 5/);
    expect(byLine[8]).toMatch(/not closed/);
  });

  it("counts lines from the text itself, also after a CRLF inside quotes", () => {
    const text = [
      "code,maker_name,is_demo,notes", // line 1
      'X46,Pellham Radio Tube Corp.,true,"two', // 2
      'lines"', // 3
      "90,Short Code Co,true,", // 4
      '"X17"x,Aldergrove Electron Works,true,', // 5
    ].join("\r\n");
    const { rows, errors } = parseMakerRegistryCsv(text);
    expect(rows.map((r) => r.code)).toEqual(["X46"]);
    const sorted = [...errors].sort((a, b) => a.line - b.line);
    expect(sorted.map((e) => e.line)).toEqual([4, 5]);
    expect(sorted[0]!.message).toMatch(/three digits/);
    expect(sorted[1]!.message).toBe("text after the closing quote of a field");
  });

  it("requires the header columns", () => {
    const { rows, errors } = parseMakerRegistryCsv("code,maker\nX17,Aldergrove Electron Works\n");
    expect(rows).toEqual([]);
    expect(errors[0]).toEqual({ line: 1, message: "header lacks column(s): maker_name, is_demo, notes" });
  });

  it("refuses text after a closing quote", () => {
    const { rows, errors } = parseMakerRegistryCsv(
      'code,maker_name,is_demo,notes\n"X17"x,Aldergrove Electron Works,true,\n',
    );
    expect(rows).toEqual([]);
    expect(errors).toEqual([{ line: 2, message: "text after the closing quote of a field" }]);
  });
});
