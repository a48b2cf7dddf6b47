/**
 * Proxy (maximum) bidding as the trade runs it [CTP]: each bidder
 * enters a maximum; the shown price is min(top maximum, second maximum + one
 * increment at the second maximum's level); equal maxima go to the earlier
 * bid at that amount; a leader raising their maximum leaves the price alone
 * unless that raise meets the reserve; once the top maximum reaches the
 * reserve the price is at least the reserve; a lone bidder pays the opening
 * price (or the reserve, if their maximum reaches it).
 *
 * The state is a pure fold over accepted bids in sequence order, so
 * replaying the stored bids always rebuilds the same state. The leader's
 * maximum lives in the state: never send it to other bidders.
 */
import { assertLadder, incrementAt, nextMinimumBid, type IncrementLadder } from "./increments";
import { isBiddable, type LotPhase } from "./lot-phase";

/** A lot's bidding terms, fixed when the lot opens. */
export interface LotTerms {
  /** Lowest first bid, cents. */
  openingCents: number;
  /** Hidden minimum, cents, or null for none. */
  reserveCents: number | null;
  /** Increment ladder (house setting). */
  ladder: IncrementLadder;
  /** The consignor, who may not bid on their own lot. */
  consignorId: string;
}

/** A bidder's maximum; `seq` is the server's acceptance order and settles ties. */
export interface MaxBid {
  /** Who bid. */
  bidderId: string;
  /** Their maximum, whole cents. */
  maxCents: number;
  /** Server time the bid arrived, epoch ms (used for soft close and display). */
  placedAtMs: number;
  /** Strictly increasing sequence number per lot. */
  seq: number;
}

/** The bidding state of one lot. */
export interface ProxyState {
  /** The lot's terms. */
  terms: LotTerms;
  /** The leading bid (with its private maximum), or null before any bid. */
  leader: MaxBid | null;
  /** Shown price, cents; 0 before any bid. */
  priceCents: number;
  /** True when there is a leader whose maximum reaches the reserve (or there is no reserve). */
  reserveMet: boolean;
  /** Accepted bids so far. */
  bidCount: number;
  /** Sequence number of the last accepted bid, or null. */
  lastSeq: number | null;
}

/** Why a bid was refused (our own codes, shown to the bidder as plain sentences elsewhere). */
export type BidRefusal =
  | "lot-not-open" // the lot is scheduled, finished or withdrawn
  | "after-close" // the bid arrived at or after the closing time
  | "own-lot" // the consignor bid on their own lot
  | "invalid-amount" // not a positive whole number of cents
  | "below-minimum" // under the next minimum bid
  | "max-not-raised" // the leader entered a maximum no higher than their current one
  | "out-of-sequence"; // seq not above the last accepted bid's

/** What an accepted bid did. */
export type BidOutcome =
  | "first-bid" // the lot's first bid; the bidder leads
  | "new-leader" // the bidder's maximum beat the leader's
  | "outbid-by-proxy" // accepted, but the leader's maximum still wins
  | "max-raised"; // the leader raised their own maximum

/** The answer to an incoming bid. `minimumCents` is the minimum next bid after the decision. */
export type BidDecision =
  | { accepted: true; outcome: BidOutcome; state: ProxyState; minimumCents: number }
  | { accepted: false; reason: BidRefusal; state: ProxyState; minimumCents: number };

/** Where and when the bid is made (the service reads these from the lot row). */
export interface BidContext {
  /** The lot's phase now. */
  phase: LotPhase;
  /** The current closing time, epoch ms, if the lot has one. */
  closesAtMs?: number;
}

/** Lists what is wrong with lot terms (empty = valid): opening > 0, reserve null or ≥ opening, ladder valid. */
export function validateLotTerms(terms: LotTerms): string[] {
  const problems: string[] = [];
  if (!Number.isSafeInteger(terms.openingCents) || terms.openingCents <= 0) {
    problems.push("opening price must be whole cents > 0");
  }
  if (
    terms.reserveCents !== null &&
    (!Number.isSafeInteger(terms.reserveCents) || terms.reserveCents < terms.openingCents)
  ) {
    problems.push("reserve must be whole cents at or above the opening price (or none)");
  }
  try {
    assertLadder(terms.ladder);
  } catch (error) {
    problems.push((error as Error).message);
  }
  return problems;
}

/** The state of a lot with no bids. Throws if the terms are invalid. */
export function initialProxyState(terms: LotTerms): ProxyState {
  const problems = validateLotTerms(terms);
  if (problems.length > 0) throw new RangeError(`invalid lot terms: ${problems.join("; ")}`);
  return { terms, leader: null, priceCents: 0, reserveMet: false, bidCount: 0, lastSeq: null };
}

/** The lowest maximum a bidder may enter now (opening price, or price + one increment). */
export function minimumBidFor(state: ProxyState): number {
  return nextMinimumBid(
    { priceCents: state.priceCents, bidCount: state.bidCount, openingCents: state.terms.openingCents },
    state.terms.ladder,
  );
}

function withReserve(terms: LotTerms, leaderMax: number, price: number): { priceCents: number; reserveMet: boolean } {
  if (terms.reserveCents === null) return { priceCents: price, reserveMet: true };
  const reserveMet = leaderMax >= terms.reserveCents;
  return { priceCents: reserveMet ? Math.max(price, terms.reserveCents) : price, reserveMet };
}

function refuse(state: ProxyState, reason: BidRefusal): BidDecision {
  return { accepted: false, reason, state, minimumCents: minimumBidFor(state) };
}

/**
 * Applies the amount and sequence rules to one bid and folds it into the
 * state; phase, timing and own-lot checks are {@link placeBid}'s job.
 * A leader may raise their maximum to any amount above it that is at least
 * the next minimum bid; everyone else needs at least the next minimum.
 */
export function applyBid(state: ProxyState, bid: MaxBid): BidDecision {
  if (!Number.isSafeInteger(bid.placedAtMs)) throw new RangeError("placedAtMs must be whole epoch milliseconds");
  if (!Number.isSafeInteger(bid.maxCents) || bid.maxCents <= 0) return refuse(state, "invalid-amount");
  if (!Number.isSafeInteger(bid.seq) || (state.lastSeq !== null && bid.seq <= state.lastSeq)) {
    return refuse(state, "out-of-sequence");
  }
  const { terms, leader } = state;
  const isLeader = leader !== null && leader.bidderId === bid.bidderId;
  if (isLeader && bid.maxCents <= leader.maxCents) return refuse(state, "max-not-raised");
  if (bid.maxCents < minimumBidFor(state)) return refuse(state, "below-minimum");

  let outcome: BidOutcome;
  let nextLeader: MaxBid;
  let price: number;
  if (leader === null) {
    outcome = "first-bid";
    nextLeader = bid;
    price = terms.openingCents;
  } else if (isLeader) {
    outcome = "max-raised";
    nextLeader = bid;
    price = state.priceCents;
  } else if (bid.maxCents > leader.maxCents) {
    outcome = "new-leader";
    nextLeader = bid;
    price = Math.min(bid.maxCents, leader.maxCents + incrementAt(leader.maxCents, terms.ladder));
  } else {
    outcome = "outbid-by-proxy";
    nextLeader = leader;
    price = Math.min(leader.maxCents, bid.maxCents + incrementAt(bid.maxCents, terms.ladder));
  }
  const priced = withReserve(terms, nextLeader.maxCents, price);
  // [SUG] A leader raising their own maximum is private: it counts as a public bid only if it moved the price.
  const counts = outcome !== "max-raised" || priced.priceCents !== state.priceCents;
  const next: ProxyState = {
    terms,
    leader: nextLeader,
    ...priced,
    bidCount: state.bidCount + (counts ? 1 : 0),
    lastSeq: bid.seq,
  };
  return { accepted: true, outcome, state: next, minimumCents: minimumBidFor(next) };
}

/**
 * Decides an incoming bid: refuses it if the lot is not taking bids, the
 * bid is at or after the closing time, or the bidder is the consignor;
 * otherwise applies the amount rules ({@link applyBid}).
 */
export function placeBid(state: ProxyState, bid: MaxBid, context: BidContext): BidDecision {
  if (!isBiddable(context.phase)) return refuse(state, "lot-not-open");
  if (context.closesAtMs !== undefined && bid.placedAtMs >= context.closesAtMs) return refuse(state, "after-close");
  if (bid.bidderId === state.terms.consignorId) return refuse(state, "own-lot");
  return applyBid(state, bid);
}

/**
 * Rebuilds a lot's state from its accepted bids, taken in `seq` order
 * whatever order they are given in. Throws if any stored bid would now be
 * refused, since that means the bid history is inconsistent.
 */
export function replayBids(terms: LotTerms, bids: readonly MaxBid[]): ProxyState {
  const ordered = [...bids].sort((a, b) => a.seq - b.seq);
  return ordered.reduce((state, bid) => {
    const decision = applyBid(state, bid);
    if (!decision.accepted) throw new RangeError(`stored bid seq ${bid.seq} is refused on replay: ${decision.reason}`);
    return decision.state;
  }, initialProxyState(terms));
}
