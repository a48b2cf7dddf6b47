import { describe, expect, it } from "vitest";
import { csvTemplate, IMPORT_COLUMNS, parseLotCsv } from "@/lib/lots/csv-import";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// The CSV format is our own [SUG]; its rules are checked here, and the
// domain values on the rows (NOS/NIB, grades) follow [CTP].

describe("csvTemplate", () => {
  it("documents every column and parses cleanly", () => {
    const header = csvTemplate().split("\n")[0].split(",");
    expect(header).toEqual(IMPORT_COLUMNS.map((c) => c.name));
    expect(IMPORT_COLUMNS.filter((c) => c.required).map((c) => c.name)).toEqual(["designation"]);
    const r = parseLotCsv(SEED, csvTemplate());
    expect(r.errors).toEqual([]);
    expect(r.warnings).toEqual([]);
    expect(
      r.rows.map((x) => [
        x.line,
        x.item.designation.normalised,
        x.item.quantity,
        x.item.condition,
        x.item.readings.length,
      ]),
    ).toEqual([
      [2, "12AX7", 1, "new-old-stock", 1],
      [3, "EL84", 1, "used", 1],
      [4, "6V6GT", 12, "new-in-box", 0],
    ]);
    expect(r.rows[1].item.attributedMaker).toEqual({
      makerName: "Kestrel Valve Company",
      basis: "source-code-confirmed",
    });
    expect(r.rows[0].item.construction).toEqual({ plates: "grey box", getter: "halo top", micas: "3" });
  });
});

describe("parseLotCsv", () => {
  const FILE = [
    "Designation,QTY,notes,measure,section_1,chart_new",
    '12AX7,1,"first line',
    'second line, with a comma",gm,1200,1600',
    "EL84,abc,,,,",
    "",
    "6V6GT,1,,gm,4000,",
    "6ZZ99,2,,,,",
    "",
  ].join("\n");

  it("reports bad rows by the line they start on, after a quoted multi-line field", () => {
    const r = parseLotCsv(SEED, FILE);
    expect(r.errors).toEqual([
      { line: 4, column: "qty", message: expect.stringMatching(/"abc" is not a whole number/) },
      { line: 6, column: "chart_new", message: expect.stringMatching(/required with section readings/) },
    ]);
    expect(r.rows.map((x) => x.line)).toEqual([2, 7]);
    expect(r.rows[0].notes).toBe("first line second line, with a comma");
    expect(r.rows[0].item.readings[0]).toMatchObject({ sections: [1200], chartNewValue: 1600, measure: "gm" });
  });

  it("gives the same line numbers for CRLF files", () => {
    const r = parseLotCsv(SEED, FILE.replace(/\n/g, "\r\n"));
    expect(r.errors.map((e) => e.line)).toEqual([4, 6]);
    expect(r.rows.map((x) => x.line)).toEqual([2, 7]);
  });

  it("imports unknown designations with a warning, never an error [SUG]", () => {
    const r = parseLotCsv(SEED, FILE);
    expect(r.rows[1].item.designation).toMatchObject({ normalised: "6ZZ99", status: "unknown-flagged" });
    expect(r.warnings).toEqual([
      { line: 7, column: "designation", message: expect.stringMatching(/flagged for review/) },
    ]);
  });

  it("refuses a 100,000-row file with one clear file-level error, unparsed", () => {
    const big = `designation\n${"12AX7\n".repeat(100_000)}`;
    const r = parseLotCsv(SEED, big);
    expect(r.errors).toEqual([
      {
        line: 0,
        message: "The file has more than 5,000 data rows. Split it into files of at most 5,000 rows and import each.",
      },
    ]);
    expect(r.rows).toEqual([]);
    expect(r.fingerprint).toBeNull();
  });

  it("refuses a file over the byte limit", () => {
    const r = parseLotCsv(SEED, `designation,notes\n12AX7,${"x".repeat(3 * 1024 * 1024)}\n`);
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0].message).toMatch(/larger than 2,097,152 bytes/);
    expect(parseLotCsv(SEED, "designation\n12AX7\n", { maxBytes: 10 }).errors[0].message).toMatch(
      /larger than 10 bytes/,
    );
  });

  it("counts records, not lines: line breaks inside quotes do not count as rows", () => {
    const row = '12AX7,"a\nb\nc\nd"';
    const three = `designation,notes\n${[row, row, row].join("\n")}\n`;
    expect(parseLotCsv(SEED, three, { maxRows: 3 }).errors).toEqual([]);
    expect(parseLotCsv(SEED, `${three}${row}\n`, { maxRows: 3 }).errors[0]).toMatchObject({
      line: 0,
      message: expect.stringMatching(/more than 3 data rows/),
    });
  });

  it("gives the same fingerprint and row keys for the same file, and distinct keys for duplicate rows", () => {
    const file = "designation,qty,condition\n12AX7,4,used\n12AX7,4,used\nEL34,2,nos\n";
    const a = parseLotCsv(SEED, file);
    const b = parseLotCsv(SEED, file);
    expect(a.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    expect(b.fingerprint).toBe(a.fingerprint);
    expect(b.rowKeys).toEqual(a.rowKeys);
    expect(new Set(a.rowKeys).size).toBe(3);
    expect(parseLotCsv(SEED, file.replace("EL34,2", "EL34,3")).fingerprint).not.toBe(a.fingerprint);
  });

  it("ignores column order and whitespace-only edits; row order changes the fingerprint but not the keys", () => {
    const a = parseLotCsv(SEED, 'designation,qty,notes\n12AX7,4,"boxed, clean"\nEL34,2,\n');
    const reordered = parseLotCsv(
      SEED,
      '  Notes , QTY,designation\r\n"  boxed,   clean ", 4 ,12AX7\r\n\r\n,2,EL34\r\n',
    );
    expect(reordered.errors).toEqual([]);
    expect(reordered.fingerprint).toBe(a.fingerprint);
    expect(reordered.rowKeys).toEqual(a.rowKeys);
    const swapped = parseLotCsv(SEED, 'designation,qty,notes\nEL34,2,\n12AX7,4,"boxed, clean"\n');
    expect(swapped.fingerprint).not.toBe(a.fingerprint);
    expect([...swapped.rowKeys].sort()).toEqual([...a.rowKeys].sort());
  });

  it("reports unknown columns and refuses a header without designation", () => {
    const r = parseLotCsv(SEED, "designation,colour\n12AX7,blue\n");
    expect(r.unknownColumns).toEqual(["colour"]);
    expect(r.warnings).toEqual([{ line: 1, column: "colour", message: 'unknown column "colour" ignored' }]);
    expect(r.rows).toHaveLength(1);
    expect(parseLotCsv(SEED, "type,qty\n12AX7,1\n").errors).toEqual([
      { line: 1, column: "designation", message: "the header has no designation column" },
    ]);
    expect(parseLotCsv(SEED, "").errors[0]).toMatchObject({ line: 0, message: expect.stringMatching(/header row/) });
  });

  it("rejects bad enums, numbers and measure mismatches on the right columns", () => {
    const rows = [
      "designation,qty,condition,maker,maker_basis,source_code,measure,section_1,section_2,chart_new,plate_current_ma,short,hazards",
      "12AX7,1,mint,,,,,,,,,,", // 2: unknown condition
      "12AX7,1,used,,confirmed,,,,,,,,", // 3: confirmed without maker or source code
      "EL84,1,used,,,,emission,80,,100,40,,", // 4: plate current on an emission run
      "12AX7,1,used,,,,gm,,1500,1600,,,", // 5: section_2 without section_1
      "12AX7,3,used,,,,gm,1500,1500,1600,,,", // 6: readings with qty 3
      "12AX7,1,used,,,,,1500,1500,1600,,,", // 7: readings without measure
      "12AX7,1,used,,,,gm,1,200,,1600,,,", // 8: one field too many (an unquoted "1,200")
      "12AX7,1,used,,,,,,,,,maybe,", // 9: not yes/no
      "83,1,used,,,,,,,,,,asbestos", // 10: unknown hazard
      "12AX7,1,used,,,,volts,1500,,1600,,,", // 11: unknown measure
      "12AX7,1,used,,,,gm,-5,,1600,,,", // 12: negative reading
      "83,1,used,,,,,,,,,,mercury-vapour; Radioactive", // 13: fine
      "12AX7,1,used,,,,gm,,,,,yes,", // 14: fine: a short with no readings is a tested, rejected tube
    ].join("\n");
    const r = parseLotCsv(SEED, rows);
    const at = (line: number) => r.errors.filter((e) => e.line === line).map((e) => e.column);
    expect(at(2)).toEqual(["condition"]);
    expect(at(3)).toEqual(["maker_basis", "maker_basis"]);
    expect(at(4)).toEqual(["plate_current_ma"]);
    expect(at(5)).toEqual(["section_2"]);
    expect(at(6)).toEqual(["qty"]);
    expect(at(7)).toEqual(["measure"]);
    expect(r.errors.find((e) => e.line === 8)?.message).toMatch(/expected 13 fields/);
    expect(at(9)).toEqual(["short"]);
    expect(at(10)).toEqual(["hazards"]);
    expect(at(11)).toEqual(["measure"]);
    expect(at(12)).toEqual(["section_1"]);
    expect(r.rows.map((x) => x.line)).toEqual([13, 14]);
    expect(r.rows[0].item.hazards).toEqual(["mercury-vapour", "radioactive"]);
    expect(r.rows[1].item.readings).toEqual([
      { tubeNo: 1, sections: [], measure: "gm", shorts: true, leakage: false, gas: false },
    ]);
  });

  it("refuses malformed CSV with the line where reading stopped", () => {
    const r = parseLotCsv(SEED, 'designation,notes\n12AX7,ok\nEL34,"never closed\n6V6GT,fine\n');
    expect(r.rows).toEqual([]);
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({
      line: 0,
      message: expect.stringMatching(/not valid CSV near line \d+: a quoted field is never closed/),
    });
  });
});

describe("parseLotCsv construction features", () => {
  it("reads name=value pairs, lower-casing names, and rejects pairs without a value", () => {
    const r = parseLotCsv(
      SEED,
      'designation,construction\n12AX7,"Plates = grey box;getter=halo top; constructor=two micas"\n12AX7,plates\n',
    );
    expect(r.rows[0].item.construction).toEqual({ plates: "grey box", getter: "halo top", constructor: "two micas" });
    expect(r.errors).toEqual([{ line: 3, column: "construction", message: '"plates" is not name=value' }]);
  });
});
