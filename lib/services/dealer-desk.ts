import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { standingOf, type Standing } from "../auction/standing";
import { db } from "../../models";
import type { BidRow } from "./bid-rows";
import type { SaleLotRow } from "./sale-lot-rows";
import { myCases } from "./disputes/cases";
import { watchlist } from "./sales";

export type DeskBid = {
  saleLotId: string;
  saleId: string;
  title: string;
  priceCents: number;
  bidCount: number;
  ceilingCents: number;
  standing: Standing;
  closesAt: string;
  phase: "open" | "sold" | "unsold" | "withdrawn";
};
export type DeskWin = {
  saleLotId: string;
  saleId: string;
  title: string;
  hammerCents: number;
  invoiceId: string | null;
  invoiceState: string | null;
  totalCents: number | null;
  dueAt: string | null;
};

/**
 * A dealer's evening on one page: lots they are bidding on (standing and
 * private ceiling), lots won with their invoice, invoices due, their claims
 * and the lots they follow. Each list is one query.
 */
export async function dealerDesk(viewer: Viewer) {
  const s = db();
  const bids = await s.query<
    Pick<SaleLotRow, "id" | "sale_id" | "price_cents" | "bid_count" | "closes_at" | "phase"> & {
      title: string;
      ceiling: BidRow["max_cents"];
      leading: boolean;
    }
  >(
    `SELECT sl.id, sl.sale_id, l.title, sl.price_cents, sl.bid_count, m.ceiling, (sl.leader_id = :me) AS leading, sl.closes_at, sl.phase
       FROM (SELECT sale_lot_id, MAX(max_cents) AS ceiling FROM bids WHERE bidder_id = :me AND retracted_at IS NULL GROUP BY sale_lot_id) m
       JOIN sale_lots sl ON sl.id = m.sale_lot_id JOIN lots l ON l.id = sl.lot_id
      WHERE sl.phase = 'open' OR sl.closed_at > now() - interval '2 days'
      ORDER BY (sl.phase = 'open') DESC, sl.closes_at LIMIT 200`,
    { replacements: { me: viewer.id }, type: QueryTypes.SELECT },
  );
  const wins = await s.query<
    Pick<SaleLotRow, "id" | "sale_id"> & {
      title: string;
      hammer_cents: NonNullable<SaleLotRow["hammer_cents"]>; // a sold lot has its hammer price
      invoice_id: string | null;
      state: string | null;
      total_cents: number | null;
      due_at: Date | null;
    }
  >(
    `SELECT sl.id, sl.sale_id, l.title, sl.hammer_cents, i.id AS invoice_id, i.state, i.total_cents, i.due_at
       FROM sale_lots sl JOIN lots l ON l.id = sl.lot_id LEFT JOIN invoices i ON i.sale_lot_id = sl.id
      WHERE sl.phase = 'sold' AND sl.buyer_id = :me ORDER BY sl.closed_at DESC LIMIT 100`,
    { replacements: { me: viewer.id }, type: QueryTypes.SELECT },
  );
  const won: DeskWin[] = wins.map((w) => ({
    saleLotId: w.id,
    saleId: w.sale_id,
    title: w.title,
    hammerCents: w.hammer_cents,
    invoiceId: w.invoice_id,
    invoiceState: w.state,
    totalCents: w.total_cents,
    dueAt: w.due_at?.toISOString() ?? null,
  }));
  return {
    bidding: bids.map((b): DeskBid => ({
      saleLotId: b.id,
      saleId: b.sale_id,
      title: b.title,
      priceCents: b.price_cents,
      bidCount: b.bid_count,
      ceilingCents: b.ceiling,
      standing: standingOf({ phase: b.phase, ownLot: false, bidding: true, leading: b.leading }),
      closesAt: b.closes_at.toISOString(),
      phase: b.phase,
    })),
    won,
    due: won.filter((w) => w.invoiceState === "awaiting-payment"),
    claims: await myCases(viewer),
    watching: await watchlist(viewer),
  };
}
