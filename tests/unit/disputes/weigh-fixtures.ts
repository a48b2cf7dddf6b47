// Shared fixtures for the weighing tests: invented makers and their habits, listing and buyer-report builders.
// Makers, labels and source codes are invented demo data (scenario.md; same habits and
// codes as the demo seeders). Nothing here describes a real factory.
import type { BuyerReport, ListingSide } from "@/lib/disputes/weigh";
import type { TubeReading } from "@/lib/lots/item";
import { profileFromExample, type ReferenceProfile } from "@/lib/valves/attribution";
import { featuresFromText } from "@/lib/valves/construction-text";
import { seedReferenceTable } from "@/lib/valves/seed";

export const SEED = seedReferenceTable();

// ── Invented demo makers and their construction habits ──────────────────────────
export const KESTREL = "Kestrel Valve Company";
export const PELLHAM = "Pellham Radio Tube Corp.";
export const VIREO = "Vireo Lamp & Valve";
export const HABITS: Record<string, Record<string, string>> = {
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
export const fromHabit = (makerId: string, makerName: string): ReferenceProfile =>
  profileFromExample(
    { profileId: `${makerId}:12AX7`, makerId, makerName, typeFamily: "12AX7" },
    featuresFromText(HABITS[makerName]).features,
  );
// A literal profile built from several reference tubes (counts per value).
export const ALDERGROVE: ReferenceProfile = {
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
export const PROFILES: ReferenceProfile[] = [
  fromHabit("kestrel", KESTREL),
  fromHabit("pellham", PELLHAM),
  fromHabit("vireo", VIREO),
  ALDERGROVE,
];
// Invented demo source codes (as in the demo seeder, marked demo there).
export const CODE = { [KESTREL]: "X31", [PELLHAM]: "X46" };

// ── A listed line and the buyer's report ────────────────────────────────────────
// Tester chart "new" value 1,600 for a 12AX7 section, as.
export const CHART = 1_600;
export const gm = (tubeNo: number, sections: number[], extra: Partial<TubeReading> = {}): TubeReading => ({
  tubeNo,
  measure: "gm",
  sections,
  chartNewValue: CHART,
  ...extra,
});

export function listing(over: Partial<ListingSide> = {}): ListingSide {
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
export const report = (over: Partial<BuyerReport> = {}): BuyerReport => ({
  tubes: 8,
  features: {},
  readings: [],
  ...over,
});
export const noCodes = { listing: null, buyer: null };
