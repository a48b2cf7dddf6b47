import { createHmac, timingSafeEqual } from "node:crypto";
import { QueryTypes } from "sequelize";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { meetsWantList, wantedDesignations, type ItemForMatching, type WantCriteria } from "../catalogue/want-list";
import { jobId, queue, QUEUES } from "../jobs/queue";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { db } from "../../models";
import { notify } from "./notices";
import { currentReferenceTable } from "./reference-table";

/** Why a lot is matched: it became visible, or it was offered in a sale. */
export type MatchReason = "approved" | "scheduled";

/**
 * Ask for a lot to be matched against every want list, as a durable job (the house's click does not wait for
 * it). The job's id is derived from the lot and the reason, so asking twice queues it once. Without a queue
 * (scripts, tests) the match runs in the background of this process.
 */
export async function requestWantListMatch(lotId: string, reason: MatchReason): Promise<void> {
  const boss = queue();
  if (boss) {
    await boss.send(QUEUES.wantListMatch, { lotId, reason }, { id: jobId("want-list-match", lotId, reason) });
    return;
  }
  void matchLotToWantLists(lotId).catch((e: Error) => console.error("[want-lists] match failed", e.message));
}

type LotRow = { id: string; title: string; state: string; estimate_low_cents: number | null };
export type WantListHit = { id: string; dealerId: string; summary: string };

/** A list's wanted designations depend only on its type, reach and the reference table: worked out once each. */
const wantedMemo = new Map<string, ReturnType<typeof wantedDesignations>>();
function wantedFor(c: WantCriteria, table: Awaited<ReturnType<typeof currentReferenceTable>>) {
  const key = `${table.revision}|${c.designation}|${c.closeness}`;
  let w = wantedMemo.get(key);
  if (!w) {
    if (wantedMemo.size > 5_000) wantedMemo.clear();
    w = wantedDesignations(c, table);
    wantedMemo.set(key, w);
  }
  return w;
}

/**
 * The want lists a lot meets: candidates by an indexed overlap of designations, then each list's own rule
 * (quantity, condition, basis, white getters, estimate). Reads only.
 */
export async function findWantListHits(lotId: string): Promise<WantListHit[]> {
  const [lot] = await db().query<LotRow>(`SELECT id, title, state, estimate_low_cents FROM lots WHERE id = :lotId`, {
    replacements: { lotId },
    type: QueryTypes.SELECT,
  });
  if (!lot || lot.state !== "approved") return [];
  const items = await db().query<ItemForMatching & { designation: string }>(
    `SELECT designation, quantity, condition, maker_basis AS "makerBasis", vacuum_loss AS "vacuumLoss" FROM lot_items WHERE lot_id = :lotId`,
    { replacements: { lotId }, type: QueryTypes.SELECT },
  );
  const designations = [...new Set(items.map((i) => i.designation))];
  if (!designations.length) return [];
  const candidates = await db().query<{ id: string; dealer_id: string; name: string; criteria: WantCriteria }>(
    `SELECT id, dealer_id, name, criteria FROM want_lists
      WHERE NOT paused AND designations && ARRAY[:designations]::varchar[] AND (max_estimate_cents IS NULL OR :estLow::int IS NULL OR max_estimate_cents >= :estLow::int)`,
    { replacements: { designations, estLow: lot.estimate_low_cents }, type: QueryTypes.SELECT },
  );
  const hits: WantListHit[] = [];
  const table = await currentReferenceTable();
  for (const c of candidates) {
    const { matched, tubes } = meetsWantList(c.criteria, wantedFor(c.criteria, table), {
      estimateLowCents: lot.estimate_low_cents,
      items,
    });
    if (matched)
      hits.push({
        id: c.id,
        dealerId: c.dealer_id,
        summary: `"${lot.title}": ${tubes} tube${tubes === 1 ? "" : "s"} for your want list "${c.name}"`.slice(0, 300),
      });
  }
  return hits;
}

/**
 * Match one lot against every active want list (findWantListHits) and record the hits: once per lot per list
 * (primary key), so concurrent or repeated runs notify once; each new hit is an in-app notice at once, and the
 * dealer's daily digest carries it by e-mail. Returns the want lists newly matched.
 */
export async function matchLotToWantLists(lotId: string): Promise<string[]> {
  const hits = await findWantListHits(lotId);
  if (!hits.length) return [];
  const values = hits.map((_, i) => `(:w${i}, :lotId, :d${i}, :s${i}, now())`).join(", ");
  const replacements: Record<string, unknown> = { lotId };
  hits.forEach((h, i) => {
    replacements[`w${i}`] = h.id;
    replacements[`d${i}`] = h.dealerId;
    replacements[`s${i}`] = h.summary;
  });
  const fresh = await db().query<{ want_list_id: string; dealer_id: string; summary: string }>(
    `INSERT INTO want_list_hits (want_list_id, lot_id, dealer_id, summary, matched_at) VALUES ${values}
     ON CONFLICT (want_list_id, lot_id) DO NOTHING RETURNING want_list_id, dealer_id, summary`,
    { replacements, type: QueryTypes.SELECT },
  );
  for (const h of fresh)
    await notify(h.dealer_id, `Want list match: ${h.summary}.`, `/lots/${lotId}`).catch(() => undefined);
  for (const dealerId of new Set(fresh.map((h) => h.dealer_id)))
    await sendDigestIfDue(dealerId).catch((e: Error) => console.error("[want-lists] digest failed", e.message));
  return fresh.map((h) => h.want_list_id);
}

/** How often a dealer may be e-mailed a digest: once a day at most. */
export const DIGEST_EVERY_HOURS = 24;

/**
 * E-mail the dealer their unmailed want-list hits, unless a digest went out in the last day or they opted
 * out. The day's slot is claimed by one guarded update, so two instances never both send.
 */
export async function sendDigestIfDue(dealerId: string): Promise<boolean> {
  const [pending] = await db().query<{ n: string }>(
    `SELECT COUNT(*) AS n FROM want_list_hits WHERE dealer_id = :dealerId AND mailed_at IS NULL`,
    { replacements: { dealerId }, type: QueryTypes.SELECT },
  );
  if (!Number(pending?.n)) return false;
  await db().query(`INSERT INTO want_list_mail (dealer_id) VALUES (:dealerId) ON CONFLICT DO NOTHING`, {
    replacements: { dealerId },
  });
  const [claimed] = await db().query<{ dealer_id: string }>(
    `UPDATE want_list_mail SET last_digest_at = now() WHERE dealer_id = :dealerId AND digest_enabled
        AND (last_digest_at IS NULL OR last_digest_at < now() - (:hours || ' hours')::interval) RETURNING dealer_id`,
    { replacements: { dealerId, hours: String(DIGEST_EVERY_HOURS) }, type: QueryTypes.SELECT },
  );
  if (!claimed) return false;
  const hits = await db().query<{
    lot_id: string;
    summary: string;
    estimate_low_cents: number | null;
    estimate_high_cents: number | null;
  }>(
    `UPDATE want_list_hits h SET mailed_at = now() FROM lots l
      WHERE h.dealer_id = :dealerId AND h.mailed_at IS NULL AND l.id = h.lot_id
      RETURNING h.lot_id, h.summary, l.estimate_low_cents, l.estimate_high_cents`,
    { replacements: { dealerId }, type: QueryTypes.SELECT },
  );
  const [dealer] = await db().query<{ email: string; display_name: string }>(
    `SELECT email, display_name FROM users WHERE id = :dealerId`,
    { replacements: { dealerId }, type: QueryTypes.SELECT },
  );
  if (!dealer || !hits.length) return false;
  const base = env().NEXTAUTH_URL;
  const lines = hits.map(
    (h) =>
      `- ${h.summary}${h.estimate_low_cents ? ` (estimate ${formatCents(h.estimate_low_cents)}–${formatCents(h.estimate_high_cents ?? h.estimate_low_cents)})` : ""}\n  ${base}/lots/${h.lot_id}`,
  );
  const unsubscribe = `${base}/want-lists/unsubscribe?u=${dealerId}&t=${unsubscribeToken(dealerId)}`;
  await sendMail({
    to: dealer.email,
    subject: `Want lists: ${hits.length} new lot${hits.length === 1 ? "" : "s"} for you`,
    text: `Hello ${dealer.display_name},\n\nNew lots match your want lists:\n\n${lines.join("\n")}\n\nYour want lists: ${base}/dealer/want-lists\n\nWe send at most one of these a day; the notices in Getterline come at once.\nStop these e-mails (no sign-in needed): ${unsubscribe}\n\nGetterline Exchange`,
    headers: { "List-Unsubscribe": `<${unsubscribe}>` },
  });
  return true;
}

/** Send every digest that is due (a scheduled job: catches hits whose digest had to wait for the day to pass). */
export async function digestSweep(): Promise<number> {
  const dealers = await db().query<{ dealer_id: string }>(
    `SELECT DISTINCT dealer_id FROM want_list_hits WHERE mailed_at IS NULL LIMIT 500`,
    { type: QueryTypes.SELECT },
  );
  let n = 0;
  for (const d of dealers) if (await sendDigestIfDue(d.dealer_id).catch(() => false)) n++;
  return n;
}

/** The digest's stop link: an HMAC of the dealer's id under the app's secret, so nobody can forge one for another. */
export function unsubscribeToken(dealerId: string): string {
  return createHmac("sha256", env().NEXTAUTH_SECRET).update(`want-list-digest:${dealerId}`).digest("base64url");
}

/** Stop the dealer's digests from the link in one, without signing in. A forged or altered link is refused. */
export async function unsubscribeDigest(dealerId: string, token: string): Promise<void> {
  const expected = Buffer.from(unsubscribeToken(dealerId));
  const given = Buffer.from(token);
  if (given.length !== expected.length || !timingSafeEqual(given, expected))
    throw new ApiError(
      "forbidden",
      "This link is not valid: use the link from the e-mail as it is, or sign in and pause your want lists",
    );
  await db().query(
    `INSERT INTO want_list_mail (dealer_id, digest_enabled) VALUES (:dealerId, false) ON CONFLICT (dealer_id) DO UPDATE SET digest_enabled = false`,
    { replacements: { dealerId } },
  );
}

/** Start this process's want-list worker and the cluster-wide digest schedule. */
export async function startWantListWorker(): Promise<void> {
  const boss = queue();
  if (!boss) throw new Error("start the job queue first");
  await boss.work<{ lotId: string }>(
    QUEUES.wantListMatch,
    { pollingIntervalSeconds: 0.5, batchSize: 5 },
    async (jobs) => {
      for (const job of jobs) await matchLotToWantLists(job.data.lotId);
    },
  );
  await boss.work(QUEUES.wantListDigest, { pollingIntervalSeconds: 5 }, async () => {
    await digestSweep();
  });
  await boss.schedule(QUEUES.wantListDigest, "*/15 * * * *");
}
