import { QueryTypes } from "sequelize";
import type { DisputeState } from "../disputes/rules";
import { db } from "../../models";
import { recentReconciliations } from "./reconcile";

/** One open claim on the house's desk, with the next deadline that applies to it (null when none runs). */
export type DeskClaim = {
  id: string;
  number: string;
  lotTitle: string;
  state: DisputeState;
  deadline: string | null;
  mediated: boolean;
};

export type DeskSale = {
  id: string;
  title: string;
  startsAt: string;
  lots: number;
  open: number;
  nextClose: string | null;
};

/** What the house's desk shows: counts and the head of each queue, read together. */
export type HouseDesk = {
  review: { count: number; oldestSubmittedAt: string | null };
  sales: { live: DeskSale[]; upcoming: DeskSale[] };
  overdue: {
    count: number;
    totalCents: number;
    oldest: { id: string; number: string; dueAt: string; totalCents: number }[];
  };
  claims: { count: number; first: DeskClaim[] };
  reconciliation: {
    lastRunAt: string | null;
    ok: boolean | null;
    differences: number;
    inFlight: number;
  };
};

const iso = (d: Date | null) => d?.toISOString() ?? null;

/**
 * The house desk's figures: lots waiting for review, sales live and upcoming, overdue invoices, open claims
 * ordered by their next deadline (the consignor's answer, or the buyer's return), and the last reconciliation.
 */
export async function houseDesk(limit = 5): Promise<HouseDesk> {
  const s = db();
  const [review] = await s.query<{ n: string; oldest: Date | null }>(
    `SELECT COUNT(*) AS n, MIN(submitted_at) AS oldest FROM lots WHERE state = 'in-review'`,
    { type: QueryTypes.SELECT },
  );
  const sales = await s.query<{
    id: string;
    title: string;
    starts_at: Date;
    lots: string;
    open: string;
    next_close: Date | null;
  }>(
    `SELECT s.id, s.title, s.starts_at, COUNT(sl.id) AS lots, COUNT(sl.id) FILTER (WHERE sl.phase = 'open') AS open,
            MIN(sl.closes_at) FILTER (WHERE sl.phase = 'open') AS next_close
       FROM sales s JOIN sale_lots sl ON sl.sale_id = s.id
      GROUP BY s.id HAVING COUNT(sl.id) FILTER (WHERE sl.phase = 'open') > 0
      ORDER BY s.starts_at LIMIT 50`,
    { type: QueryTypes.SELECT },
  );
  const [overdue] = await s.query<{ n: string; total: string | null }>(
    `SELECT COUNT(*) AS n, SUM(total_cents) AS total FROM invoices WHERE state = 'awaiting-payment' AND due_at < now()`,
    { type: QueryTypes.SELECT },
  );
  const oldest = await s.query<{ id: string; number: string; due_at: Date; total_cents: number }>(
    `SELECT id, number, due_at, total_cents FROM invoices WHERE state = 'awaiting-payment' AND due_at < now() ORDER BY due_at LIMIT :limit`,
    { replacements: { limit }, type: QueryTypes.SELECT },
  );
  const claims = await s.query<{
    id: string;
    number: string;
    title: string;
    state: DisputeState;
    deadline: Date | null;
    mediator_id: string | null;
    total: string;
  }>(
    `SELECT d.id, d.number, l.title, d.state, d.mediator_id, COUNT(*) OVER () AS total,
            CASE d.state WHEN 'awaiting-answer' THEN d.answer_due_at WHEN 'awaiting-return' THEN d.return_due_at END AS deadline
       FROM disputes d JOIN lots l ON l.id = d.lot_id
      WHERE d.state <> 'closed'
      ORDER BY deadline ASC NULLS LAST, d.created_at LIMIT :limit`,
    { replacements: { limit }, type: QueryTypes.SELECT },
  );
  const [last] = await recentReconciliations(1);
  const now = Date.now();
  const toSale = (r: (typeof sales)[number]): DeskSale => ({
    id: r.id,
    title: r.title,
    startsAt: r.starts_at.toISOString(),
    lots: Number(r.lots),
    open: Number(r.open),
    nextClose: iso(r.next_close),
  });
  return {
    review: { count: Number(review?.n ?? 0), oldestSubmittedAt: iso(review?.oldest ?? null) },
    sales: {
      live: sales.filter((r) => r.starts_at.getTime() <= now).map(toSale),
      upcoming: sales.filter((r) => r.starts_at.getTime() > now).map(toSale),
    },
    overdue: {
      count: Number(overdue?.n ?? 0),
      totalCents: Number(overdue?.total ?? 0),
      oldest: oldest.map((o) => ({
        id: o.id,
        number: o.number,
        dueAt: o.due_at.toISOString(),
        totalCents: o.total_cents,
      })),
    },
    claims: {
      count: Number(claims[0]?.total ?? 0),
      first: claims.map((c) => ({
        id: c.id,
        number: c.number,
        lotTitle: c.title,
        state: c.state,
        deadline: iso(c.deadline),
        mediated: Boolean(c.mediator_id),
      })),
    },
    reconciliation: {
      lastRunAt: last?.ranAt ?? null,
      ok: last ? last.ok : null,
      differences: last?.differences.length ?? 0,
      inFlight: last?.inFlight?.length ?? 0,
    },
  };
}
