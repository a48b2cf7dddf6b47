import type { Client } from "pg";
import type { BidOutcome, ProxyState } from "../auction/proxy";
import { db } from "../../models";
import type { BidRow } from "./bid-rows";
import type { SaleLotRow } from "./sale-lot-rows";

/** The lot row as the bid sees it under its lock, with the sale's clock and any earlier bid under this key. */
export type LockedLot = Pick<
  SaleLotRow,
  "id" | "sale_id" | "phase" | "closes_at" | "extension_count" | "seq" | "state" | "hammer_cents"
> & {
  starts_at: Date;
  soft_close_seconds: number;
  /** Extension cap frozen on the sale from its settings version (null = no cap). */
  max_extensions: number | null;
  db_now: Date;
  leader_paddle: number | null;
  /** The earlier bid under this key, if any (bids.seq, outcome, max_cents). */
  prior_seq: BidRow["seq"] | null;
  prior_outcome: BidRow["outcome"] | null;
  prior_max: BidRow["max_cents"] | null;
};

/** What an accepted bid writes: the lot's new state and the bid row, under the same lock. */
export type BidWrite = {
  seq: number;
  state: ProxyState;
  closesAt: Date;
  extensionCount: number;
  bidderId: string;
  maxCents: number;
  outcome: BidOutcome;
  key: string;
  placedAt: Date;
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
export async function withLotLock<T>(
  saleLotId: string,
  bidderId: string,
  key: string,
  decide: (row: LockedLot | undefined) => { write: BidWrite | null; result: T },
): Promise<T> {
  const manager = db().connectionManager;
  const client = (await manager.getConnection({ type: "write" })) as Client;
  const L = (v: string) => client.escapeLiteral(v);
  let open = false;
  try {
    open = true;
    const res = (await client.query(
      `BEGIN;
       SELECT sl.id, sl.sale_id, sl.phase, sl.closes_at, sl.extension_count, sl.seq, sl.state, sl.hammer_cents,
              s.starts_at, s.soft_close_seconds, s.max_extensions, now() AS db_now, p.number AS leader_paddle,
              b.seq AS prior_seq, b.outcome AS prior_outcome, b.max_cents AS prior_max
         FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id
         LEFT JOIN paddles p ON p.sale_id = sl.sale_id AND p.user_id = sl.leader_id
         LEFT JOIN bids b ON b.sale_lot_id = sl.id AND b.bidder_id = ${L(bidderId)} AND b.idempotency_key = ${L(key)}
        WHERE sl.id = ${L(saleLotId)} FOR UPDATE OF sl`,
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
