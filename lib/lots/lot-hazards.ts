/**
 * Hazard flags for a whole lot: the union of each type's own hazards (from
 * hazardsForType: mercury vapour, radioactive sources, beryllium oxide) and
 * the hazards consignors declared, with the types that carry each. High
 * voltage and glass apply to every valve, so they are shown once by the
 * caution strip rather than flagged per lot.
 */
import { hazardsForType, type HazardNotice } from "../valves/hazards";
import type { ReferenceTable } from "../valves/reference-table";
import type { HazardKind } from "../valves/index-types";
import type { LotItem } from "./item";

/** One hazard present in the lot. */
export interface LotHazardFlag {
  kind: HazardKind;
  title: string;
  caution: string;
  source: string;
  /** Types carrying it, sorted, each with how sure we are. */
  types: { designation: string; certainty: HazardNotice["certainty"] }[];
  /** Tubes of those types in the lot. */
  tubes: number;
}

const CERTAINTY_ORDER: Readonly<Record<HazardNotice["certainty"], number>> = {
  always: 0,
  known: 1,
  declared: 2,
  possible: 3,
};

/**
 * Hazard flags for the items, in a fixed kind order. `tubesOf` gives the
 * tube count of an item (quantity, or more readings than quantity).
 */
export function lotHazardFlags(
  table: ReferenceTable,
  items: readonly LotItem[],
  tubesOf: (item: LotItem) => number,
): LotHazardFlag[] {
  const flags = new Map<HazardKind, LotHazardFlag & { byType: Map<string, HazardNotice["certainty"]> }>();
  for (const item of items) {
    const designation = item.designation.normalised ?? item.designation.typed;
    const report = hazardsForType(table, designation, item.hazards);
    for (const n of report.notices) {
      if (n.certainty === "always") continue;
      let flag = flags.get(n.kind);
      if (!flag) {
        flag = {
          kind: n.kind,
          title: n.title,
          caution: n.caution,
          source: n.source,
          types: [],
          tubes: 0,
          byType: new Map(),
        };
        flags.set(n.kind, flag);
      }
      const prev = flag.byType.get(designation);
      // A type's own listing outranks a declaration; "possible" is the weakest.
      if (!prev || CERTAINTY_ORDER[n.certainty] < CERTAINTY_ORDER[prev]) flag.byType.set(designation, n.certainty);
      flag.tubes += tubesOf(item);
    }
  }
  const order: HazardKind[] = ["mercury-vapour", "radioactive", "beryllium-oxide", "high-voltage", "glass"];
  return [...flags.values()]
    .sort((a, b) => order.indexOf(a.kind) - order.indexOf(b.kind))
    .map(({ byType, ...flag }) => ({
      ...flag,
      types: [...byType.entries()]
        .sort(([a], [b]) => a.localeCompare(b))
        .map(([designation, certainty]) => ({ designation, certainty })),
    }));
}
