import { QueryTypes } from "sequelize";
import { db } from "../../models";

/** Paddle numbers never change once given, so each process keeps the ones it has seen. */
const cache = new Map<string, number>();
const key = (saleId: string, userId: string) => `${saleId}:${userId}`;

/** The bidder's paddle number in a sale, given on first use (101, 102, …). */
export async function paddleFor(saleId: string, userId: string): Promise<number> {
  const hit = cache.get(key(saleId, userId));
  if (hit) return hit;
  for (let attempt = 0; attempt < 5; attempt++) {
    try {
      const rows = await db().query<{ number: number }>(
        `INSERT INTO paddles (sale_id, user_id, number, created_at)
         VALUES (:saleId, :userId, (SELECT coalesce(max(number), 100) + 1 FROM paddles WHERE sale_id = :saleId), now())
         ON CONFLICT (sale_id, user_id) DO UPDATE SET number = paddles.number
         RETURNING number`,
        { replacements: { saleId, userId }, type: QueryTypes.SELECT },
      );
      cache.set(key(saleId, userId), rows[0]!.number);
      return rows[0]!.number;
    } catch (e) {
      // Two new bidders took the same next number at once: try again.
      if ((e as { parent?: { code?: string } }).parent?.code !== "23505") throw e;
    }
  }
  throw new Error("could not give a paddle number");
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
