// The house's reference CSV: our own columns; quoting as RFC 4180 [RFC-4180].
import { describe, expect, it } from "vitest";
import { parseReferenceCsv, referenceCsv } from "@/lib/valves/reference-csv";
import { SEED_REFERENCE_TYPES } from "@/lib/valves/seed";

const strip = (r: (typeof SEED_REFERENCE_TYPES)[number]) => {
  const { hazards: _h, introduced: _i, largeEnvelope: _l, ...rest } = r;
  const c = rest.characteristics;
  if (c?.kind !== "amplifier") {
    const { characteristics: _c, ...noC } = rest;
    return noC;
  }
  const { cathodeResistorOhms: _rk, approximate: _a, ...amp } = c;
  return { ...rest, characteristics: amp };
};

describe("reference CSV", () => {
  it("reads back what it writes, for every seed row (hazards and extras aside)", () => {
    const { rows, errors } = parseReferenceCsv(referenceCsv(SEED_REFERENCE_TYPES));
    expect(errors).toEqual([]);
    expect(rows).toHaveLength(SEED_REFERENCE_TYPES.length);
    rows.forEach(({ row }, i) => expect(strip(row)).toEqual(strip(SEED_REFERENCE_TYPES[i]!)));
  });

  it("reports every bad line by number and returns no rows", () => {
    const csv = [
      "designation,kind,base,heater_volts,heater_amps,source",
      "6AU6,pentode,miniature-7-pin,6.3,0.3,REG MEM",
      "6AU6X,pentode,nowhere,6.3,0.3,REG MEM", // 3: base
      "6BA6,pentode,miniature-7-pin,6.3,,REG MEM", // 4: heater half given
      "6BE6,pentagrid-converter,miniature-7-pin,6.3,0.3,HANDBOOK", // 5: unknown source tag
      "6au6,pentode,miniature-7-pin,6.3,0.3,REG MEM", // 6: repeats line 2 after normalising
    ].join("\n");
    const { rows, errors } = parseReferenceCsv(csv);
    expect(rows).toEqual([]);
    expect(errors.map((e) => e.line)).toEqual([3, 4, 5, 6]);
  });

  it("refuses unknown and missing columns on line 1", () => {
    expect(parseReferenceCsv("designation,kind,colour\n6AU6,pentode,red\n").errors.map((e) => e.line)).toEqual([
      1, 1, 1,
    ]);
  });
});

// The valve_types columns (migrations/20261201000200-valve-knowledge.ts, COLUMN_LENGTHS): designation and each
// alias at most 32 characters. Refusing a longer value by line and column, not cutting it short, is [SUG].
describe("reference CSV against the table's column sizes", () => {
  const header = "designation,aliases,kind,base,heater_volts,heater_amps,source";
  const line = (designation: string, aliases = "") =>
    `${designation},${aliases},pentode,miniature-7-pin,6.3,0.3,REG MEM`;

  it("refuses a designation of 33 characters on its line, naming the column and the limit of 32", () => {
    const long = "6AU6" + "X".repeat(29); // 33 characters
    const { rows, errors } = parseReferenceCsv([header, line("6BA6"), line(long)].join("\n"));
    expect(rows).toEqual([]);
    expect(errors).toEqual([{ line: 3, column: "designation", message: expect.stringContaining("32 characters") }]);
  });

  it("refuses an alias of 33 characters by the aliases column, and keeps a 6AU6 with a short alias", () => {
    const long = "6AU6" + "W".repeat(29);
    const bad = parseReferenceCsv([header, line("6AU6", `6AU6W;${long}`)].join("\n"));
    expect(bad.rows).toEqual([]);
    expect(bad.errors).toEqual([
      {
        line: 2,
        column: "aliases",
        message: `"${long}" is longer than 32 characters (the reference table holds at most 32)`,
      },
    ]);
    const good = parseReferenceCsv([header, line("6AU6", "6AU6W")].join("\n"));
    expect(good.errors).toEqual([]);
    expect(good.rows[0]?.row.aliases).toEqual(["6AU6W"]);
  });
});
