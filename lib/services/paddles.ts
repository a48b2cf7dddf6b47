import { QueryTypes } from "sequelize";
import { db } from "../../models";

/** Paddle numbers never change once given, so each process keeps the ones it has seen. */
const cache = new Map<string, number>();
const key = (saleId: string, userId: string) => `${saleId}:${userId}`;

/** The bidder's paddle number in a sale, given on first use (101, 102, …). */
export async function paddleFor(saleId: string, userId: string): Promise<number> {
  const hit = cache.get(key(saleId, userId));
  if (hit) return hit;
  // New bidders in one sale take their numbers one at a time (a transaction-scoped advisory lock
  // per sale), so two first bids at the same moment never reach for the same number.
  const number = await db().transaction(async (t) => {
    await db().query(`SELECT pg_advisory_xact_lock(hashtext(:saleId))`, { replacements: { saleId }, transaction: t });
    const rows = await db().query<{ number: number }>(
      `INSERT INTO paddles (sale_id, user_id, number, created_at)
       VALUES (:saleId, :userId, (SELECT coalesce(max(number), 100) + 1 FROM paddles WHERE sale_id = :saleId), now())
       ON CONFLICT (sale_id, user_id) DO UPDATE SET number = paddles.number
       RETURNING number`,
      { replacements: { saleId, userId }, type: QueryTypes.SELECT, transaction: t },
    );
    return rows[0]!.number;
  });
  cache.set(key(saleId, userId), number);
  return number;
}

/** Paddle numbers of several bidders in a sale. */
export async function paddlesOf(saleId: string, userIds: string[]): Promise<Map<string, number>> {
  const out = new Map<string, number>();
  const missing = userIds.filter((u) => {
    const hit = cache.get(key(saleId, u));
    if (hit) out.set(u, hit);
    return !hit;
  });
  if (missing.length) {
    const rows = await db().query<{ user_id: string; number: number }>(
      `SELECT user_id, number FROM paddles WHERE sale_id = :saleId AND user_id IN (:missing)`,
      { replacements: { saleId, missing }, type: QueryTypes.SELECT },
    );
    for (const r of rows) {
      cache.set(key(saleId, r.user_id), r.number);
      out.set(r.user_id, r.number);
    }
  }
  return out;
}
