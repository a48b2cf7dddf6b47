/**
 * Data points for the small "readings against nominal Gm" chart on a lot.
 *
 * Illustrative only: testers use their own test points, so grades come from
 * the tester chart's "new" value, never from data-sheet figures [CTP]. The
 * chart only helps a dealer see the spread of a lot at a glance.
 */
import { findReferenceType, type ReferenceTable } from "../valves/reference-table";
import type { LotItem } from "./item";
import { typeFamily } from "./type-family";

/** One tube on the chart. */
export interface NominalPoint {
  itemIndex: number;
  tubeNo: number;
  designation: string;
  familyKey: string;
  /** Mean of the sections as % of the nominal Gm, one decimal. */
  percentOfNominal: number;
  /** Each section as % of the nominal Gm, one decimal. */
  sectionsPct: number[];
  /** Shorts, leakage, gas or white getter: shown, but marked. */
  failed: boolean;
}

/**
 * Nominal Gm in µmho from our reference table (per section, at the data
 * sheet's operating point), or undefined when we have no figure.
 */
export function nominalGmFromReference(table: ReferenceTable, designation: string): number | undefined {
  const c = findReferenceType(table, designation)?.row.characteristics;
  return c?.kind === "amplifier" ? c.gmMicromho : undefined;
}

const oneDecimal = (x: number) => Math.round(x * 10) / 10;

/**
 * One point per tube with a Gm reading and a nominal figure: each section and
 * their mean as % of nominal Gm. Emission and plate-current runs are left
 * out (not comparable with Gm [CTP]), as are types without a nominal figure.
 * Readings must be in µmho for the reference lookup to mean anything.
 */
export function readingsVsNominal(
  table: ReferenceTable,
  items: readonly LotItem[],
  nominalGm: (designation: string) => number | undefined = (d) => nominalGmFromReference(table, d),
): NominalPoint[] {
  const points: NominalPoint[] = [];
  items.forEach((item, itemIndex) => {
    const designation = item.designation.normalised;
    if (!designation) return;
    const nominal = nominalGm(designation);
    if (nominal === undefined || !(nominal > 0)) return;
    const familyKey = typeFamily(table, designation).key;
    for (const r of item.readings) {
      if (r.measure !== "gm" || r.sections.length === 0) continue;
      const pct = r.sections.map((s) => (s / nominal) * 100);
      points.push({
        itemIndex,
        tubeNo: r.tubeNo,
        designation,
        familyKey,
        percentOfNominal: oneDecimal(pct.reduce((a, b) => a + b, 0) / pct.length),
        sectionsPct: pct.map(oneDecimal),
        failed: Boolean(r.shorts || r.leakage || r.gas || item.vacuumLoss),
      });
    }
  });
  return points;
}
