/** The house's retraction of a bid during a live lot. */
import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { applyBid, initialProxyState } from "../auction/proxy";
import { type LotLive } from "../realtime/events";
import { emitLot } from "../realtime/lot-emitter";
import { db } from "../../models";
import { liveFrom, type LiveSource } from "./live-lot";
import { paddlesOf } from "./paddles";
import type { BidRow } from "./bid-rows";

/**
 * The house retracts a bid, with the reason on record. The lot's state is
 * rebuilt from the remaining bids in sequence (a bid that no longer stands
 * alone is skipped), and the new state is broadcast.
 */
export async function retractBid(admin: Viewer, saleLotId: string, bidId: string, reason: string): Promise<LotLive> {
  const s = db();
  const row = await s.transaction(async (t) => {
    const [sl] = await s.query<LiveSource>(
      `SELECT id, sale_id, phase, seq, state, closes_at, hammer_cents FROM sale_lots WHERE id = :saleLotId FOR UPDATE`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!sl) throw new ApiError("not_found", "No such lot in a sale");
    if (sl.phase !== "open") throw new ApiError("conflict", "The lot has closed; bids can no longer be retracted");
    const [hit] = await s.query(
      `UPDATE bids SET retracted_at = now(), retracted_by = :admin, retract_reason = :reason WHERE id = :bidId AND sale_lot_id = :saleLotId AND retracted_at IS NULL RETURNING id`,
      { replacements: { admin: admin.id, reason, bidId, saleLotId }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!hit) throw new ApiError("not_found", "No such standing bid on this lot");
    const remaining = await s.query<Pick<BidRow, "bidder_id" | "max_cents" | "placed_at" | "seq">>(
      `SELECT bidder_id, max_cents, placed_at, seq FROM bids WHERE sale_lot_id = :saleLotId AND retracted_at IS NULL ORDER BY seq`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT, transaction: t },
    );
    let state = initialProxyState(sl.state.terms);
    for (const b of remaining) {
      const d = applyBid(state, {
        bidderId: b.bidder_id,
        maxCents: b.max_cents,
        placedAtMs: b.placed_at.getTime(),
        seq: b.seq,
      });
      if (d.accepted) state = d.state;
    }
    const seq = sl.seq + 1;
    await s.query(
      `UPDATE sale_lots SET state = :state::jsonb, seq = :seq, price_cents = :price, bid_count = :count, leader_id = :leader, reserve_met = :met, updated_at = now() WHERE id = :saleLotId`,
      {
        replacements: {
          state: JSON.stringify(state),
          seq,
          price: state.priceCents,
          count: state.bidCount,
          leader: state.leader?.bidderId ?? null,
          met: state.reserveMet,
          saleLotId,
        },
        transaction: t,
      },
    );
    return { ...sl, seq, state };
  });
  const leader = row.state.leader
    ? ((await paddlesOf(row.sale_id, [row.state.leader.bidderId]).catch(() => new Map<string, number>())).get(
        row.state.leader.bidderId,
      ) ?? null)
    : null;
  const live = liveFrom(row, leader);
  emitLot("lot.bid", live);
  return live;
}
