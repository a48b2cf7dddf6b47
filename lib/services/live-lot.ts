import { minimumBidFor } from "../auction/proxy";
import type { LotLive } from "../realtime/events";
import type { SaleLotRow } from "./sale-lot-rows";

/** The sale_lots columns the live presenter reads. */
export type LiveSource = Pick<SaleLotRow, "id" | "sale_id" | "phase" | "seq" | "state" | "closes_at" | "hammer_cents">;

/** The public state of a lot from its row (never the leader's maximum). */
export function liveFrom(r: LiveSource, leaderPaddle: number | null, extended = false): LotLive {
  return {
    saleLotId: r.id,
    saleId: r.sale_id,
    seq: r.seq,
    phase: r.phase,
    priceCents: r.state.priceCents,
    bidCount: r.state.bidCount,
    leaderPaddle,
    reserveMet: r.state.reserveMet,
    minimumCents: minimumBidFor(r.state),
    closesAt: r.closes_at.toISOString(),
    extended,
    hammerCents: r.hammer_cents,
  };
}
