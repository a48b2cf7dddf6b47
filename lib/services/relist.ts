import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { emitTo } from "../realtime/emit";
import { userRoom } from "../realtime/events";
import { db } from "../../models";

/**
 * The consignor of a lot that closed unsold (or was withdrawn) asks the house
 * to offer it in a later sale. Every house account gets an in-app notice
 * linking to the sale form; asking again after the same close adds nothing.
 */
export async function askToRelist(viewer: Viewer, lotId: string): Promise<{ asked: true; notified: number }> {
  const s = db();
  const [lot] = await s.query<{ title: string; consignor_id: string; phase: string | null; closed_at: Date | null }>(
    `SELECT l.title, l.consignor_id, sl.phase, sl.closed_at FROM lots l
       LEFT JOIN LATERAL (SELECT phase, closed_at FROM sale_lots WHERE lot_id = l.id ORDER BY created_at DESC LIMIT 1) sl ON true
      WHERE l.id = :lotId`,
    { replacements: { lotId }, type: QueryTypes.SELECT },
  );
  if (!lot || lot.consignor_id !== viewer.id) throw new ApiError("not_found", "No such lot");
  if (lot.phase !== "unsold" && lot.phase !== "withdrawn")
    throw new ApiError("conflict", "Only a lot that closed without a sale can be offered again", undefined, {
      phase: lot.phase ?? "not offered",
    });
  const href = `/house/sales/new`;
  const text = `${viewer.name} asks for "${lot.title}" to be offered in a later sale.`;
  // One insert per house account, its id derived from the lot and its close: asking again (a retry, a second tab) adds nothing.
  const rows = await s.query<{ id: string; user_id: string; created_at: Date }>(
    `INSERT INTO notices (id, user_id, text, href, created_at)
     SELECT md5(:seed || u.id)::uuid, u.id, :text, :href, now() FROM users u
      WHERE 'admin' = ANY(u.roles)
     ON CONFLICT (id) DO NOTHING
     RETURNING id, user_id, created_at`,
    {
      replacements: { seed: `relist:${lotId}:${lot.closed_at?.toISOString() ?? ""}:`, text, href },
      type: QueryTypes.SELECT,
    },
  );
  for (const r of rows)
    emitTo([userRoom(r.user_id)], "notice.created", { id: r.id, text, href, at: r.created_at.toISOString() });
  return { asked: true, notified: rows.length };
}
