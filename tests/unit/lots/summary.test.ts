import { describe, expect, it } from "vitest";
import { describeDesignation, type LotItem, type TubeReading } from "@/lib/lots/item";
import { readingsVsNominal, summariseLot, type ComparableSale } from "@/lib/lots/summary";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// A small hand-built lot with worked numbers. Grade bands [CTP]:
// ≥100 % strong, 80–99 % good, 60–79 % fair; any short → reject.

function item(designation: string, quantity: number, extra: Partial<LotItem> = {}): LotItem {
  return {
    designation: describeDesignation(SEED, designation),
    quantity,
    labelBrand: null,
    attributedMaker: { makerName: null, basis: "unconfirmed" },
    codes: {},
    construction: {},
    condition: "used",
    vacuumLoss: false,
    defects: [],
    hazards: [],
    readings: [],
    ...extra,
  };
}
const gm = (tubeNo: number, sections: number[], extra: Partial<TubeReading> = {}): TubeReading => ({
  tubeNo,
  sections,
  measure: "gm",
  ...extra,
});
const confirmed = { makerName: "Kestrel Valve Company", basis: "source-code-confirmed" as const };
const byConstruction = { makerName: "Aldergrove Electron Works", basis: "construction-matched" as const };

const LOT: LotItem[] = [
  // 0: two 12AX7s; chart "new" 1600 on the reading. 1200/1600 = 75 % → fair [CTP]; 1650/1600 → strong.
  item("12AX7", 2, {
    attributedMaker: byConstruction,
    readings: [gm(1, [1200, 1200], { chartNewValue: 1600 }), gm(2, [1700, 1650], { chartNewValue: 1600 })],
  }),
  // 1: an ECC83 with a short and no chart value → reject regardless of reading [CTP].
  item("ECC83", 1, { attributedMaker: confirmed, readings: [gm(1, [1600, 1600], { shorts: true })] }),
  // 2: a 12AX7 with a white getter, untested: vacuum loss [CTP].
  item("12AX7", 1, { vacuumLoss: true }),
  // 3: four EL34s and (4) one 6CA7, chart from the lot's values (el34: 11000).
  item("EL34", 4, {
    attributedMaker: confirmed,
    readings: [gm(1, [10000]), gm(2, [10300]), gm(3, [10400]), gm(4, [12000])],
  }),
  item("6CA7", 1, { readings: [gm(1, [10500])] }),
  // 5: an 83, untested: mercury-vapour rectifier [MEM].
  item("83", 1),
  // 6: three of an unknown type, declared radioactive by the consignor.
  item("6ZZ99", 3, { hazards: ["radioactive"] }),
  // 7: a 7025 tested with no chart value anywhere: tested, not graded.
  item("7025", 1, { condition: "new-old-stock", readings: [gm(1, [1500, 1500])] }),
];
const OPTS = { reference: SEED, chartNewValues: { el34: 11000 }, comparables: [] as ComparableSale[] };

describe("summariseLot", () => {
  const s = summariseLot(LOT, OPTS);

  it("counts tubes and families", () => {
    expect(s.tubeCount).toBe(14); // 2 + 1 + 1 + 4 + 1 + 1 + 3 + 1
    expect(s.families.map((f) => [f.key, f.tubes])).toEqual([
      ["12AX7", 5], // 12AX7, ECC83, 7025 [MEM equivalents]
      ["EL34", 5], // EL34 and 6CA7 [MEM]
      ["6ZZ99", 3],
      ["83", 1],
    ]);
    expect(s.families[0].designations).toEqual(["12AX7", "ECC83", "7025"]);
  });

  it("grades readings per family: fair, strong, reject, tested-not-graded", () => {
    const ax7 = s.families.find((f) => f.key === "12AX7")!.tests;
    expect(ax7).toMatchObject({ tested: 4, notTested: 1, fair: 1, strong: 1, reject: 1, testedNotGraded: 1 });
    const el34 = s.families.find((f) => f.key === "EL34")!.tests;
    // 10000/11000 = 90.9 %, 10300 → 93.6 %, 10400 → 94.5 %, 10500 → 95.5 % good; 12000 → 109 % strong [CTP]
    expect(el34).toMatchObject({ tested: 5, good: 4, strong: 1, reject: 0 });
    expect(s.tests).toMatchObject({
      tested: 9,
      notTested: 5,
      strong: 2,
      good: 4,
      fair: 1,
      weak: 0,
      reject: 1,
      testedNotGraded: 1,
    });
  });

  it("counts a white getter as vacuum loss", () => {
    expect(s.vacuumLoss).toBe(1);
  });

  it("counts matched pairs and quads among passing Gm readings of a family at 5 % [CTP; spread SUG]", () => {
    const el34 = s.families.find((f) => f.key === "EL34")!;
    // 10000 & 10300: 300/10150 = 3.0 %; 10400 & 10500: 1.0 %; 12000 alone.
    expect(el34.pairs).toBe(2);
    // 10000–10500: 500/10300 = 4.9 % ≤ 5 % → one quad.
    expect(el34.quads).toBe(1);
    // 12AX7 family: the fair (1200) and strong (1675 mean) tubes are far apart.
    expect(s.families.find((f) => f.key === "12AX7")!.pairs).toBe(0);
    expect(s.matched).toEqual({ pairs: 2, quads: 1, tolerancePct: 5 });
  });

  it("gives the attribution mix in tubes", () => {
    expect(s.attribution).toEqual({ "source-code-confirmed": 5, "construction-matched": 2, unconfirmed: 7 });
  });

  it("unions type hazards and declared ones, with the types that carry them", () => {
    // 83: mercury-vapour rectifier [MEM]; 6ZZ99: declared by the consignor.
    expect(s.hazards.map((h) => [h.kind, h.types, h.tubes])).toEqual([
      ["mercury-vapour", [{ designation: "83", certainty: "known" }], 1],
      ["radioactive", [{ designation: "6ZZ99", certainty: "declared" }], 3],
    ]);
    expect(s.hazards.some((h) => h.kind === "high-voltage" || h.kind === "glass")).toBe(false);
  });

  it("flags unknown designations for review", () => {
    expect(s.unknownDesignations).toEqual([
      expect.objectContaining({ normalised: "6ZZ99", tubes: 3, itemIndexes: [6] }),
    ]);
  });

  it("says 'no comparables yet' without comparables", () => {
    expect(s.estimate).toMatchObject({ kind: "none", text: "no comparables yet" });
    if (s.estimate.kind === "none")
      expect(s.estimate.familiesWithoutComparables.map((f) => f.familyKey)).toEqual(["12AX7", "6ZZ99", "83", "EL34"]);
  });

  it("estimates from comparables, valuing rejects and white getters at zero [SUG]", () => {
    const comparables: ComparableSale[] = [1000, 2000, 3000, 4000, 5000].map((c) => ({
      typeFamily: "12AX7",
      condition: "used",
      pricePerTubeCents: c,
      soldAt: "2026-01-15",
    }));
    const est = summariseLot(LOT, { ...OPTS, comparables });
    // 12AX7 family: 5 tubes, less the shorted ECC83 and the white getter = 3 valued.
    expect(est.zeroValuedTubes).toBe(2);
    // n = 5: 25th percentile h = 1 → 2000, 75th h = 3 → 4000 per tube; the 7025 (NOS) falls back to used sales.
    expect(est.estimate).toMatchObject({ kind: "range", lowCents: 3 * 2000, highCents: 3 * 4000 });
    if (est.estimate.kind !== "range") throw new Error("expected a range");
    expect(est.estimate.parts.map((p) => [p.condition, p.tubes, p.conditionFallback])).toEqual([
      ["used", 2, false],
      ["new-old-stock", 1, true],
    ]);
    expect(est.estimate.familiesWithoutComparables.map((f) => f.familyKey)).toEqual(["6ZZ99", "83", "EL34"]);
  });

  it("reports more readings than quantity, and conflicting chart values", () => {
    const odd = summariseLot([item("12AX7", 1, { readings: [gm(1, [1600, 1600]), gm(2, [1500, 1500])] })], {
      reference: SEED,
      comparables: [],
      chartNewValues: { "12AX7": 1600, "12ax7": 1500 },
    });
    expect(odd.tubeCount).toBe(2);
    expect(odd.issues).toHaveLength(2);
    expect(odd.tests).toMatchObject({ strong: 1, good: 1 }); // first chart value (1600) kept: 100 %, 93.8 %
  });
});

describe("readingsVsNominal", () => {
  it("gives each Gm-tested tube's sections as % of nominal Gm", () => {
    // 12AX7 nominal Gm 1,600 µmho at 250 V, −2 V [REG ✓]: 1200 → 75 %, 1280 → 80 %.
    const points = readingsVsNominal(SEED, [item("12AX7", 1, { readings: [gm(1, [1200, 1280])] })]);
    expect(points).toEqual([
      {
        itemIndex: 0,
        tubeNo: 1,
        designation: "12AX7",
        familyKey: "12AX7",
        percentOfNominal: 77.5,
        sectionsPct: [75, 80],
        failed: false,
      },
    ]);
  });

  it("leaves out emission runs and types without a nominal figure, and marks failures", () => {
    const points = readingsVsNominal(
      SEED,
      [
        item("EL84", 1, { readings: [{ tubeNo: 1, sections: [80], measure: "emission" }] }),
        item("6ZZ99", 1, { readings: [gm(1, [3000])] }),
        item("6SN7GT", 1, { readings: [gm(1, [2600, 1300], { gas: true })] }), // 2,600 µmho [REG ✓]
      ],
      (d) => ({ "6SN7GT": 2600, EL84: 11300 })[d],
    );
    expect(points.map((p) => [p.designation, p.sectionsPct, p.failed])).toEqual([["6SN7GT", [100, 50], true]]);
  });
});
