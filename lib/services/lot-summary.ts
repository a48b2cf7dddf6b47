import { describeDesignation, type LotItem as DomainItem } from "../lots/item";
import { readingsVsNominal, summariseLot, type ComparableSale, type LotSummary, type NominalPoint } from "../lots/summary";
import type { HazardKind } from "../valves/index-types";
import type { ItemView } from "./lots";

/** A stored item as the pure summary code reads it. */
export function toDomainItem(i: ItemView): DomainItem {
  return {
    designation: describeDesignation(i.designationTyped),
    quantity: i.quantity,
    labelBrand: i.labelBrand || null,
    attributedMaker: { makerName: i.makerName, basis: i.makerBasis },
    codes: { ...(i.sourceCode ? { source: i.sourceCode } : {}), ...(i.dateCode ? { date: i.dateCode } : {}) },
    construction: i.features,
    condition: i.condition,
    vacuumLoss: i.vacuumLoss,
    defects: i.defects,
    hazards: i.hazards as HazardKind[],
    readings: i.readings,
  };
}

/**
 * Past sales to estimate from. Until the house has sold lots there are none,
 * and the summary says "no comparables yet" rather than inventing a figure.
 */
export async function comparableSales(): Promise<ComparableSale[]> {
  return [];
}

/** The summary dealers read first, and the points for the readings-against-nominal chart. */
export async function summaryFor(items: ItemView[]): Promise<{ summary: LotSummary; chart: NominalPoint[] }> {
  const domain = items.map(toDomainItem);
  const summary = summariseLot(domain, { comparables: await comparableSales(), tolerancePct: 5 });
  return { summary, chart: readingsVsNominal(domain) };
}
