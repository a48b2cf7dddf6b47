import type { Client } from "pg";
import type { BidOutcome, ProxyState } from "../auction/proxy";
import type { LotLive } from "../realtime/events";
import { db } from "../../models";

/** The lot row as the bid sees it under its lock, with the sale's clock and any earlier bid under this key. */
export type LockedLot = {
  id: string; sale_id: string; phase: LotLive["phase"]; closes_at: Date; extension_count: number; seq: number; state: ProxyState;
  hammer_cents: number | null; starts_at: Date; soft_close_seconds: number; db_now: Date; leader_paddle: number | null;
  prior_seq: number | null; prior_outcome: BidOutcome | null; prior_max: number | null;
};

/** What an accepted bid writes: the lot's new state and the bid row, under the same lock. */
export type BidWrite = {
  seq: number; state: ProxyState; closesAt: Date; extensionCount: number;
  bidderId: string; maxCents: number; outcome: BidOutcome; key: string; placedAt: Date;
};

const int = (n: number) => {
  if (!Number.isSafeInteger(n)) throw new RangeError("not a whole number");
  return String(n);
};

/**
 * The bid's transaction in two round trips on a raw pg client: BEGIN with
 * the locking read, then the writes with COMMIT (or ROLLBACK). The row lock
 * is held for one round trip plus the pure decision, not four as through the
 * ORM. Values are inlined as escaped literals (multi-statement simple queries
 * take no parameters); every one is a UUID, a validated key, a whole number,
 * a timestamp or our own JSON.
 */
/** The read both paths share: the lot, its sale's clock, the leader's paddle and any earlier bid under this key. */
const READ = (L: (v: string) => string, saleLotId: string, bidderId: string, key: string) => `
       SELECT sl.id, sl.sale_id, sl.phase, sl.closes_at, sl.extension_count, sl.seq, sl.state, sl.hammer_cents,
              s.starts_at, s.soft_close_seconds, now() AS db_now, p.number AS leader_paddle,
              b.seq AS prior_seq, b.outcome AS prior_outcome, b.max_cents AS prior_max
         FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id
         LEFT JOIN paddles p ON p.sale_id = sl.sale_id AND p.user_id = sl.leader_id
         LEFT JOIN bids b ON b.sale_lot_id = sl.id AND b.bidder_id = ${L(bidderId)} AND b.idempotency_key = ${L(key)}
        WHERE sl.id = ${L(saleLotId)}`;

async function withClient<T>(fn: (client: Client) => Promise<T>): Promise<T> {
  const manager = db().connectionManager;
  const client = (await manager.getConnection({ type: "write" })) as Client;
  try {
    return await fn(client);
  } finally {
    manager.releaseConnection(client as never);
  }
}

/** The lot as it is now, without a lock (for the optimistic path and for refusals that stay true). */
export async function readLot(saleLotId: string, bidderId: string, key: string): Promise<LockedLot | undefined> {
  return withClient(async (client) => (await client.query<LockedLot>(READ((v) => client.escapeLiteral(v), saleLotId, bidderId, key))).rows[0]);
}

/**
 * Write an accepted bid in one statement and one round trip, only if the lot
 * has not moved since it was read (same seq, still open, not yet closed):
 * the row is locked just for the statement. "moved" asks the caller to read
 * again; "duplicate" means this key was written meanwhile (a retry racing itself).
 */
export async function writeIfUnchanged(saleLotId: string, write: BidWrite): Promise<"written" | "moved" | "duplicate"> {
  const st = write.state;
  return withClient(async (client) => {
    try {
      const r = await client.query(
        `WITH u AS (
           UPDATE sale_lots SET seq = $2, state = $3::jsonb, price_cents = $4, bid_count = $5, leader_id = $6, reserve_met = $7,
                  closes_at = $8, extension_count = $9, updated_at = now()
            WHERE id = $1 AND seq = $2 - 1 AND phase = 'open' AND closes_at > now() RETURNING id)
         INSERT INTO bids (sale_lot_id, seq, bidder_id, max_cents, price_after_cents, outcome, idempotency_key, placed_at)
         SELECT $1, $2, $10, $11, $4, $12, $13, $14 FROM u RETURNING seq`,
        [saleLotId, write.seq, JSON.stringify(st), st.priceCents, st.bidCount, st.leader?.bidderId ?? null, st.reserveMet,
          write.closesAt, write.extensionCount, write.bidderId, write.maxCents, write.outcome, write.key, write.placedAt],
      );
      return r.rowCount ? "written" : "moved";
    } catch (e) {
      if ((e as { code?: string }).code === "23505") return "duplicate";
      throw e;
    }
  });
}

export async function withLotLock<T>(saleLotId: string, bidderId: string, key: string, decide: (row: LockedLot | undefined) => { write: BidWrite | null; result: T }): Promise<T> {
  const manager = db().connectionManager;
  const client = (await manager.getConnection({ type: "write" })) as Client;
  const L = (v: string) => client.escapeLiteral(v);
  let open = false;
  try {
    open = true;
    const res = (await client.query(
      `BEGIN; ${READ(L, saleLotId, bidderId, key)} FOR UPDATE OF sl`,
    )) as unknown as { rows: LockedLot[] }[];
    const { write, result } = decide(res[1]?.rows[0]);
    if (!write) {
      await client.query("ROLLBACK");
      open = false;
      return result;
    }
    const st = write.state;
    await client.query(
      `UPDATE sale_lots SET seq = ${int(write.seq)}, state = ${L(JSON.stringify(st))}::jsonb, price_cents = ${int(st.priceCents)}, bid_count = ${int(st.bidCount)},
              leader_id = ${st.leader ? L(st.leader.bidderId) : "NULL"}, reserve_met = ${st.reserveMet ? "true" : "false"},
              closes_at = ${L(write.closesAt.toISOString())}::timestamptz, extension_count = ${int(write.extensionCount)}, updated_at = now()
        WHERE id = ${L(saleLotId)};
       INSERT INTO bids (sale_lot_id, seq, bidder_id, max_cents, price_after_cents, outcome, idempotency_key, placed_at)
       VALUES (${L(saleLotId)}, ${int(write.seq)}, ${L(write.bidderId)}, ${int(write.maxCents)}, ${int(st.priceCents)}, ${L(write.outcome)}, ${L(write.key)}, ${L(write.placedAt.toISOString())}::timestamptz);
       COMMIT`,
    );
    open = false;
    return result;
  } catch (e) {
    if (open) await client.query("ROLLBACK").catch(() => undefined);
    throw e;
  } finally {
    manager.releaseConnection(client as never);
  }
}
