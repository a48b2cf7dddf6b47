// Check values: [SUG] our own quick-entry format for tester readings (lib/disputes/readings-text.ts):
// one tube per line or ";"-separated, the tube number first, section values separated by "/" or
// spaces, at most 4 sections, the words short / leak(age) / gas for failed checks.
// [CTP]: a tube is tested for shorts, leakage and gas, then Gm per section
// (a dual triode has two sections); readings are in the tester's own unit (µmho on most
// charts; 1 mA/V = 1,000 µmho [EU-DS]). Figures below are invented readings
// around the 12AX7 chart value of 1,600 used in.
import { describe, expect, it } from "vitest";
import { parseReadingsText, readingsToText } from "@/lib/disputes/readings-text";
import type { TubeReading } from "@/lib/lots/item";

describe("parseReadingsText: tube numbers and sections [SUG]", () => {
  it("'N: a/b' → tube N, one Gm value per section, no chart value of its own", () => {
    const { readings, problems } = parseReadingsText("1: 1600/1550", 8);
    expect(problems).toEqual([]);
    expect(readings).toEqual([{ tubeNo: 1, measure: "gm", sections: [1_600, 1_550] }]);
    expect(readings[0]).not.toHaveProperty("chartNewValue"); // the chart comes from the listing's line
  });

  it("sections separated by spaces instead of '/', and the tube number without a colon", () => {
    expect(parseReadingsText("2 1480 1500", 8).readings).toEqual([
      { tubeNo: 2, measure: "gm", sections: [1_480, 1_500] },
    ]);
    expect(parseReadingsText("2: 1480 / 1500", 8).readings[0].sections).toEqual([1_480, 1_500]);
  });

  it("other ways of writing the tube number: 'tube 3 =', '4)', '5.', '6-', '7:' with no space", () => {
    const { readings, problems } = parseReadingsText("tube 3 = 1520\n4) 1510\n5. 1505\n6- 1490\n7:1480", 8);
    expect(problems).toEqual([]);
    expect(readings.map((r) => [r.tubeNo, r.sections])).toEqual([
      [3, [1_520]],
      [4, [1_510]],
      [5, [1_505]],
      [6, [1_490]],
      [7, [1_480]],
    ]);
  });

  it("decimal values are kept (mA/V charts) [EU-DS]: 1 mA/V = 1,000 µmho", () => {
    expect(parseReadingsText("1: 1.6/1.55", 8).readings[0].sections).toEqual([1.6, 1.55]);
  });

  it("up to 4 sections per tube; a fifth → a problem and the tube is left out", () => {
    expect(parseReadingsText("1: 1500 1510 1520 1530", 8).readings[0].sections).toEqual([1_500, 1_510, 1_520, 1_530]);
    const five = parseReadingsText("1: 1500 1510 1520 1530 1540; 2: 1600", 8);
    expect(five.problems).toEqual(["tube 1: at most 4 sections"]);
    expect(five.readings.map((r) => r.tubeNo)).toEqual([2]);
  });
});

describe("parseReadingsText: separators between tubes [SUG]", () => {
  const expected: TubeReading[] = [
    { tubeNo: 1, measure: "gm", sections: [1_600, 1_550] },
    { tubeNo: 2, measure: "gm", sections: [1_480, 1_500] },
    { tubeNo: 3, measure: "gm", sections: [1_700] },
  ];

  it("';' or newline, mixed, give the same readings", () => {
    expect(parseReadingsText("1: 1600/1550; 2: 1480/1500; 3: 1700", 8).readings).toEqual(expected);
    expect(parseReadingsText("1: 1600/1550\n2: 1480/1500\n3: 1700", 8).readings).toEqual(expected);
    expect(parseReadingsText("1: 1600/1550;\n2: 1480/1500\n3: 1700;", 8).readings).toEqual(expected);
  });

  it("Windows line ends, blank lines and stray separators are ignored", () => {
    const { readings, problems } = parseReadingsText("\r\n1: 1600/1550\r\n\r\n2: 1480/1500 ;; \n  3: 1700  \r\n", 8);
    expect(problems).toEqual([]);
    expect(readings).toEqual(expected);
  });

  it("empty or blank text → no readings and no problems", () => {
    expect(parseReadingsText("", 8)).toEqual({ readings: [], problems: [] });
    expect(parseReadingsText("  ;\n ; ", 8)).toEqual({ readings: [], problems: [] });
  });

  it("readings keep the order typed, not tube order", () => {
    expect(parseReadingsText("3: 1700; 1: 1600", 8).readings.map((r) => r.tubeNo)).toEqual([3, 1]);
  });
});

describe("parseReadingsText: failed checks as words [CTP] shorts, leakage, gas", () => {
  it("'gas', 'short', 'leakage' alone → a reading with that failure and no sections", () => {
    const { readings, problems } = parseReadingsText("3: gas; 4: short; 5: leakage", 8);
    expect(problems).toEqual([]);
    expect(readings).toEqual([
      { tubeNo: 3, measure: "gm", sections: [], gas: true },
      { tubeNo: 4, measure: "gm", sections: [], shorts: true },
      { tubeNo: 5, measure: "gm", sections: [], leakage: true },
    ]);
  });

  it("word forms: 'leak', 'shorted', 'Shorts', upper case", () => {
    const { readings } = parseReadingsText("1: leak\n2: shorted\n3: Shorts\n4: GAS", 8);
    expect(readings.map((r) => [r.tubeNo, Boolean(r.leakage), Boolean(r.shorts), Boolean(r.gas)])).toEqual([
      [1, true, false, false],
      [2, false, true, false],
      [3, false, true, false],
      [4, false, false, true],
    ]);
  });

  it("values and words together: the sections are kept beside the failures", () => {
    expect(parseReadingsText("6: 1200/1250 short, gas", 8).readings).toEqual([
      { tubeNo: 6, measure: "gm", sections: [1_200, 1_250], shorts: true, gas: true },
    ]);
  });

  it("a clean reading carries no failure flags at all (not even false ones)", () => {
    const [r] = parseReadingsText("1: 1600", 8).readings;
    expect(Object.keys(r).sort()).toEqual(["measure", "sections", "tubeNo"]);
  });
});

describe("parseReadingsText: problems reported, the rest still read [SUG]", () => {
  it("a tube given twice → the first kept, a problem for the second", () => {
    const { readings, problems } = parseReadingsText("1: 1600; 2: 1500; 1: 900", 8);
    expect(readings).toEqual([
      { tubeNo: 1, measure: "gm", sections: [1_600] },
      { tubeNo: 2, measure: "gm", sections: [1_500] },
    ]);
    expect(problems).toEqual(["tube 1 is given twice"]);
  });

  it("a tube number outside 1..maxTube → a problem naming the range; the line's last tube is fine", () => {
    const { readings, problems } = parseReadingsText("0: 1600; 9: 1600; 8: 1550", 8);
    expect(readings.map((r) => r.tubeNo)).toEqual([8]);
    expect(problems).toEqual(["tube 0: this line has tubes 1–8", "tube 9: this line has tubes 1–8"]);
    expect(parseReadingsText("2: 1600", 1).problems).toEqual(["tube 2: this line has tubes 1–1"]);
  });

  it("an out-of-range tube is not remembered: repeating it gives the range problem again, not 'given twice'", () => {
    // 9 is refused for maxTube 8 and not remembered, so no 'given twice' follows.
    expect(parseReadingsText("9: 1600; 9: 1500", 8).problems).toEqual([
      "tube 9: this line has tubes 1–8",
      "tube 9: this line has tubes 1–8",
    ]);
  });

  it("a tube with no value and no failure word → 'no reading'", () => {
    expect(parseReadingsText("2:", 8)).toEqual({ readings: [], problems: ["tube 2: no reading"] });
    expect(parseReadingsText("3: fine", 8)).toEqual({ readings: [], problems: ["tube 3: no reading"] });
  });

  it("a line not starting with a tube number → a problem quoting its start", () => {
    const { readings, problems } = parseReadingsText("gas; 1: 1600", 8);
    expect(readings.map((r) => r.tubeNo)).toEqual([1]);
    expect(problems).toEqual(['"gas": start with the tube number']);
    const long = parseReadingsText("about sixteen hundred on both sections", 8).problems[0];
    expect(long).toBe('"about sixteen hundred on both ": start with the tube number'); // first 30 characters
  });
});

describe("readingsToText: the readings back as text, and the round trip [SUG]", () => {
  const readings: TubeReading[] = [
    { tubeNo: 1, measure: "gm", sections: [1_600, 1_550] },
    { tubeNo: 2, measure: "gm", sections: [1_400], shorts: true, gas: true },
    { tubeNo: 3, measure: "gm", sections: [], leakage: true },
    { tubeNo: 5, measure: "gm", sections: [1.6, 1.55] },
  ];

  it("'N: a/b words', joined with '; '", () => {
    expect(readingsToText(readings)).toBe("1: 1600/1550; 2: 1400 short gas; 3: leakage; 5: 1.6/1.55");
    expect(readingsToText([])).toBe("");
  });

  it("parse(toText(r)) gives the same readings back, with no problems", () => {
    expect(parseReadingsText(readingsToText(readings), 8)).toEqual({ readings, problems: [] });
  });

  it("text typed loosely comes back in the one written form, which parses to the same readings", () => {
    const typed = "tube 1 = 1600 1550\n2) gas 1400 shorted\n3: leak";
    const first = parseReadingsText(typed, 8);
    const written = readingsToText(first.readings);
    expect(written).toBe("1: 1600/1550; 2: 1400 short gas; 3: leakage");
    expect(parseReadingsText(written, 8)).toEqual(first);
  });
});
