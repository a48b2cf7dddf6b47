import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { wantedDesignations, type WantCriteria } from "../catalogue/want-list";
import { MAX_WANT_LISTS, type WantListCreateInput } from "../validation/want-lists";
import { db } from "../../models";
import { currentReferenceTable } from "./reference-table";

export type WantList = {
  id: string;
  name: string;
  criteria: WantCriteria;
  designations: string[];
  paused: boolean;
  createdAt: string;
  hits: number;
  lastHitAt: string | null;
};

type Row = {
  id: string;
  name: string;
  criteria: WantCriteria;
  designations: string[];
  paused: boolean;
  created_at: Date;
  hits: string;
  last_hit_at: Date | null;
};

const present = (r: Row): WantList => ({
  id: r.id,
  name: r.name,
  criteria: r.criteria,
  designations: r.designations,
  paused: r.paused,
  createdAt: r.created_at.toISOString(),
  hits: Number(r.hits),
  lastHitAt: r.last_hit_at?.toISOString() ?? null,
});

const SELECT = `SELECT w.id, w.name, w.criteria, w.designations, w.paused, w.created_at,
                       (SELECT COUNT(*) FROM want_list_hits h WHERE h.want_list_id = w.id) AS hits,
                       (SELECT MAX(matched_at) FROM want_list_hits h WHERE h.want_list_id = w.id) AS last_hit_at
                  FROM want_lists w`;

/** The dealer's want lists, newest first. */
export async function listWantLists(viewer: Viewer): Promise<WantList[]> {
  const rows = await db().query<Row>(`${SELECT} WHERE w.dealer_id = :me ORDER BY w.created_at DESC`, {
    replacements: { me: viewer.id },
    type: QueryTypes.SELECT,
  });
  return rows.map(present);
}

/**
 * Save a want list. The designations it wants are worked out now from the equivalents table, so matching a
 * new lot is one indexed look-up. At most MAX_WANT_LISTS per dealer, counted under a per-dealer lock.
 */
export async function createWantList(viewer: Viewer, input: WantListCreateInput): Promise<WantList> {
  const criteria: WantCriteria = { ...input.criteria };
  const wanted = [...wantedDesignations(criteria, await currentReferenceTable()).keys()];
  if (!wanted.length)
    throw new ApiError("validation_failed", "Not a type we know", {
      "criteria.designation": "Not a type we know: check the designation, or ask the house to add it to the reference",
    });
  const id = randomUUID();
  await db().transaction(async (t) => {
    await db().query(`SELECT pg_advisory_xact_lock(hashtext('want-lists:' || :me))`, {
      replacements: { me: viewer.id },
      transaction: t,
    });
    const [{ n }] = (await db().query<{ n: string }>(`SELECT COUNT(*) AS n FROM want_lists WHERE dealer_id = :me`, {
      replacements: { me: viewer.id },
      type: QueryTypes.SELECT,
      transaction: t,
    })) as [{ n: string }];
    if (Number(n) >= MAX_WANT_LISTS) {
      throw new ApiError(
        "conflict",
        `You keep ${MAX_WANT_LISTS} want lists, the most one dealer may keep. Delete one you no longer need, or widen one to cover more types.`,
        undefined,
        undefined,
        { limit: MAX_WANT_LISTS },
      );
    }
    await db().query(
      `INSERT INTO want_lists (id, dealer_id, name, criteria, designations, max_estimate_cents, paused, created_at, updated_at)
       VALUES (:id, :me, :name, :criteria::jsonb, ARRAY[:wanted]::varchar[], :maxEst, false, now(), now())`,
      {
        replacements: {
          id,
          me: viewer.id,
          name: input.name,
          criteria: JSON.stringify(criteria),
          wanted,
          maxEst: criteria.maxEstimateCents,
        },
        transaction: t,
      },
    );
  });
  const [row] = await db().query<Row>(`${SELECT} WHERE w.id = :id`, { replacements: { id }, type: QueryTypes.SELECT });
  return present(row!);
}

async function ownList(viewer: Viewer, id: string): Promise<void> {
  const [row] = await db().query<{ dealer_id: string }>(`SELECT dealer_id FROM want_lists WHERE id = :id`, {
    replacements: { id },
    type: QueryTypes.SELECT,
  });
  if (!row || row.dealer_id !== viewer.id) throw new ApiError("not_found", "No such want list");
}

/** Pause, resume or rename one of the dealer's lists. */
export async function updateWantList(
  viewer: Viewer,
  id: string,
  patch: { name?: string; paused?: boolean },
): Promise<WantList> {
  await ownList(viewer, id);
  await db().query(
    `UPDATE want_lists SET name = COALESCE(:name, name), paused = COALESCE(:paused, paused), updated_at = now() WHERE id = :id`,
    { replacements: { id, name: patch.name ?? null, paused: patch.paused ?? null } },
  );
  const [row] = await db().query<Row>(`${SELECT} WHERE w.id = :id`, { replacements: { id }, type: QueryTypes.SELECT });
  return present(row!);
}

export async function deleteWantList(viewer: Viewer, id: string): Promise<void> {
  await ownList(viewer, id);
  await db().query(`DELETE FROM want_lists WHERE id = :id`, { replacements: { id } });
}
