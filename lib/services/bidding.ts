import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import {
  minimumBidFor,
  placeBid,
  type BidDecision,
  type BidOutcome,
  type BidRefusal,
  type ProxyState,
} from "../auction/proxy";
import { extendOnBid } from "../auction/soft-close";
import { type LotLive } from "../realtime/events";
import { beginLotWrite, finishLotWrite } from "../realtime/lot-emitter";
import { db } from "../../models";
import { withLotLock, type BidWrite, type LockedLot } from "./bid-lock";
import { scheduleClose } from "./close-schedule";
import type { BidRow } from "./bid-rows";
import { liveFrom, type LiveSource } from "./live-lot";
import { queueOutbidNotice } from "./outbid-notices";
import { paddleFor, paddlesOf } from "./paddles";
import type { SaleLotRow } from "./sale-lot-rows";

/** Refusals in words a dealer reads. */
export const REFUSAL_WORDS: Record<BidRefusal | "not-started", string> = {
  "lot-not-open": "This lot is not taking bids.",
  "after-close": "The lot closed before your bid arrived.",
  "own-lot": "You cannot bid on your own lot.",
  "invalid-amount": "Enter a whole amount in dollars and cents.",
  "below-minimum": "Your maximum is below the next minimum bid.",
  "max-not-raised": "You already lead; a new maximum must be higher than your current one.",
  "out-of-sequence": "Another bid was placed at the same moment; please try again.",
  "not-started": "The sale has not started yet.",
};

export type BidResult =
  | {
      accepted: true;
      outcome: BidOutcome;
      seq: number;
      live: LotLive;
      yourMaxCents: number;
      leading: boolean;
      replayed: boolean;
    }
  | { accepted: false; reason: BidRefusal | "not-started"; message: string; minimumCents: number; live: LotLive };

const saleOf = new Map<string, string>();

/** The sale a sale-lot belongs to, remembered per process (a lot never changes sale). */
async function saleIdOf(saleLotId: string): Promise<string> {
  let saleId = saleOf.get(saleLotId);
  if (!saleId) {
    const r = await db().query<Pick<SaleLotRow, "sale_id">>(`SELECT sale_id FROM sale_lots WHERE id = :saleLotId`, {
      replacements: { saleLotId },
      type: QueryTypes.SELECT,
    });
    if (!r[0]) throw new ApiError("not_found", "No such lot in a sale");
    saleId = r[0].sale_id;
    saleOf.set(saleLotId, saleId);
  }
  return saleId;
}

/** The paddle number of whoever leads in this state, or null when nobody does. */
async function leaderPaddleIn(saleId: string, state: ProxyState): Promise<number | null> {
  return state.leader ? ((await paddlesOf(saleId, [state.leader.bidderId])).get(state.leader.bidderId) ?? null) : null;
}

/**
 * Refuse without the lock a fresh maximum that is already below the minimum (null = go on to the lock).
 * Most refusals need no lock: the minimum only rises between bids (a house retraction bumps the
 * lot's seq, and every bid is checked again under the lock), so a maximum below the minimum read
 * without locking is below it now. Retries of an accepted bid are answered from the log instead.
 */
async function refuseBelowMinimumUnlocked(
  viewer: Viewer,
  saleId: string,
  saleLotId: string,
  maxCents: number,
  idempotencyKey: string,
): Promise<BidResult | null> {
  const [peek] = await db().query<LiveSource & { prior_seq: BidRow["seq"] | null }>(
    `SELECT sl.id, sl.sale_id, sl.phase, sl.closes_at, sl.seq, sl.state, sl.hammer_cents,
            (SELECT seq FROM bids WHERE sale_lot_id = sl.id AND bidder_id = :bidder AND idempotency_key = :key) AS prior_seq
       FROM sale_lots sl WHERE sl.id = :saleLotId`,
    { replacements: { saleLotId, bidder: viewer.id, key: idempotencyKey }, type: QueryTypes.SELECT },
  );
  if (
    !peek ||
    !(
      peek.prior_seq == null &&
      peek.phase === "open" &&
      peek.state.leader?.bidderId !== viewer.id &&
      maxCents < minimumBidFor(peek.state)
    )
  )
    return null;
  const leader = await leaderPaddleIn(saleId, peek.state);
  return {
    accepted: false,
    reason: "below-minimum",
    message: REFUSAL_WORDS["below-minimum"],
    minimumCents: minimumBidFor(peek.state),
    live: liveFrom(peek, leader),
  };
}

/** What the locked decision came to: refused, a replay of an earlier bid under the same key, or accepted. */
type LockedDecision =
  | { kind: "refused"; row: LockedLot; reason: BidRefusal | "not-started"; minimumCents: number }
  | { kind: "replayed"; row: LockedLot; prior: { seq: number; outcome: BidOutcome; max_cents: number } }
  | {
      kind: "accepted";
      row: LockedLot;
      outcome: BidOutcome;
      seq: number;
      previousLeader: string | null;
      previousLeaderPaddle: number | null;
      extended: boolean;
    };

/** An accepted bid under the lock: the soft-close clock moved if late, and the lot row and bid row to write. */
function acceptUnderLock(
  row: LockedLot,
  decision: Extract<BidDecision, { accepted: true }>,
  previousLeader: string | null,
  nowMs: number,
  bidderId: string,
  maxCents: number,
  idempotencyKey: string,
): { write: BidWrite; result: LockedDecision } {
  const clock = extendOnBid({ closesAtMs: row.closes_at.getTime(), extensionCount: row.extension_count }, nowMs, {
    windowSeconds: row.soft_close_seconds,
    maxExtensions: row.max_extensions,
  });
  const next = decision.state;
  const seq = row.seq + 1;
  return {
    write: {
      seq,
      state: next,
      closesAt: new Date(clock.closesAtMs),
      extensionCount: clock.extensionCount,
      bidderId,
      maxCents,
      outcome: decision.outcome,
      key: idempotencyKey,
      placedAt: row.db_now,
    },
    result: {
      kind: "accepted",
      outcome: decision.outcome,
      seq,
      previousLeader,
      previousLeaderPaddle: row.leader_paddle,
      extended: clock.extended,
      row: { ...row, seq, state: next, closes_at: new Date(clock.closesAtMs) },
    },
  };
}

/**
 * The pure decision taken while the lot's row is locked: replay, refuse, or accept the bid with the next
 * seq and any soft-close extension; an accepted bid also says what to write before the commit.
 */
function decideUnderLock(
  row: LockedLot | undefined,
  bidderId: string,
  maxCents: number,
  idempotencyKey: string,
): { write: BidWrite | null; result: LockedDecision } {
  if (!row) throw new ApiError("not_found", "No such lot in a sale");
  if (row.prior_seq != null)
    return {
      write: null,
      result: {
        kind: "replayed",
        row,
        prior: { seq: row.prior_seq, outcome: row.prior_outcome!, max_cents: row.prior_max! },
      },
    };
  const nowMs = row.db_now.getTime();
  if (nowMs < row.starts_at.getTime())
    return {
      write: null,
      result: { kind: "refused", row, reason: "not-started", minimumCents: minimumBidFor(row.state) },
    };
  const previousLeader = row.state.leader?.bidderId ?? null;
  const decision = placeBid(
    row.state,
    { bidderId, maxCents, placedAtMs: nowMs, seq: row.seq + 1 },
    { phase: row.phase, closesAtMs: row.closes_at.getTime() },
  );
  if (!decision.accepted)
    return {
      write: null,
      result: { kind: "refused", row, reason: decision.reason, minimumCents: decision.minimumCents },
    };
  return acceptUnderLock(row, decision, previousLeader, nowMs, bidderId, maxCents, idempotencyKey);
}

/**
 * Decide and write under the lot's row lock (lib/services/bid-lock) in one round trip, bracketed so that
 * the broadcast of an accepted bid leaves in seq order with this process's other writes of the lot.
 */
async function decideAndWriteLocked(
  viewer: Viewer,
  saleLotId: string,
  maxCents: number,
  idempotencyKey: string,
  paddle: number,
): Promise<{ done: LockedDecision; live: LotLive | null }> {
  beginLotWrite(saleLotId);
  let done: LockedDecision;
  let live: LotLive | null = null;
  try {
    done = await withLotLock<LockedDecision>(saleLotId, viewer.id, idempotencyKey, (row) =>
      decideUnderLock(row, viewer.id, maxCents, idempotencyKey),
    );
    if (done.kind === "accepted") {
      // The new leader is the bidder or the one before: both paddles are known, so nothing is awaited between commit and broadcast.
      const leaderId = done.row.state.leader!.bidderId;
      live = liveFrom(done.row, leaderId === viewer.id ? paddle : done.previousLeaderPaddle, done.extended);
    }
  } finally {
    finishLotWrite(saleLotId, live ? { kind: "lot.bid", live } : null);
  }
  return { done, live };
}

/** After commit: reschedule a moved close, queue the outbid notice, and answer the bidder. */
function answerAccepted(
  viewer: Viewer,
  saleLotId: string,
  maxCents: number,
  done: Extract<LockedDecision, { kind: "accepted" }>,
  live: LotLive,
): BidResult {
  const leaderId = done.row.state.leader!.bidderId;
  if (done.extended)
    void scheduleClose(saleLotId, done.row.closes_at).catch((e: Error) =>
      console.error("[close] reschedule failed", e.message),
    );
  // The bidder hears about a proxy outbid in this answer; the notice is for a leader who lost the lead.
  const outbid = done.previousLeader && done.previousLeader !== leaderId ? done.previousLeader : null;
  if (outbid)
    void queueOutbidNotice(outbid, live).catch((e: Error) => console.error("[notice] outbid failed", e.message));
  return {
    accepted: true,
    outcome: done.outcome,
    seq: done.seq,
    live,
    yourMaxCents: maxCents,
    leading: leaderId === viewer.id,
    replayed: false,
  };
}

/**
 * Place a maximum bid. One transaction takes the lot's row lock, decides
 * with the pure rules, appends the bid with the next sequence number and
 * moves the close on a late bid; only after commit is it broadcast. The same
 * idempotency key from the same bidder returns the first answer.
 */
export async function placeMaxBid(
  viewer: Viewer,
  saleLotId: string,
  maxCents: number,
  idempotencyKey: string,
): Promise<BidResult> {
  const saleId = await saleIdOf(saleLotId);
  const paddle = await paddleFor(saleId, viewer.id);
  const early = await refuseBelowMinimumUnlocked(viewer, saleId, saleLotId, maxCents, idempotencyKey);
  if (early) return early;

  const { done, live } = await decideAndWriteLocked(viewer, saleLotId, maxCents, idempotencyKey, paddle);
  if (done.kind === "refused") {
    const leader = await leaderPaddleIn(saleId, done.row.state);
    return {
      accepted: false,
      reason: done.reason,
      message: REFUSAL_WORDS[done.reason],
      minimumCents: done.minimumCents,
      live: liveFrom(done.row, leader),
    };
  }
  if (done.kind === "replayed") {
    const leader = await leaderPaddleIn(saleId, done.row.state);
    return {
      accepted: true,
      outcome: done.prior.outcome,
      seq: done.prior.seq,
      live: liveFrom(done.row, leader),
      yourMaxCents: done.prior.max_cents,
      leading: done.row.state.leader?.bidderId === viewer.id,
      replayed: true,
    };
  }
  return answerAccepted(viewer, saleLotId, maxCents, done, live!);
}
