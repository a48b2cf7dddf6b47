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
