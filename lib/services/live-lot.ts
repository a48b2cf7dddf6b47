import { minimumBidFor, type ProxyState } from "../auction/proxy";
import type { LotLive } from "../realtime/events";

/** The row fields the live presenter reads. */
export type LiveSource = {
  id: string;
  sale_id: string;
  phase: LotLive["phase"];
  seq: number;
  state: ProxyState;
  closes_at: Date;
  hammer_cents: number | null;
};

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
