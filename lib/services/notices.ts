import { QueryTypes } from "sequelize";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { emitTo } from "../realtime/emit";
import { userRoom, type LotLive } from "../realtime/events";
import { db, Notice, User } from "../../models";

/** At most one outbid e-mail per person per lot in this window; the in-app notice always arrives. */
export const OUTBID_MAIL_EVERY_MS = 15 * 60 * 1000;

/** Record an in-app notice and push it to the person's open pages. */
export async function notify(userId: string, text: string, href: string | null): Promise<void> {
  db();
  const n = await Notice.create({ userId, text: text.slice(0, 500), href });
  emitTo([userRoom(userId)], "notice.created", {
    id: n.id,
    text: n.text,
    ...(href ? { href } : {}),
    at: n.createdAt.toISOString(),
  });
}

/** Tell a dealer another is now ahead of them: always in the app, by e-mail at most once per lot per window. */
export async function notifyOutbid(userId: string, saleLotId: string, live: LotLive): Promise<void> {
  const s = db();
  const [title] = await s.query<{ title: string }>(
    `SELECT l.title FROM sale_lots sl JOIN lots l ON l.id = sl.lot_id WHERE sl.id = :saleLotId`,
    { replacements: { saleLotId }, type: QueryTypes.SELECT },
  );
  const href = `/sales/${live.saleId}/lots/${saleLotId}`;
  const text = `Another dealer is ahead on "${title?.title ?? "a lot"}": the price is ${formatCents(live.priceCents)}; a bid from ${formatCents(live.minimumCents)} takes the lead back if it passes their ceiling.`;
  await notify(userId, text, href);
  const due = await s.query<{ user_id: string }>(
    `INSERT INTO outbid_mail (user_id, sale_lot_id, last_sent_at) VALUES (:userId, :saleLotId, now())
     ON CONFLICT (user_id, sale_lot_id) DO UPDATE SET last_sent_at = now()
       WHERE outbid_mail.last_sent_at < now() - (:everyMs || ' milliseconds')::interval
     RETURNING user_id`,
    { replacements: { userId, saleLotId, everyMs: String(OUTBID_MAIL_EVERY_MS) }, type: QueryTypes.SELECT },
  );
  if (!due.length) return;
  const user = await User.findByPk(userId, { attributes: ["email", "displayName"] });
  if (!user) return;
  await sendMail({
    to: user.email,
    subject: `Another dealer is ahead: ${title?.title ?? "a lot"}`,
    text: `Hello ${user.displayName},\n\n${text}\n\nBid again: ${env().NEXTAUTH_URL}${href}\n\n(We send at most one of these per lot every ${OUTBID_MAIL_EVERY_MS / 60000} minutes; the lot page always shows the latest.)\n\nGetterline Exchange`,
  }).catch((e: Error) => console.error("[mail] outbid failed", e.message));
}

/** A person's latest notices. */
export async function listNotices(userId: string, limit = 30) {
  db();
  const rows = await Notice.findAll({ where: { userId }, order: [["createdAt", "DESC"]], limit });
  return rows.map((n) => ({
    id: n.id,
    text: n.text,
    href: n.href,
    read: Boolean(n.readAt),
    at: n.createdAt.toISOString(),
  }));
}

export async function markNoticesRead(userId: string): Promise<void> {
  db();
  await Notice.update({ readAt: new Date() }, { where: { userId, readAt: null } });
}
