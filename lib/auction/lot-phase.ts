/**
 * The phases a lot passes through in a live sale (our own names), the moves
 * allowed between them, and the decision taken when bidding closes.
 */

/**
 * - scheduled: listed, bidding not yet open
 * - open: taking bids before its closing time
 * - extended: taking bids after soft close moved its closing time
 * - sold: closed with the reserve met; the leader buys at the shown price
 * - unsold: closed with no bids or with the reserve not met
 * - withdrawn: taken out of the sale by the house
 */
export const LOT_PHASES = ["scheduled", "open", "extended", "sold", "unsold", "withdrawn"] as const;

/** One of {@link LOT_PHASES}. */
export type LotPhase = (typeof LOT_PHASES)[number];

const MOVES: Readonly<Record<LotPhase, readonly LotPhase[]>> = {
  scheduled: ["open", "withdrawn"],
  open: ["extended", "sold", "unsold", "withdrawn"],
  extended: ["sold", "unsold", "withdrawn"],
  sold: [],
  unsold: [],
  withdrawn: [],
};

/** True while the lot takes bids (open or extended). */
export function isBiddable(phase: LotPhase): boolean {
  return phase === "open" || phase === "extended";
}

/** True once the lot's sale is decided (sold, unsold or withdrawn). */
export function isFinished(phase: LotPhase): boolean {
  return MOVES[phase].length === 0;
}

/** Whether the house may move a lot from `from` to `to`. Finished phases never change. */
export function canMove(from: LotPhase, to: LotPhase): boolean {
  return MOVES[from].includes(to);
}

/** What {@link closeOutcome} needs from the bidding state (the proxy state satisfies it). */
export interface CloseInput {
  /** Leading bidder, if any. */
  leader: { bidderId: string } | null;
  /** Shown price, cents. */
  priceCents: number;
  /** Whether the leader's maximum reaches the reserve (or there is none). */
  reserveMet: boolean;
}

/** The result of closing a lot. */
export type CloseOutcome =
  | { phase: "sold"; buyerId: string; hammerCents: number }
  | { phase: "unsold"; reason: "no-bids" | "reserve-not-met"; highBidCents: number | null };

/**
 * Decides a closing lot [CTP]: sold to the leader at the current
 * shown price if the reserve is met, otherwise unsold — "no-bids", or
 * "reserve-not-met" with the highest shown price for the consignor's report.
 */
export function closeOutcome(state: CloseInput): CloseOutcome {
  if (state.leader === null) return { phase: "unsold", reason: "no-bids", highBidCents: null };
  if (!state.reserveMet) return { phase: "unsold", reason: "reserve-not-met", highBidCents: state.priceCents };
  return { phase: "sold", buyerId: state.leader.bidderId, hammerCents: state.priceCents };
}
