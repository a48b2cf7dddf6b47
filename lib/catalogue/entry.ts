/**
 * What a lot adds up to for the catalogue: the types, families, conditions, maker bases, grade bands,
 * hazards and matched sets a search filters on, from the lot's items and the summary dealers already read
 * (lib/lots/summary). Pure.
 */
import type { LotItem } from "../lots/item";
import type { LotSummary } from "../lots/summary";

export type CatalogueAggregate = {
  tubes: number;
  designations: string[];
  families: string[];
  conditions: string[];
  makerBases: string[];
  grades: string[];
  hazards: string[];
  tested: boolean;
  vacuumLossTubes: number;
  pairs: number;
  quads: number;
};

/** Hazards a buyer filters on; high voltage applies to every valve in use and is not a filter. */
const FILTERED_HAZARDS = new Set(["beryllium-oxide", "radioactive", "mercury-vapour", "glass"]);
const BANDS = ["strong", "good", "fair", "weak"] as const;

const sorted = (xs: Iterable<string>) => [...new Set(xs)].sort();

export function aggregateLot(items: readonly LotItem[], summary: LotSummary): CatalogueAggregate {
  return {
    tubes: summary.tubeCount,
    designations: sorted(items.map((i) => i.designation.normalised).filter((d): d is string => Boolean(d))),
    families: sorted(summary.families.map((f) => f.key)),
    conditions: sorted(items.map((i) => i.condition)),
    makerBases: sorted(
      Object.entries(summary.attribution)
        .filter(([, tubes]) => tubes > 0)
        .map(([basis]) => basis),
    ),
    grades: BANDS.filter((b) => summary.tests[b] > 0),
    hazards: sorted(summary.hazards.map((h) => h.kind).filter((k) => FILTERED_HAZARDS.has(k))),
    tested: summary.tests.tested > 0,
    vacuumLossTubes: summary.vacuumLoss,
    pairs: summary.families.reduce((n, f) => n + f.pairs, 0),
    quads: summary.families.reduce((n, f) => n + f.quads, 0),
  };
}
