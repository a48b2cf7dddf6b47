// Check values:
// - [CTP]: % of new = reading ÷ chart "new" × 100; bands ≥100 strong, 80–99 good,
//   60–79 fair, <60 weak; any short, leakage or gas → reject; white getter = air leak, dead;
//   never compare emission readings with Gm readings.
// - [CTP]: testers use their own test points: compute "% of new" from the tester
//   model's own chart, never from data-sheet figures (so no grade rests on the nominal Gm).
// -: Gm 1,200 against chart 1,600 → 75 % → "fair".
// - 12AX7 nominal Gm 1,600 µmho at 250 V, −2 V: our reference data row (lib/valves/reference-data.ts)
//   is tagged "REG ✓" (registered characteristics checked against a published data-sheet
//   transcription), as.
// - [CTP] "Test disputes": allow roughly ±10–15 % tester-to-tester variation; a valid
//   claim falls below the listed band by more than that or shows an absolute failure.
//   [SUG] we take the generous end, 15 points below the floor of the listed band.
// - [MEM]: 12AX7 = ECC83 exact; 7025 premium; 5751 a substitute with caveats;
//   6922 ↔ 6DJ8 "near"; PCC88 a different-heater sibling of 6DJ8 [PE; MEM].
// - [SUG, CTP-informed] "Misattribution disputes"; [EIA-476]: a source code
//   may name the brand owner, so it is evidence, not proof; [CTP]: high confidence
//   only when several independent features match a reference.
// Makers, labels and source codes are invented demo data (scenario.md; same habits and
// codes as the demo seeders). Nothing here describes a real factory.
import { describe, expect, it } from "vitest";
import {
  gradeAgainstNominal,
  TESTER_VARIATION_PCT,
  weighingSummary,
  weighItem,
  type BuyerReport,
  type ListingSide,
} from "@/lib/disputes/weigh";
import type { TubeReading } from "@/lib/lots/item";
import { nominalGmFromReference } from "@/lib/lots/readings-chart";
import { profileFromExample, type ReferenceProfile } from "@/lib/valves/attribution";
import { featuresFromText } from "@/lib/valves/construction-text";
import { getReferenceType } from "@/lib/valves/reference-table";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// ── Invented demo makers and their construction habits ──────────────────────────
const KESTREL = "Kestrel Valve Company";
const PELLHAM = "Pellham Radio Tube Corp.";
const VIREO = "Vireo Lamp & Valve";
const HABITS: Record<string, Record<string, string>> = {
  [KESTREL]: {
    plateShape: "flat",
    plateColour: "black",
    plateSurface: "ribbed",
    getterShape: "d-shape",
    getterPosition: "side",
    flashPlace: "side",
    micaCount: "2",
    micaOutline: "notched",
    supportRodFinish: "dark-iron",
    markingMethod: "stamped",
  },
  [PELLHAM]: {
    plateShape: "flat",
    plateColour: "grey",
    plateSurface: "dimpled",
    getterShape: "square",
    getterPosition: "top",
    flashPlace: "dome",
    micaCount: "2",
    micaOutline: "shaped",
    plateFastening: "rivets",
    plateFastenerCount: "2",
    markingMethod: "silk-screen",
  },
  [VIREO]: {
    plateShape: "round",
    plateColour: "bright",
    plateSurface: "finned",
    getterShape: "disc",
    getterPosition: "bottom",
    flashPlace: "side",
    micaCount: "3",
    micaOutline: "shaped",
    supportRodFinish: "copper-coloured",
    markingMethod: "etched",
  },
};
const fromHabit = (makerId: string, makerName: string): ReferenceProfile =>
  profileFromExample(
    { profileId: `${makerId}:12AX7`, makerId, makerName, typeFamily: "12AX7" },
    featuresFromText(HABITS[makerName]).features,
  );
// A literal profile built from several reference tubes (counts per value).
const ALDERGROVE: ReferenceProfile = {
  profileId: "aldergrove:12AX7",
  makerId: "aldergrove",
  makerName: "Aldergrove Electron Works",
  typeFamily: "12AX7",
  features: {
    plateShape: { box: 3 },
    plateColour: { grey: 2, black: 1 },
    plateSurface: { smooth: 3 },
    getterShape: { halo: 3 },
    getterPosition: { top: 3 },
    micaCount: { "3": 3 },
  },
  sampleCount: 3,
};
const PROFILES: ReferenceProfile[] = [
  fromHabit("kestrel", KESTREL),
  fromHabit("pellham", PELLHAM),
  fromHabit("vireo", VIREO),
  ALDERGROVE,
];
// Invented demo source codes (as in the demo seeder, marked demo there).
const CODE = { [KESTREL]: "X31", [PELLHAM]: "X46" };

// ── A listed line and the buyer's report ────────────────────────────────────────
// Tester chart "new" value 1,600 for a 12AX7 section, as.
const CHART = 1_600;
const gm = (tubeNo: number, sections: number[], extra: Partial<TubeReading> = {}): TubeReading => ({
  tubeNo,
  measure: "gm",
  sections,
  chartNewValue: CHART,
  ...extra,
});

function listing(over: Partial<ListingSide> = {}): ListingSide {
  return {
    position: 3,
    designation: "12AX7",
    quantity: 8,
    labelBrand: "Carrow Instruments", // invented label brand, not a factory
    makerName: KESTREL,
    makerBasis: "construction-matched",
    sourceCode: null,
    dateCode: "6211",
    features: { plateColour: "black", getterShape: "d-shape" },
    vacuumLoss: false,
    readings: [],
    ...over,
  };
}
const report = (over: Partial<BuyerReport> = {}): BuyerReport => ({ tubes: 8, features: {}, readings: [], ...over });
const noCodes = { listing: null, buyer: null };

describe("gradeAgainstNominal: grades rest on the tester chart only [CTP]", () => {
  it("our reference nominal Gm for a 12AX7 is 1,600 µmho, tagged REG ✓ [REG ✓]", () => {
    expect(nominalGmFromReference(SEED, "12AX7")).toBe(1_600);
    expect(nominalGmFromReference(SEED, "ECC83")).toBe(1_600); // exact equivalent [MEM]
    expect(getReferenceType(SEED, "12AX7")?.source).toBe("REG ✓");
  });

  it("a Gm run with no chart value is NOT graded against the data sheet's nominal [CTP]", () => {
    const [g] = gradeAgainstNominal(SEED, "12AX7", [{ tubeNo: 1, measure: "gm", sections: [1_200, 1_300] }]);
    expect(g.grade).toBe("not-graded");
    expect(g.chartNewValue).toBeNull();
    expect(g.worstPercentOfNew).toBeNull();
    expect(g.hardFail).toBe(false);
    expect(g.reasons[0]).toMatch(/No tester chart value/);
    expect(g.reasons[0]).toMatch(/data-sheet figures are not a test limit/);
  });

  it("…but shows the weakest section as % of the nominal Gm, for orientation: 1,200 of 1,600 → 75 [REG]", () => {
    const [g] = gradeAgainstNominal(SEED, "12AX7", [{ tubeNo: 1, measure: "gm", sections: [1_300, 1_200] }]);
    expect(g.percentOfNominal).toBe(75); // weakest section, not the first
    const [odd] = gradeAgainstNominal(SEED, "ECC83", [{ tubeNo: 2, measure: "gm", sections: [1_234] }]);
    expect(odd.percentOfNominal).toBe(77.1); // 1,234 / 1,600 = 77.125 % → one decimal
  });

  it("the fallback chart grades a reading that carries none: 1,200 of 1,600 → 75 % → fair [CTP]", () => {
    const [g] = gradeAgainstNominal(
      SEED,
      "12AX7",
      [{ tubeNo: 1, measure: "gm", sections: [1_200, 1_300] }],
      false,
      CHART,
    );
    expect(g.chartNewValue).toBe(1_600);
    expect(g.worstPercentOfNew).toBe(75); // weakest section decides [CTP]
    expect(g.grade).toBe("fair");
    expect(g.hardFail).toBe(false);
  });

  it("the reading's own chart value wins over the fallback; the nominal never enters the grade [CTP]", () => {
    const [g] = gradeAgainstNominal(
      SEED,
      "12AX7",
      [{ tubeNo: 1, measure: "gm", sections: [1_300], chartNewValue: 1_300 }],
      false,
      CHART,
    );
    expect(g.chartNewValue).toBe(1_300);
    expect(g.worstPercentOfNew).toBe(100);
    expect(g.grade).toBe("strong"); // ≥ 100 % of its own chart [CTP]
    expect(g.percentOfNominal).toBe(81.3); // 1,300 / 1,600 = 81.25 %: shown, but not a grade
  });

  it("no % of nominal where it means nothing: emission runs, types without a nominal Gm, empty sections", () => {
    // An emission run never borrows a Gm figure [CTP].
    const [emission] = gradeAgainstNominal(SEED, "12AX7", [{ tubeNo: 1, measure: "emission", sections: [70] }]);
    expect(emission.grade).toBe("not-graded");
    expect(emission.chartNewValue).toBeNull();
    expect(emission.worstPercentOfNew).toBeNull();
    expect(emission.percentOfNominal).toBeNull();
    // Our reference data has no Gm for the 5AR4 full-wave rectifier.
    expect(nominalGmFromReference(SEED, "5AR4")).toBeUndefined();
    const [rect] = gradeAgainstNominal(SEED, "5AR4", [{ tubeNo: 2, measure: "gm", sections: [1_200] }]);
    expect(rect.grade).toBe("not-graded");
    expect(rect.percentOfNominal).toBeNull();
    const [gassy] = gradeAgainstNominal(SEED, "12AX7", [{ tubeNo: 3, measure: "gm", sections: [], gas: true }]);
    expect(gassy.percentOfNominal).toBeNull();
  });

  it("a short or gas is a reject and a hard failure whatever the reading, chart or not [CTP]", () => {
    const graded = gradeAgainstNominal(SEED, "12AX7", [
      { tubeNo: 1, measure: "gm", sections: [1_700, 1_650], shorts: true },
      { tubeNo: 2, measure: "gm", sections: [], gas: true },
      { tubeNo: 3, measure: "gm", sections: [1_500], leakage: true, chartNewValue: CHART },
    ]);
    expect(graded.map((g) => g.grade)).toEqual(["reject", "reject", "reject"]);
    expect(graded.map((g) => g.hardFail)).toEqual([true, true, true]);
    expect(graded[0].reasons.join(" ")).toMatch(/short/);
    expect(graded[1].reasons.join(" ")).toMatch(/gas/);
    expect(graded[2].reasons.join(" ")).toMatch(/leakage/);
    const [noChart] = gradeAgainstNominal(SEED, "5AR4", [
      { tubeNo: 1, measure: "emission", sections: [], shorts: true },
    ]);
    expect(noChart.grade).toBe("reject");
    expect(noChart.hardFail).toBe(true);
  });

  it("a weak reading is not a hard failure: only shorts, leakage, gas and a white getter are [CTP]", () => {
    const [g] = gradeAgainstNominal(SEED, "12AX7", [gm(1, [400, 420])]); // 25 % of new
    expect(g.grade).toBe("weak");
    expect(g.hardFail).toBe(false);
  });

  it("a white getter rejects every reading of the item, as a hard failure [CTP]", () => {
    const graded = gradeAgainstNominal(
      SEED,
      "12AX7",
      [gm(1, [1_700, 1_650]), { tubeNo: 2, measure: "gm", sections: [1_600] }],
      true,
    );
    expect(graded.map((g) => g.grade)).toEqual(["reject", "reject"]);
    expect(graded.every((g) => g.hardFail)).toBe(true);
    expect(graded[0].reasons.join(" ")).toMatch(/white getter/);
  });

  // The fallback chart is a Gm chart value: it never grades a reading of another measure.
  it("the Gm fallback chart is not used for an emission run [CTP]", () => {
    const [g] = gradeAgainstNominal(SEED, "12AX7", [{ tubeNo: 1, measure: "emission", sections: [70] }], false, CHART);
    expect(g.grade).toBe("not-graded");
    expect(g.chartNewValue).toBeNull();
  });
});

describe("weighItem: maker misattributed [SUG, CTP-informed]", () => {
  it("the buyer's source code belongs to another maker → supports, as evidence not proof [EIA-476]", () => {
    const w = weighItem(SEED, "maker-misattributed", listing(), report({ sourceCode: CODE[PELLHAM] }), PROFILES, {
      listing: null,
      buyer: PELLHAM,
    });
    expect(w.verdict).toBe("supports");
    expect(w.position).toBe(3);
    expect(w.buyer.ranking.sourceCodeMaker).toBe(PELLHAM);
    expect(w.findings[0]).toContain(`(${CODE[PELLHAM]}) belongs to ${PELLHAM}, not ${KESTREL}`);
    expect(w.findings[0]).toMatch(/evidence, not proof/);
  });

  it("a source-code maker with no code in the report → the finding says 'as reported', never 'undefined'", () => {
    const w = weighItem(SEED, "maker-misattributed", listing(), report(), PROFILES, { listing: null, buyer: PELLHAM });
    expect(w.verdict).toBe("supports");
    expect(w.findings[0]).toContain(`(as reported) belongs to ${PELLHAM}`);
    expect(w.findings.join(" ")).not.toContain("undefined");
    const agrees = weighItem(SEED, "maker-misattributed", listing(), report({ sourceCode: null }), PROFILES, {
      listing: null,
      buyer: KESTREL,
    });
    expect(agrees.findings[0]).toBe(`The buyer's source code (as reported) points to ${KESTREL}, as listed.`);
  });

  it("a code for another maker still supports when the buyer's construction favours the listed maker only at medium confidence", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ sourceCode: CODE[PELLHAM], features: { plateColour: "black", getterShape: "d-shape" } }),
      PROFILES,
      { listing: null, buyer: PELLHAM },
    );
    expect(w.buyer.ranking.candidates[0]).toMatchObject({ makerName: KESTREL, confidence: "medium" });
    expect(w.verdict).toBe("supports");
    expect(w.findings.some((f) => /But the buyer's own construction/.test(f))).toBe(false);
  });

  it("a code for another maker against the buyer's own high-confidence construction for the listed maker → both findings given [EIA-476]", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ sourceCode: CODE[PELLHAM], features: HABITS[KESTREL] }),
      PROFILES,
      { listing: null, buyer: PELLHAM },
    );
    expect(w.buyer.ranking.candidates[0]).toMatchObject({ makerName: KESTREL, confidence: "high" });
    expect(w.verdict).not.toBe("supports");
    expect(w.findings[0]).toContain(`(${CODE[PELLHAM]}) belongs to ${PELLHAM}, not ${KESTREL}`);
    expect(w.findings[1]).toBe(
      `But the buyer's own construction ranks ${KESTREL} first with high confidence: the code may name the brand owner rather than the factory. Weigh the photos.`,
    );
  });

  // Once the source-code branch has weighed code against construction, the construction branch adds nothing.
  it("…and the verdict is inconclusive, with those two findings only", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ sourceCode: CODE[PELLHAM], features: HABITS[KESTREL] }),
      PROFILES,
      { listing: null, buyer: PELLHAM },
    );
    expect(w.verdict).toBe("inconclusive");
    expect(w.findings).toHaveLength(2);
  });

  it("the buyer's source code points to the listed maker → does not support (names compared case-blind)", () => {
    const w = weighItem(SEED, "maker-misattributed", listing(), report({ sourceCode: CODE[KESTREL] }), PROFILES, {
      listing: null,
      buyer: "kestrel valve company ",
    });
    expect(w.verdict).toBe("does-not-support");
    expect(w.findings[0]).toContain(`points to ${KESTREL}, as listed`);
  });

  it("buyer's construction ranks another maker first at high confidence, listed maker conflicting → supports", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ features: HABITS[PELLHAM] }),
      PROFILES,
      noCodes,
    );
    const [top] = w.buyer.ranking.candidates;
    expect(top.makerName).toBe(PELLHAM);
    expect(top.confidence).toBe("high"); // every recorded feature matches, many sub-assemblies [CTP]
    const kestrel = w.buyer.ranking.candidates.find((c) => c.makerName === KESTREL)!;
    expect(kestrel.conflicting).toEqual(expect.arrayContaining(["plateColour", "getterShape", "getterPosition"]));
    expect(w.verdict).toBe("supports");
    expect(w.findings[0]).toContain(`ranks ${PELLHAM} first (high confidence`);
    expect(w.findings[0]).toContain(`${KESTREL} conflicts on`);
  });

  it("…and at medium confidence (two sub-assemblies only) → supports", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ features: { plateColour: "grey", getterShape: "square" } }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.ranking.candidates[0]).toMatchObject({ makerName: PELLHAM, confidence: "medium" });
    expect(w.verdict).toBe("supports");
  });

  it("buyer's construction ranks the listed maker first → does not support", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ features: HABITS[KESTREL] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.ranking.candidates[0]).toMatchObject({ makerName: KESTREL, confidence: "high" });
    expect(w.verdict).toBe("does-not-support");
    expect(w.findings[0]).toContain(`ranks ${KESTREL} first (high confidence), as listed`);
  });

  it("a single feature gives only low confidence → inconclusive [CTP]", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ features: { plateSurface: "dimpled" } }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.ranking.candidates[0]).toMatchObject({ makerName: PELLHAM, confidence: "low" });
    expect(w.verdict).toBe("inconclusive");
    expect(w.findings[0]).toMatch(/not decisive/);
  });

  it("no features and no codes from the buyer → inconclusive", () => {
    const w = weighItem(SEED, "maker-misattributed", listing(), report(), PROFILES, noCodes);
    expect(w.verdict).toBe("inconclusive");
    expect(w.buyer.ranking.candidates).toEqual([]);
    expect(w.findings[0]).toMatch(/no construction features or codes/);
  });

  it("a line listed with no maker → does not support: a label is no attribution [CTP]", () => {
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing({ makerName: null, makerBasis: "unconfirmed" }),
      report({ features: HABITS[PELLHAM] }),
      PROFILES,
      { listing: null, buyer: PELLHAM },
    );
    expect(w.verdict).toBe("does-not-support");
    expect(w.findings[0]).toMatch(/named no maker/);
  });

  it("notes when the listing's own construction ranks another maker, and an unconfirmed basis", () => {
    const l = listing({
      features: { plateColour: "grey", getterShape: "square", getterPosition: "top" },
      makerBasis: "unconfirmed",
    });
    const w = weighItem(SEED, "maker-misattributed", l, report({ features: HABITS[PELLHAM] }), PROFILES, noCodes);
    expect(w.findings).toContain(`Even the listing's own construction notes rank ${PELLHAM} above ${KESTREL}.`);
    expect(w.findings.some((f) => /marked its attribution unconfirmed/.test(f))).toBe(true);
  });

  it("profiles of another type family are not compared; unknown features are set apart", () => {
    const el84Vireo = profileFromExample(
      { profileId: "vireo:EL84", makerId: "vireo-el84", makerName: "Vireo EL84 reference" },
      featuresFromText(HABITS[VIREO]).features,
    );
    const otherFamily: ReferenceProfile = { ...el84Vireo, typeFamily: "EL84" };
    const w = weighItem(
      SEED,
      "maker-misattributed",
      listing(),
      report({ features: { ...HABITS[VIREO], wobble: "lots", getterShape: "sparkly" } }),
      [otherFamily, ...PROFILES],
      noCodes,
    );
    expect(w.buyer.ranking.candidates.map((c) => c.makerName)).not.toContain("Vireo EL84 reference");
    expect(w.buyer.ranking.candidates[0].makerName).toBe(VIREO);
    expect(w.buyer.ranking.ignored).toEqual(expect.arrayContaining(["wobble", "getterShape=sparkly"]));
    expect(w.buyer.ranking.candidates.length).toBeLessThanOrEqual(4);
  });
});

describe("weighItem: undisclosed vacuum loss [CTP] white getter = air leak", () => {
  it("the listing disclosed the white getter → does not support", () => {
    const w = weighItem(
      SEED,
      "undisclosed-vacuum-loss",
      listing({ vacuumLoss: true }),
      report({ vacuumLoss: true }),
      PROFILES,
      noCodes,
    );
    expect(w.verdict).toBe("does-not-support");
    expect(w.findings[0]).toMatch(/listing disclosed vacuum loss/);
  });

  it("the buyer reports a white getter the listing did not disclose → supports", () => {
    const w = weighItem(
      SEED,
      "undisclosed-vacuum-loss",
      listing(),
      report({ vacuumLoss: true, readings: [gm(1, [1_500, 1_550])] }),
      PROFILES,
      noCodes,
    );
    expect(w.verdict).toBe("supports");
    expect(w.findings[0]).toMatch(/white getter flash that the listing did not disclose/);
    expect(w.buyer.readings[0].grade).toBe("reject"); // white getter → reject regardless of reading
    expect(w.buyer.readings[0].hardFail).toBe(true);
  });

  it("the buyer does not report a white getter → does not support, and says why", () => {
    const w = weighItem(SEED, "undisclosed-vacuum-loss", listing(), report(), PROFILES, noCodes);
    expect(w.verdict).toBe("does-not-support");
    expect(w.findings).toEqual(["The buyer does not report a white getter on this line."]);
    const explicit = weighItem(
      SEED,
      "undisclosed-vacuum-loss",
      listing(),
      report({ vacuumLoss: false, readings: [gm(1, [900])] }),
      PROFILES,
      noCodes,
    );
    expect(explicit.verdict).toBe("does-not-support"); // a low reading is not a white getter
  });
});

describe("weighItem: readings not as listed [CTP] bands, §8 test disputes", () => {
  // Listed tube 1: sections 1,700 / 1,650 of 1,600 → weakest 103 % → strong.
  const strongListing = listing({ readings: [gm(1, [1_700, 1_650])] });

  it("testers may differ by 15 points before a lower reading counts [CTP] ±10–15 %, generous end [SUG]", () => {
    expect(TESTER_VARIATION_PCT).toBe(15);
  });

  it("listed strong, buyer reads weak → supports, naming the band floor and the buyer's figure", () => {
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [900, 950])] }),
      PROFILES,
      noCodes,
    );
    expect(w.listing.readings[0].grade).toBe("strong");
    expect(w.buyer.readings[0].grade).toBe("weak"); // 900 / 1,600 = 56 %
    expect(w.verdict).toBe("supports");
    expect(w.findings).toContain(
      "Tube 1: listed strong (100 % of new or more); the buyer reads 56 %, more than 15 points below the band.",
    );
  });

  it("listed strong, buyer reads fair at 75 %, more than 15 below the 100 % floor → supports [CTP]", () => {
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [1_200, 1_250])] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.readings[0].grade).toBe("fair"); // 75 % [CTP]
    expect(w.verdict).toBe("supports");
  });

  it("the edge of the allowance: listed strong, 85 % does not support, 84.9 % does [CTP]", () => {
    const at = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [1_360, 1_400])] }),
      PROFILES,
      noCodes,
    ); // 1,360 / 1,600 = 85.0 %
    expect(at.buyer.readings[0].worstPercentOfNew).toBe(85);
    expect(at.verdict).toBe("does-not-support");
    const below = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [1_358, 1_400])] }),
      PROFILES,
      noCodes,
    ); // 84.875 %
    expect(below.verdict).toBe("supports");
  });

  it("listed fair (floor 60 %): 45 % does not support, 44 % does [CTP]", () => {
    const fairListing = listing({ readings: [gm(1, [1_000, 1_050])] }); // 62.5 % → fair
    const at = weighItem(
      SEED,
      "readings-not-as-listed",
      fairListing,
      report({ readings: [gm(1, [720, 760])] }),
      PROFILES,
      noCodes,
    ); // 45 %
    expect(at.listing.readings[0].grade).toBe("fair");
    expect(at.verdict).toBe("does-not-support");
    const below = weighItem(
      SEED,
      "readings-not-as-listed",
      fairListing,
      report({ readings: [gm(1, [704, 760])] }),
      PROFILES,
      noCodes,
    ); // 44 %
    expect(below.verdict).toBe("supports");
    expect(below.findings[0]).toBe(
      "Tube 1: listed fair (60 % of new or more); the buyer reads 44 %, more than 15 points below the band.",
    );
  });

  it("listed weak: the band has no floor, so a lower reading alone does not support [CTP]", () => {
    const weakListing = listing({ readings: [gm(1, [800, 850])] }); // 50 % → weak
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      weakListing,
      report({ readings: [gm(1, [160, 200])] }),
      PROFILES,
      noCodes,
    ); // 10 %
    expect(w.listing.readings[0].grade).toBe("weak");
    expect(w.verdict).toBe("does-not-support");
  });

  it("listed strong, buyer finds a short → absolute failure → supports [CTP]", () => {
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [], { shorts: true })] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.readings[0].grade).toBe("reject");
    expect(w.verdict).toBe("supports");
    expect(w.findings[0]).toMatch(/^Tube 1: listed strong, the buyer finds an absolute failure \(short/);
  });

  it("listed strong, buyer finds gas even with a strong Gm → supports [CTP] 'any gas → reject regardless of Gm'", () => {
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [1_650, 1_700], { gas: true })] }),
      PROFILES,
      noCodes,
    );
    expect(w.verdict).toBe("supports");
    expect(w.findings[0]).toMatch(/absolute failure \(gas/);
  });

  it("the buyer's white getter makes every tube an absolute failure the listing did not show → supports", () => {
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ vacuumLoss: true, readings: [gm(1, [1_650, 1_700])] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.readings[0].hardFail).toBe(true);
    expect(w.verdict).toBe("supports");
    expect(w.findings[0]).toMatch(/white getter/);
  });

  it("listed strong at 103 %, buyer reads good at 92.5 % (within tester variation) → does not support", () => {
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [1_500, 1_480])] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.readings[0].grade).toBe("good");
    expect(w.verdict).toBe("does-not-support");
    expect(w.findings).toContain(
      "1 tube reading(s) compared: none falls below its listed band by more than the 15 % testers differ by.",
    );
  });

  it("a buyer's reading without a chart value is graded on the listing's chart for the line [CTP]", () => {
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [{ tubeNo: 1, measure: "gm", sections: [900, 950] }] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.readings[0].chartNewValue).toBe(1_600);
    expect(w.buyer.readings[0].grade).toBe("weak");
    expect(w.verdict).toBe("supports");
  });

  it("a buyer's reading with its own chart value is graded on that chart, not the listing's [CTP]", () => {
    // Buyer's tester chart says 1,400 new: 1,200 → 85.7 % of new (against the listing's 1,600 it would be 75 %).
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [gm(1, [1_200, 1_250], { chartNewValue: 1_400 })] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.readings[0].chartNewValue).toBe(1_400);
    expect(w.buyer.readings[0].grade).toBe("good");
    expect(w.verdict).toBe("does-not-support");
  });

  it("a listing reading without a chart value is not graded on the data sheet, so nothing is compared [CTP]", () => {
    const noChartListing = listing({ readings: [{ tubeNo: 1, measure: "gm", sections: [1_700, 1_650] }] });
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      noChartListing,
      report({ readings: [gm(1, [900, 950])] }),
      PROFILES,
      noCodes,
    );
    expect(w.listing.readings[0].grade).toBe("not-graded");
    expect(w.listing.readings[0].percentOfNominal).toBe(103.1); // shown beside it, 1,650 / 1,600
    expect(w.verdict).toBe("inconclusive");
  });

  it("only the tubes read on both sides count: one tube falls, another holds → supports, one finding", () => {
    const l = listing({ readings: [gm(1, [1_700, 1_650]), gm(2, [1_600, 1_620])] });
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      l,
      report({ readings: [gm(1, [1_580, 1_600]), gm(2, [800, 820]), gm(7, [300, 300])] }),
      PROFILES,
      noCodes,
    );
    expect(w.verdict).toBe("supports");
    expect(w.findings).toHaveLength(1); // tube 7 was not read in the listing
    expect(w.findings[0]).toMatch(/^Tube 2: listed strong/);
  });

  it("nothing graded on both sides → inconclusive (compare like with like)", () => {
    const buyerEmission: TubeReading = { tubeNo: 1, measure: "emission", sections: [70] };
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [buyerEmission, gm(5, [1_000, 1_000])] }),
      PROFILES,
      noCodes,
    );
    expect(w.verdict).toBe("inconclusive"); // tube 5 was not read in the listing
    expect(w.findings[0]).toBe(
      "No tube has readings of the same measure, graded on a chart value, on both sides: nothing to compare like with like.",
    );
  });

  it("a failure the listing already disclosed is not a reading 'not as listed' [CTP] test disputes", () => {
    // Tube 2 was listed with a short (so listed as reject); the buyer finds the same short.
    const l = listing({ readings: [gm(1, [1_700, 1_650]), gm(2, [], { shorts: true })] });
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      l,
      report({ readings: [gm(2, [], { shorts: true })] }),
      PROFILES,
      noCodes,
    );
    expect(w.listing.readings[1].grade).toBe("reject");
    expect(w.verdict).toBe("does-not-support");
    // Nor does a low figure on a tube the listing already called a reject.
    const w2 = weighItem(
      SEED,
      "readings-not-as-listed",
      l,
      report({ readings: [gm(2, [300, 320])] }),
      PROFILES,
      noCodes,
    );
    expect(w2.verdict).toBe("does-not-support");
  });

  it("an emission reading is never set against a Gm reading [CTP]", () => {
    // Listing: Gm run, strong. Buyer: emission run at 50 % of its own chart → graded "weak".
    // The two are not comparable, so nothing is compared.
    const buyerEmission: TubeReading = { tubeNo: 1, measure: "emission", sections: [50], chartNewValue: 100 };
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      strongListing,
      report({ readings: [buyerEmission] }),
      PROFILES,
      noCodes,
    );
    expect(w.buyer.readings[0].grade).toBe("weak");
    expect(w.verdict).toBe("inconclusive");
  });

  it("one band lower can still fall far below the listed band: good at 99 % → 60 % supports [CTP]", () => {
    // Listed good (band 80–99 %); the buyer reads 60 %, 20 points below the band's floor,
    // beyond the ±10–15 % tester allowance, so a valid claim.
    const l = listing({ readings: [gm(1, [1_590, 1_585])] }); // 99.1 % → good
    const w = weighItem(
      SEED,
      "readings-not-as-listed",
      l,
      report({ readings: [gm(1, [960, 970])] }),
      PROFILES,
      noCodes,
    ); // 60 % → fair
    expect(w.listing.readings[0].grade).toBe("good");
    expect(w.buyer.readings[0].grade).toBe("fair");
    expect(w.verdict).toBe("supports");
    expect(w.findings[0]).toBe(
      "Tube 1: listed good (80 % of new or more); the buyer reads 60 %, more than 15 points below the band.",
    );
  });
});

describe("weighItem: wrong type [MEM] equivalents, short count, transit damage", () => {
  it("the buyer reads an unrelated designation → supports; the same one (any case) → does not", () => {
    const wrong = weighItem(SEED, "wrong-type", listing(), report({ designationSeen: "12au7" }), PROFILES, noCodes);
    expect(wrong.verdict).toBe("supports");
    expect(wrong.findings[0]).toBe("Listed as 12AX7; the buyer reads 12AU7.");
    const same = weighItem(SEED, "wrong-type", listing(), report({ designationSeen: "12ax7" }), PROFILES, noCodes);
    expect(same.verdict).toBe("does-not-support");
    expect(same.findings[0]).toBe("The buyer reads 12AX7, as listed.");
  });

  it("an exact equivalent under another numbering (listed 12AX7, buyer reads ECC83) → does not support [MEM]", () => {
    const w = weighItem(SEED, "wrong-type", listing(), report({ designationSeen: "ECC83" }), PROFILES, noCodes);
    expect(w.verdict).toBe("does-not-support");
    expect(w.findings[0]).toBe("ECC83 is listed as an exact equivalent of 12AX7 [MEM].");
    const reverse = weighItem(
      SEED,
      "wrong-type",
      listing({ designation: "ECC83" }),
      report({ designationSeen: "12ax7" }),
      PROFILES,
      noCodes,
    );
    expect(reverse.verdict).toBe("does-not-support");
  });

  it("a premium or caveat equivalent is not the type listed → supports, naming the link [MEM]", () => {
    const premium = weighItem(SEED, "wrong-type", listing(), report({ designationSeen: "7025" }), PROFILES, noCodes);
    expect(premium.verdict).toBe("supports");
    expect(premium.findings[0]).toBe(
      "Listed as 12AX7; the buyer reads 7025 (a premium equivalent, not the type listed).",
    );
    const caveat = weighItem(SEED, "wrong-type", listing(), report({ designationSeen: "5751" }), PROFILES, noCodes);
    expect(caveat.verdict).toBe("supports"); // µ 70 against 100: never "exact" [MEM]
    expect(caveat.findings[0]).toContain("(a caveat equivalent, not the type listed)");
  });

  it("near and different-heater relatives → supports, the link kind in words [PE]", () => {
    const near = weighItem(
      SEED,
      "wrong-type",
      listing({ designation: "6DJ8" }),
      report({ designationSeen: "6922" }),
      PROFILES,
      noCodes,
    );
    expect(near.verdict).toBe("supports");
    expect(near.findings[0]).toBe("Listed as 6DJ8; the buyer reads 6922 (a near equivalent, not the type listed).");
    const heater = weighItem(
      SEED,
      "wrong-type",
      listing({ designation: "6DJ8" }),
      report({ designationSeen: "PCC88" }),
      PROFILES,
      noCodes,
    );
    expect(heater.verdict).toBe("supports");
    expect(heater.findings[0]).toContain("(a sibling heater equivalent, not the type listed)");
  });

  it("no designation from the buyer → inconclusive, with a finding saying so", () => {
    const w = weighItem(SEED, "wrong-type", listing(), report(), PROFILES, noCodes);
    expect(w.verdict).toBe("inconclusive");
    expect(w.findings).toEqual(["The buyer did not say what type is printed on the tubes."]);
    expect(weighItem(SEED, "wrong-type", listing(), report({ designationSeen: "" }), PROFILES, noCodes).verdict).toBe(
      "inconclusive",
    );
  });

  it("a listed designation that cannot be read → inconclusive: compare the print with the photos", () => {
    const w = weighItem(
      SEED,
      "wrong-type",
      listing({ designation: "12A#7" }),
      report({ designationSeen: "12AU7" }),
      PROFILES,
      noCodes,
    );
    expect(w.verdict).toBe("inconclusive");
    expect(w.findings[0]).toBe('The listed designation "12A#7" could not be read; compare the print with the photos.');
  });

  it("fewer tubes received than listed → supports; all received, or more → does not", () => {
    const short = weighItem(SEED, "short-count", listing(), report({ tubesReceived: 6 }), PROFILES, noCodes);
    expect(short.verdict).toBe("supports");
    expect(short.findings[0]).toContain("Listed 8, received 6.");
    const full = weighItem(SEED, "short-count", listing(), report({ tubesReceived: 8 }), PROFILES, noCodes);
    expect(full.verdict).toBe("does-not-support");
    expect(full.findings[0]).toBe("Received 8 of 8.");
    const over = weighItem(SEED, "short-count", listing(), report({ tubesReceived: 9 }), PROFILES, noCodes);
    expect(over.verdict).toBe("does-not-support");
    expect(over.findings[0]).toBe("Received 9 of 8.");
  });

  it("short count without the number received → inconclusive, with a finding saying so", () => {
    for (const tubesReceived of [undefined, null]) {
      const w = weighItem(SEED, "short-count", listing(), report({ tubesReceived }), PROFILES, noCodes);
      expect(w.verdict).toBe("inconclusive");
      expect(w.findings).toEqual(["The buyer did not say how many tubes arrived."]);
    }
    // Zero received is a number, not a missing one.
    expect(weighItem(SEED, "short-count", listing(), report({ tubesReceived: 0 }), PROFILES, noCodes).verdict).toBe(
      "supports",
    );
  });

  it("transit damage → inconclusive: judged from photos and the carrier's record [CTP]", () => {
    const w = weighItem(SEED, "transit-damage", listing(), report({ note: "two bulbs cracked" }), PROFILES, noCodes);
    expect(w.verdict).toBe("inconclusive");
    expect(w.findings[0]).toMatch(/photos and the carrier's record/);
  });
});

describe("weighingSummary", () => {
  it("counts items and tubes by verdict, in words", () => {
    const s = weighingSummary([
      { verdict: "supports", tubes: 8 },
      { verdict: "supports", tubes: 1 },
      { verdict: "does-not-support", tubes: 4 },
      { verdict: "inconclusive", tubes: 2 },
    ]);
    expect(s).toEqual({
      items: 4,
      supported: 2,
      supportedTubes: 9,
      against: 1,
      inconclusive: 1,
      words: "The evidence supports the claim on 2 of 4 items (9 tubes); 1 against, 1 inconclusive.",
    });
  });

  it("one item reads 'of 1 item'; none reads 'of 0 items'", () => {
    expect(weighingSummary([{ verdict: "supports", tubes: 8 }]).words).toBe(
      "The evidence supports the claim on 1 of 1 item (8 tubes); 0 against, 0 inconclusive.",
    );
    expect(weighingSummary([]).words).toBe(
      "The evidence supports the claim on 0 of 0 items (0 tubes); 0 against, 0 inconclusive.",
    );
  });
});
