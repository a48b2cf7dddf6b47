import { QueryTypes } from "sequelize";
import { comparablesFromSoldLots } from "../lots/comparables";
import { describeDesignation, type ItemCondition, type LotItem as DomainItem } from "../lots/item";
import {
  readingsVsNominal,
  summariseLot,
  type ComparableSale,
  type LotSummary,
  type NominalPoint,
} from "../lots/summary";
import type { HazardKind } from "../valves/index-types";
import { db } from "../../models";
import type { ItemView } from "./lots";
import { currentReferenceTable } from "./reference-table";
import type { ReferenceTable } from "../valves/reference-table";

/** A stored item as the pure summary code reads it. */
export function toDomainItem(table: ReferenceTable, i: ItemView): DomainItem {
  return {
    designation: describeDesignation(table, i.designationTyped),
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
 * Past sales to estimate from: our own sold lots of a single type family and
 * condition over the last two years (see lib/lots/comparables). Until there
 * are some the summary says "no comparables yet" rather than inventing a figure.
 */
const COMPARABLES_TTL_MS = 30_000;
let comparablesCache: { at: number; sales: Promise<ComparableSale[]> } | null = null;

/** The comparables, read at most every 30 s per process: every lot page and estimate uses them. */
export function comparableSales(): Promise<ComparableSale[]> {
  if (!comparablesCache || Date.now() - comparablesCache.at > COMPARABLES_TTL_MS) {
    const sales = readComparableSales();
    comparablesCache = { at: Date.now(), sales };
    sales.catch(() => {
      comparablesCache = null;
    });
  }
  return comparablesCache.sales;
}

/** Forget the cached comparables (a sale was invoiced or refunded; tests). */
export function forgetComparables(): void {
  comparablesCache = null;
}

async function readComparableSales(): Promise<ComparableSale[]> {
  const rows = await db().query<{
    lot_id: string;
    net: number;
    sold_at: Date;
    designation: string;
    condition: ItemCondition;
    quantity: number;
  }>(
    `SELECT i.lot_id, i.hammer_cents - i.hammer_refunded_cents AS net, i.created_at AS sold_at, li.designation, li.condition, li.quantity
       FROM invoices i JOIN lot_items li ON li.lot_id = i.lot_id
      WHERE i.state <> 'cancelled' AND i.state <> 'refunded' AND i.created_at > now() - interval '2 years'
      ORDER BY i.created_at DESC LIMIT 20000`,
    { type: QueryTypes.SELECT },
  );
  return comparablesFromSoldLots(
    await currentReferenceTable(),
    rows.map((r) => ({
      lotId: r.lot_id,
      netHammerCents: Number(r.net),
      soldAt: r.sold_at.toISOString(),
      designation: r.designation,
      condition: r.condition,
      quantity: r.quantity,
    })),
  );
}

/** The summary dealers read first, and the points for the readings-against-nominal chart. */
export async function summaryFor(items: ItemView[]): Promise<{ summary: LotSummary; chart: NominalPoint[] }> {
  const reference = await currentReferenceTable();
  const domain = items.map((i) => toDomainItem(reference, i));
  const summary = summariseLot(domain, { reference, comparables: await comparableSales(), tolerancePct: 5 });
  return { summary, chart: readingsVsNominal(reference, domain) };
}
