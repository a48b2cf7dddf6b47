/**
 * The lot summary dealers read first: tube count, families, test results,
 * vacuum loss, matched sets, attribution mix, hazards, designations to
 * review and an estimate range from comparable sales [CTP; SUG].
 */
import { gradeBatch, type BatchTube } from "../valves/grade-batch";
import type { TestMeasure } from "../valves/grading";
import { normaliseDesignation } from "../valves/designation";
import { estimateLot, type ComparableSale, type EstimateGroup, type LotEstimate } from "./estimate";
import { itemTubeCount, type AttributionBasis, type ItemCondition, type LotItem } from "./item";
import { lotHazardFlags, type LotHazardFlag } from "./lot-hazards";
import type { ReferenceTable } from "../valves/reference-table";
import { typeFamily, type TypeFamily } from "./type-family";

export { readingsVsNominal, nominalGmFromReference, type NominalPoint } from "./readings-chart";
export type { ComparableSale, LotEstimate } from "./estimate";

/** Options for summariseLot. */
export interface SummaryOptions {
  /** The house's reference table (families, hazards, designations to review). */
  reference: ReferenceTable;
  /** Tester chart "new" values by designation; a reading's own chart value wins. */
  chartNewValues?: Record<string, number>;
  /** Matching tolerance, % spread; pairs 5–10 % [CTP]. Default 5. */
  tolerancePct?: number;
  comparables: readonly ComparableSale[];
  /** Ignore comparable sales before this ISO date. */
  comparablesSince?: string;
}

/** Test outcome counts, in tubes. */
export interface TestCounts {
  tested: number;
  notTested: number;
  strong: number;
  good: number;
  fair: number;
  weak: number;
  /** Emission runs only pass or fail [CTP]. */
  emissionOk: number;
  reject: number;
  /** Tested, but no chart value (or an unusable reading) to grade against. */
  testedNotGraded: number;
}

/** One type family in the lot. */
export interface FamilySummary {
  key: string;
  label: string;
  tubes: number;
  /** Designations seen in the lot, normalised where possible. */
  designations: string[];
  tests: TestCounts;
  /** Disjoint matched pairs, and separately quads, among passing Gm readings: alternatives, not both. */
  pairs: number;
  quads: number;
  /** False when the quad search could not prove its count is the largest. */
  quadsProven: boolean;
}

/** The lot summary. */
export interface LotSummary {
  tubeCount: number;
  families: FamilySummary[];
  tests: TestCounts;
  /** Tubes with a white getter: an air leak, dead [CTP]. */
  vacuumLoss: number;
  matched: { pairs: number; quads: number; tolerancePct: number };
  /** Attribution mix in tubes. */
  attribution: Record<AttributionBasis, number>;
  hazards: LotHazardFlag[];
  unknownDesignations: {
    typed: string;
    normalised: string | null;
    tubes: number;
    itemIndexes: number[];
    candidates: string[];
  }[];
  estimate: LotEstimate;
  /** Tubes valued at zero in the estimate (graded reject or white getter). */
  zeroValuedTubes: number;
  /** Inconsistencies worth a look (more readings than quantity, conflicting chart values). */
  issues: string[];
}

const emptyCounts = (): TestCounts => ({
  tested: 0,
  notTested: 0,
  strong: 0,
  good: 0,
  fair: 0,
  weak: 0,
  emissionOk: 0,
  reject: 0,
  testedNotGraded: 0,
});

function addCounts(into: TestCounts, from: TestCounts): void {
  for (const k of Object.keys(into) as (keyof TestCounts)[]) into[k] += from[k];
}

function chartLookup(values: Record<string, number> | undefined, issues: string[]): Map<string, number> {
  const map = new Map<string, number>();
  for (const [name, value] of Object.entries(values ?? {})) {
    const n = normaliseDesignation(name);
    const key = n.ok ? n.value : name;
    const prev = map.get(key);
    if (prev !== undefined && prev !== value)
      issues.push(`chart values ${prev} and ${value} both given for ${key}; using ${prev}`);
    else map.set(key, value);
  }
  return map;
}

type UnknownDesignation = LotSummary["unknownDesignations"][number];

/** Running totals while the lot's items are read, one item at a time. */
interface ItemTally {
  tubeCount: number;
  vacuumLoss: number;
  attribution: Record<AttributionBasis, number>;
  families: Map<string, FamilySummary>;
  batches: Map<string, Batch>;
  unknown: Map<string, UnknownDesignation>;
  /** The family key of each item, by item index. */
  itemFamily: string[];
  issues: string[];
}

/** The family's summary so far, started empty the first time the family is seen. */
function familyEntry(families: Map<string, FamilySummary>, fam: TypeFamily): FamilySummary {
  const f = families.get(fam.key) ?? {
    key: fam.key,
    label: fam.label,
    tubes: 0,
    designations: [],
    tests: emptyCounts(),
    pairs: 0,
    quads: 0,
    quadsProven: true,
  };
  families.set(fam.key, f);
  return f;
}

/** Count an item whose designation is flagged unknown under the designation as shown. */
function noteUnknownDesignation(
  unknown: Map<string, UnknownDesignation>,
  d: LotItem["designation"],
  shown: string,
  tubes: number,
  itemIndex: number,
): void {
  const u = unknown.get(shown) ?? {
    typed: d.typed,
    normalised: d.normalised,
    tubes: 0,
    itemIndexes: [],
    candidates: d.candidates ?? [],
  };
  u.tubes += tubes;
  u.itemIndexes.push(itemIndex);
  unknown.set(shown, u);
}

/** Put each of the item's readings in its family-and-measure batch, with the chart value it is graded against. */
function batchReadings(
  batches: Map<string, Batch>,
  item: LotItem,
  itemIndex: number,
  familyKey: string,
  charts: ReadonlyMap<string, number>,
): void {
  const d = item.designation;
  item.readings.forEach((r, j) => {
    const chart = r.chartNewValue ?? (d.normalised ? charts.get(d.normalised) : undefined) ?? charts.get(familyKey);
    const batchKey = `${familyKey}\u0000${r.measure}`;
    const batch = batches.get(batchKey) ?? { familyKey, measure: r.measure, tubes: [] };
    batches.set(batchKey, batch);
    // A failed check rejects whatever the reading [CTP]; without a chart value,
    // grade on the failure alone rather than leave the tube "not graded".
    const failed = Boolean(r.shorts || r.leakage || r.gas || item.vacuumLoss);
    batch.tubes.push({
      id: `${itemIndex}:${j}`,
      sections: chart === undefined && failed ? [] : r.sections,
      ...(chart !== undefined ? { chartNewValue: chart } : {}),
      ...(r.plateCurrentMa !== undefined ? { plateCurrentMa: r.plateCurrentMa } : {}),
      shorts: r.shorts,
      leakage: r.leakage,
      gas: r.gas,
      vacuumLoss: item.vacuumLoss,
    });
  });
}

/** Add one item to the tally: its tubes, family, vacuum loss, attribution, unknown designation and readings. */
function tallyItem(
  tally: ItemTally,
  item: LotItem,
  i: number,
  reference: ReferenceTable,
  charts: ReadonlyMap<string, number>,
): void {
  const tubes = itemTubeCount(item);
  if (item.readings.length > item.quantity)
    tally.issues.push(
      `item ${i + 1}: ${item.readings.length} readings for a quantity of ${item.quantity}; counted as ${tubes} tubes`,
    );
  const d = item.designation;
  const fam = typeFamily(reference, d.normalised ?? d.typed);
  tally.itemFamily.push(fam.key);
  const f = familyEntry(tally.families, fam);
  f.tubes += tubes;
  const shown = d.normalised ?? d.typed;
  if (!f.designations.includes(shown)) f.designations.push(shown);
  f.tests.notTested += tubes - item.readings.length;
  tally.tubeCount += tubes;
  if (item.vacuumLoss) tally.vacuumLoss += tubes;
  tally.attribution[item.attributedMaker.basis] += tubes;
  if (d.status === "unknown-flagged") noteUnknownDesignation(tally.unknown, d, shown, tubes, i);
  batchReadings(tally.batches, item, i, fam.key, charts);
}

/**
 * Summarises a lot. Readings are graded with gradeBatch per type family and
 * measure; the chart value is the reading's own, else the chart value for its
 * designation, else for its family's lead designation. Readings with none
 * are "tested, not graded", unless a failed check (short, leakage, gas, white
 * getter) rejects them regardless of the reading [CTP]. Pairs and quads come from passing Gm readings of
 * one family. The estimate follows estimateLot's rule [SUG].
 */
export function summariseLot(items: readonly LotItem[], opts: SummaryOptions): LotSummary {
  const tolerancePct = opts.tolerancePct ?? 5;
  const issues: string[] = [];
  const charts = chartLookup(opts.chartNewValues, issues);
  const tally: ItemTally = {
    tubeCount: 0,
    vacuumLoss: 0,
    attribution: { "source-code-confirmed": 0, "construction-matched": 0, unconfirmed: 0 },
    families: new Map(),
    batches: new Map(),
    unknown: new Map(),
    itemFamily: [],
    issues,
  };
  items.forEach((item, i) => tallyItem(tally, item, i, opts.reference, charts));
  const { families, itemFamily, attribution } = tally;

  const rejectsByItem = gradeBatches(tally.batches, families, tolerancePct);
  const { groups, zeroValuedTubes } = estimateGroups(items, families, itemFamily, rejectsByItem);

  const tests = emptyCounts();
  const familyList = [...families.values()].sort((a, b) => b.tubes - a.tubes || a.key.localeCompare(b.key));
  for (const f of familyList) addCounts(tests, f.tests);
  return {
    tubeCount: tally.tubeCount,
    families: familyList,
    tests,
    vacuumLoss: tally.vacuumLoss,
    matched: {
      pairs: familyList.reduce((s, f) => s + f.pairs, 0),
      quads: familyList.reduce((s, f) => s + f.quads, 0),
      tolerancePct,
    },
    attribution,
    hazards: lotHazardFlags(opts.reference, items, itemTubeCount),
    unknownDesignations: [...tally.unknown.values()],
    estimate: estimateLot([...groups.values()], opts.comparables, { since: opts.comparablesSince }),
    zeroValuedTubes,
    issues,
  };
}

type Batch = { familyKey: string; measure: TestMeasure; tubes: BatchTube[] };

/** Grade each family's batch of like readings together; add the counts to the family and return rejects per item. */
function gradeBatches(
  batches: ReadonlyMap<string, Batch>,
  families: ReadonlyMap<string, FamilySummary>,
  tolerancePct: number,
): Map<number, number> {
  const rejectsByItem = new Map<number, number>();
  for (const batch of batches.values()) {
    const result = gradeBatch({ measure: batch.measure, tolerancePct, tubes: batch.tubes });
    const t = families.get(batch.familyKey)!.tests;
    t.tested += batch.tubes.length;
    t.strong += result.counts.strong;
    t.good += result.counts.good;
    t.fair += result.counts.fair;
    t.weak += result.counts.weak;
    t.emissionOk += result.counts["emission-ok"];
    t.reject += result.counts.reject;
    t.testedNotGraded += result.counts["not-graded"];
    for (const g of result.grades) {
      if (g.grade !== "reject") continue;
      const itemIndex = Number(g.id.split(":")[0]);
      rejectsByItem.set(itemIndex, (rejectsByItem.get(itemIndex) ?? 0) + 1);
    }
    const f = families.get(batch.familyKey)!;
    f.pairs += result.pairs?.sets.length ?? 0;
    f.quads += result.quads?.sets.length ?? 0;
    if (result.quads && !result.quads.proven) f.quadsProven = false;
  }
  return rejectsByItem;
}

/** Tubes worth pricing, grouped by family and condition; vacuum-lost and rejected tubes are valued at nothing. */
function estimateGroups(
  items: readonly LotItem[],
  families: ReadonlyMap<string, FamilySummary>,
  itemFamily: readonly string[],
  rejectsByItem: ReadonlyMap<number, number>,
): { groups: Map<string, EstimateGroup>; zeroValuedTubes: number } {
  const groups = new Map<string, EstimateGroup>();
  let zeroValuedTubes = 0;
  items.forEach((item, i) => {
    const tubes = itemTubeCount(item);
    const zero = item.vacuumLoss ? tubes : (rejectsByItem.get(i) ?? 0);
    zeroValuedTubes += zero;
    const f = families.get(itemFamily[i])!;
    const key = `${f.key}\u0000${item.condition}`;
    const g = groups.get(key) ?? {
      familyKey: f.key,
      familyLabel: f.label,
      condition: item.condition as ItemCondition,
      tubes: 0,
    };
    g.tubes += tubes - zero;
    groups.set(key, g);
  });
  return { groups, zeroValuedTubes };
}
