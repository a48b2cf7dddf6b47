import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { lotStage, netProceeds, proceedsBySale, STAGE_WORDS, type LotStage } from "../lots/lifecycle";
import { db } from "../../models";

export type ConsignedLot = {
  id: string;
  title: string;
  stage: LotStage;
  stageWords: string;
  tubes: number;
  lines: number;
  updatedAt: string;
  sale: {
    id: string;
    title: string;
    saleLotId: string;
    priceCents: number;
    bidCount: number;
    reserveMet: boolean;
    closesAt: string;
    hammerCents: number | null;
  } | null;
  invoice: { id: string; state: string } | null;
  netCents: number | null;
  claimId: string | null;
};

type Row = {
  id: string;
  title: string;
  state: string;
  updated_at: Date;
  lines: string;
  tubes: string | null;
  sale_lot_id: string | null;
  sale_id: string | null;
  sale_title: string | null;
  starts_at: Date | null;
  phase: "open" | "sold" | "unsold" | "withdrawn" | null;
  price_cents: number | null;
  bid_count: number | null;
  reserve_met: boolean | null;
  closes_at: Date | null;
  hammer_cents: number | null;
  invoice_id: string | null;
  invoice_state: string | null;
  inv_hammer: number | null;
  commission_cents: number | null;
  hammer_refunded_cents: number | null;
  commission_returned_cents: number | null;
  claim_id: string | null;
  claim_open: boolean | null;
};

/**
 * Every lot a consignor has handed us, in one view and one query: where it
 * is in its life (lib/lots/lifecycle), its sale figures while live, its
 * invoice, any claim, and net proceeds per lot and per sale.
 */
export async function consignorDesk(viewer: Viewer) {
  const rows = await db().query<Row>(
    `SELECT l.id, l.title, l.state, l.updated_at,
            (SELECT COUNT(*) FROM lot_items WHERE lot_id = l.id) AS lines, (SELECT SUM(quantity) FROM lot_items WHERE lot_id = l.id) AS tubes,
            sl.id AS sale_lot_id, sl.sale_id, s.title AS sale_title, s.starts_at, sl.phase, sl.price_cents, sl.bid_count, sl.reserve_met, sl.closes_at, sl.hammer_cents,
            i.id AS invoice_id, i.state AS invoice_state, i.hammer_cents AS inv_hammer, i.commission_cents, i.hammer_refunded_cents, i.commission_returned_cents,
            d.id AS claim_id, (d.state IS NOT NULL AND d.state <> 'closed') AS claim_open
       FROM lots l
       LEFT JOIN LATERAL (SELECT id, sale_id, phase, price_cents, bid_count, reserve_met, closes_at, hammer_cents FROM sale_lots WHERE lot_id = l.id ORDER BY created_at DESC LIMIT 1) sl ON true
       LEFT JOIN sales s ON s.id = sl.sale_id
       LEFT JOIN LATERAL (SELECT id, state, hammer_cents, commission_cents, hammer_refunded_cents, commission_returned_cents FROM invoices WHERE sale_lot_id = sl.id ORDER BY created_at DESC LIMIT 1) i ON true
       LEFT JOIN LATERAL (SELECT id, state FROM disputes WHERE invoice_id = i.id ORDER BY created_at DESC LIMIT 1) d ON true
      WHERE l.consignor_id = :me ORDER BY COALESCE(sl.closes_at, l.updated_at) DESC LIMIT 500`,
    { replacements: { me: viewer.id }, type: QueryTypes.SELECT },
  );
  const now = Date.now();
  const lots: ConsignedLot[] = rows.map((r) => {
    const stage = lotStage({
      lotState: r.state,
      sale: r.phase ? { phase: r.phase, startsAtMs: r.starts_at!.getTime() } : null,
      invoiceState: r.invoice_state,
      claimOpen: Boolean(r.claim_open),
      nowMs: now,
    });
    const netCents = r.invoice_id
      ? netProceeds({
          hammerCents: r.inv_hammer ?? 0,
          commissionCents: r.commission_cents ?? 0,
          hammerRefundedCents: r.hammer_refunded_cents ?? 0,
          commissionReturnedCents: r.commission_returned_cents ?? 0,
          cancelled: r.invoice_state === "cancelled",
        })
      : null;
    return {
      id: r.id,
      title: r.title,
      stage,
      stageWords: STAGE_WORDS[stage],
      lines: Number(r.lines),
      tubes: Number(r.tubes ?? 0),
      updatedAt: r.updated_at.toISOString(),
      sale: r.sale_lot_id
        ? {
            id: r.sale_id!,
            title: r.sale_title!,
            saleLotId: r.sale_lot_id,
            priceCents: r.price_cents ?? 0,
            bidCount: r.bid_count ?? 0,
            reserveMet: Boolean(r.reserve_met),
            closesAt: r.closes_at!.toISOString(),
            hammerCents: r.hammer_cents,
          }
        : null,
      invoice: r.invoice_id ? { id: r.invoice_id, state: r.invoice_state! } : null,
      netCents,
      claimId: r.claim_open ? r.claim_id : null,
    };
  });
  const bySale = proceedsBySale(lots.map((l) => ({ saleId: l.sale?.id ?? null, netCents: l.netCents })));
  const sales = [...bySale.entries()].map(([id, netCents]) => ({
    id,
    title: lots.find((l) => l.sale?.id === id)!.sale!.title,
    netCents,
  }));
  return { lots, sales };
}
