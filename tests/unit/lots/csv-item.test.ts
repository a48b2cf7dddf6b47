// Check values: [SUG] our own CSV format and item form; column sizes from our migrations (lot_items).
import { describe, expect, it } from "vitest";
import { columnOfPath } from "@/lib/lots/csv-item";
import { parseLotCsv } from "@/lib/lots/csv-import";
import { COLUMN_LENGTHS } from "@/lib/validation/columns";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();
const csv = (header: string, ...rows: string[]) => [header, ...rows].join("\n");

describe("a lot CSV row is checked by the item form's schema", () => {
  it("refuses a label longer than the column and names the CSV column", () => {
    const r = parseLotCsv(SEED, csv("designation,label", `12AX7,${"L".repeat(150)}`));
    expect(r.rows).toEqual([]);
    expect(r.errors).toEqual([
      { line: 2, column: "label", message: `is 150 characters long; at most ${COLUMN_LENGTHS.lot_items.label_brand}` },
    ]);
  });

  it("refuses a source code longer than the column (16)", () => {
    const r = parseLotCsv(SEED, csv("designation,source_code", `12AX7,${"1".repeat(27)}`));
    expect(r.rows).toEqual([]);
    expect(r.errors).toEqual([{ line: 2, column: "source_code", message: "is 27 characters long; at most 16" }]);
  });

  it("refuses a designation longer than the column instead of cutting it short", () => {
    const long = `12AX7${"X".repeat(40)}`; // 45 characters
    const r = parseLotCsv(SEED, csv("designation,qty", `${long},2`, "12AX7,1"));
    expect(r.rows.map((x) => x.input.designation)).toEqual(["12AX7"]);
    expect(r.errors).toEqual([{ line: 2, column: "designation", message: "is 45 characters long; at most 40" }]);
  });

  it("refuses notes that with the tube reference go past the column, rather than trimming them", () => {
    const notes = "n".repeat(COLUMN_LENGTHS.lot_items.notes - 5);
    const ok = parseLotCsv(SEED, csv("designation,notes", `12AX7,${notes}`));
    expect(ok.errors).toEqual([]);
    expect(ok.rows[0]!.input.notes).toBe(notes);
    const r = parseLotCsv(SEED, csv("designation,tube_ref,notes", `12AX7,T-0042,${notes}`));
    expect(r.rows).toEqual([]);
    expect(r.errors[0]).toMatchObject({ line: 2, column: "notes" });
    expect(r.errors[0]!.message).toMatch(/at most 1000/);
  });

  it("gives a good row the values the form would send", () => {
    const r = parseLotCsv(
      SEED,
      csv(
        "designation,qty,label,maker,maker_basis,other_code",
        "6v6gt,4,Kestrel,Kestrel Valve Company,construction,K7",
      ),
    );
    expect(r.errors).toEqual([]);
    expect(r.rows[0]!.input).toMatchObject({
      designation: "6v6gt",
      quantity: 4,
      labelBrand: "Kestrel",
      makerName: "Kestrel Valve Company",
      makerBasis: "construction-matched",
      features: { otherCode: "K7" },
      notes: "",
    });
  });

  it("maps the form's field paths back to CSV columns", () => {
    expect(columnOfPath(["labelBrand"])).toBe("label");
    expect(columnOfPath(["quantity"])).toBe("qty");
    expect(columnOfPath(["readings", 0, "sections", 1])).toBe("section_2");
    expect(columnOfPath(["readings", 0, "chartNewValue"])).toBe("chart_new");
    expect(columnOfPath(["features", "otherCode"])).toBe("other_code");
    expect(columnOfPath(["features", "getter"])).toBe("construction");
  });
});
