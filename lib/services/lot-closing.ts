import { QueryTypes } from "sequelize";
import { closeOutcome } from "../auction/lot-phase";
import { env } from "../config/env";
import { queue, QUEUES } from "../jobs/queue";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { emitLot } from "../realtime/lot-emitter";
import { db, User } from "../../models";
import { scheduleClose } from "./close-schedule";
import { liveFrom } from "./live-lot";
import { lotChanged } from "./catalogue/events";
import { invoiceSoldLot } from "./invoices";
import { notify } from "./notices";
import { startOutbidWorker } from "./outbid-notices";
import { paddlesOf } from "./paddles";
import type { SaleLotRow } from "./sale-lot-rows";

type Closing = Pick<
  SaleLotRow,
  "id" | "sale_id" | "lot_id" | "phase" | "seq" | "state" | "closes_at" | "hammer_cents" | "consignor_id"
> & { due: boolean };

/**
 * Close a lot exactly once. Under the row lock: a lot already closed is left
 * alone; a lot whose close was extended is rescheduled; otherwise it is sold
 * to the leader at the shown price, or left unsold. Mail and broadcasts
 * follow the commit. Safe to run any number of times, from any instance.
 */
export async function closeSaleLot(
  saleLotId: string,
): Promise<"closed" | "already-closed" | "rescheduled" | "missing"> {
  const s = db();
  const result = await s.transaction(async (t) => {
    const [row] = await s.query<Closing>(
      `SELECT id, sale_id, lot_id, phase, seq, state, closes_at, hammer_cents, consignor_id, closes_at <= now() AS due
         FROM sale_lots WHERE id = :saleLotId FOR UPDATE`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!row) return { kind: "missing" as const };
    if (row.phase !== "open") return { kind: "already-closed" as const };
    if (!row.due) return { kind: "rescheduled" as const, closesAt: row.closes_at };
    const outcome = closeOutcome(row.state);
    const phase = outcome.phase;
    await s.query(
      `UPDATE sale_lots SET phase = :phase, closed_at = now(), buyer_id = :buyer, hammer_cents = :hammer, unsold_reason = :reason, seq = seq + 1, updated_at = now()
        WHERE id = :saleLotId`,
      {
        replacements: {
          phase,
          saleLotId,
          buyer: outcome.phase === "sold" ? outcome.buyerId : null,
          hammer: outcome.phase === "sold" ? outcome.hammerCents : null,
          reason: outcome.phase === "unsold" ? outcome.reason : null,
        },
        transaction: t,
      },
    );
    return {
      kind: "closed" as const,
      row: { ...row, phase, seq: row.seq + 1, hammer_cents: outcome.phase === "sold" ? outcome.hammerCents : null },
      outcome,
    };
  });
  if (result.kind === "rescheduled") {
    await scheduleClose(saleLotId, result.closesAt);
    return "rescheduled";
  }
  if (result.kind !== "closed") return result.kind;
  const { row, outcome } = result;
  const leaderId = row.state.leader?.bidderId;
  const paddle = leaderId
    ? ((await paddlesOf(row.sale_id, [leaderId]).catch(() => new Map<string, number>())).get(leaderId) ?? null)
    : null;
  emitLot("lot.closed", liveFrom(row, paddle));
  await lotChanged(row.lot_id, "closed");
  if (outcome.phase === "sold")
    await invoiceSoldLot(row.id).catch((e: Error) => console.error("[invoice] failed; the sweeper retries", e.message));
  await closingMail(row, outcome).catch((e: Error) => console.error("[mail] closing notice failed", e.message));
  return "closed";
}

async function closingMail(row: Closing, outcome: ReturnType<typeof closeOutcome>): Promise<void> {
  const s = db();
  const [lot] = await s.query<{ title: string }>(`SELECT title FROM lots WHERE id = :id`, {
    replacements: { id: row.lot_id },
    type: QueryTypes.SELECT,
  });
  const title = lot?.title ?? "your lot";
  const base = env().NEXTAUTH_URL;
  const consignor = await User.findByPk(row.consignor_id, { attributes: ["email", "displayName"] });
  if (outcome.phase === "sold") {
    const buyer = await User.findByPk(outcome.buyerId, { attributes: ["id", "email", "displayName"] });
    const href = `/sales/${row.sale_id}/lots/${row.id}`;
    if (buyer) {
      await notify(buyer.id, `You won "${title}" at ${formatCents(outcome.hammerCents)}.`, href);
      await sendMail({
        to: buyer.email,
        subject: `You won: ${title}`,
        text: `Hello ${buyer.displayName},\n\nYou won "${title}" with a hammer price of ${formatCents(outcome.hammerCents)}. The invoice follows separately.\n\n${base}${href}\n\nGetterline Exchange`,
      });
    }
    await notify(
      row.consignor_id,
      `"${title}" sold for ${formatCents(outcome.hammerCents)}. Settlement follows payment and inspection.`,
      "/consignor",
    );
    if (consignor)
      await sendMail({
        to: consignor.email,
        subject: `Sold: ${title}`,
        text: `Hello ${consignor.displayName},\n\nYour lot "${title}" sold for ${formatCents(outcome.hammerCents)} (hammer price). Settlement follows once the buyer has paid and inspected the tubes.\n\nGetterline Exchange`,
      });
  } else if (consignor) {
    await notify(row.consignor_id, `"${title}" closed unsold.`, "/consignor");
    const why =
      outcome.reason === "no-bids"
        ? "it drew no bids"
        : `the reserve was not met (highest bid ${formatCents(outcome.highBidCents ?? 0)})`;
    await sendMail({
      to: consignor.email,
      subject: `Unsold: ${title}`,
      text: `Hello ${consignor.displayName},\n\nYour lot "${title}" closed unsold: ${why}. The house will talk with you about offering it again.\n\nGetterline Exchange`,
    });
  }
}

/** Every open lot already due: queue its close (a lost or late job is caught here). */
export async function sweepDueLots(): Promise<number> {
  const due = await db().query<Pick<SaleLotRow, "id" | "closes_at">>(
    `SELECT id, closes_at FROM sale_lots WHERE phase = 'open' AND closes_at <= now() ORDER BY closes_at LIMIT 200`,
    { type: QueryTypes.SELECT },
  );
  for (const d of due) await scheduleClose(d.id, d.closes_at);
  // A sold lot whose invoice was not written (a crash between the two) is invoiced now.
  const uninvoiced = await db().query<Pick<SaleLotRow, "id">>(
    `SELECT sl.id FROM sale_lots sl WHERE sl.phase = 'sold' AND NOT EXISTS (SELECT 1 FROM invoices i WHERE i.sale_lot_id = sl.id) LIMIT 50`,
    { type: QueryTypes.SELECT },
  );
  for (const u of uninvoiced) await invoiceSoldLot(u.id);
  return due.length;
}

/**
 * Start this process's close worker and the outbid-notice worker, and sweep once. The periodic sweeps
 * (this one, escrow release, reminders, disputes, unexpected charges, reconciliation) run once per cluster
 * as pg-boss jobs: see lib/services/periodic-jobs.ts.
 */
export async function startClosingWorker(): Promise<void> {
  const boss = queue();
  if (!boss) throw new Error("start the job queue first");
  await boss.work<{ saleLotId: string }>(
    QUEUES.lotClose,
    { pollingIntervalSeconds: 0.5, batchSize: 5 },
    async (jobs) => {
      for (const job of jobs) await closeSaleLot(job.data.saleLotId);
    },
  );
  await startOutbidWorker();
  await sweepDueLots();
}
