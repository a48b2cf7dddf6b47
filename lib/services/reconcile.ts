import { QueryTypes } from "sequelize";
import type Stripe from "stripe";
import { stripe } from "../stripe/client";
import { db } from "../../models";
import { balances, trialBalance } from "./ledger";

/** A processor charge no invoice of ours has recorded yet, made less than this long ago: its webhook is on its way. */
export const IN_FLIGHT_SECONDS = 15 * 60;

/** A processor charge that no paid invoice and no recorded unexpected charge accounts for. */
export type UnmatchedCharge = {
  chargeId: string;
  paymentIntentId: string | null;
  amountCents: number;
  feeCents: number;
  invoiceId: string | null;
  created: string;
};

export type Reconciliation = {
  ok: boolean;
  ranAt: string;
  ledger: { cashCents: number; processorFeesCents: number; trialBalanceCents: number };
  processor: {
    availableCents: number;
    feesCents: number;
    chargesCents: number;
    transfersCents: number;
    refundsCents: number;
  };
  /** Charges whose webhook has not been processed yet: kept out of the comparison, listed apart. */
  inFlight?: UnmatchedCharge[];
  differences: string[];
};

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Every captured processor charge that neither a paid invoice nor a recorded unexpected charge accounts
 * for, split into payments in flight (naming one of our invoices, made within IN_FLIGHT_SECONDS: its
 * webhook has not been processed yet) and the rest.
 */
async function unmatchedCharges(
  bts: Stripe.BalanceTransaction[],
): Promise<{ inFlight: UnmatchedCharge[]; unexplained: UnmatchedCharge[] }> {
  const known = new Set(
    (
      await db().query<{ pi: string }>(
        `SELECT payment_intent_id AS pi FROM invoices WHERE paid_at IS NOT NULL AND payment_intent_id IS NOT NULL UNION SELECT payment_intent_id FROM unexpected_charges`,
        { type: QueryTypes.SELECT },
      )
    ).map((r) => r.pi),
  );
  const feeOf = new Map(
    bts.filter((b) => b.type === "charge" || b.type === "payment").map((b) => [b.source as string, b.fee]),
  );
  const cutoff = Date.now() / 1000 - IN_FLIGHT_SECONDS;
  const rows: (UnmatchedCharge & { recent: boolean })[] = [];
  for (const c of await all(stripe().charges.list({ limit: 100 }))) {
    if (c.status !== "succeeded" || !c.captured) continue;
    const pi = typeof c.payment_intent === "string" ? c.payment_intent : (c.payment_intent?.id ?? null);
    if (pi && known.has(pi)) continue;
    const invoiceId = typeof c.metadata?.invoice_id === "string" ? c.metadata.invoice_id : null;
    rows.push({
      chargeId: c.id,
      paymentIntentId: pi,
      amountCents: c.amount_captured - c.amount_refunded,
      feeCents: feeOf.get(c.id) ?? 0,
      invoiceId,
      created: new Date(c.created * 1000).toISOString(),
      recent: c.created >= cutoff,
    });
  }
  const named = [...new Set(rows.map((r) => r.invoiceId).filter((id): id is string => id !== null && UUID.test(id)))];
  const ours = new Set(
    named.length
      ? (
          await db().query<{ id: string }>(`SELECT id FROM invoices WHERE id IN (:named)`, {
            replacements: { named },
            type: QueryTypes.SELECT,
          })
        ).map((r) => r.id)
      : [],
  );
  const inFlight: UnmatchedCharge[] = [];
  const unexplained: UnmatchedCharge[] = [];
  for (const { recent, ...row } of rows)
    (recent && row.invoiceId && ours.has(row.invoiceId) ? inFlight : unexplained).push(row);
  return { inFlight, unexplained };
}

/** Every item of a processor list, page after page (up to 50,000). */
async function all<T>(list: AsyncIterable<T>): Promise<T[]> {
  const out: T[] = [];
  for await (const x of list) {
    out.push(x);
    if (out.length > 50_000) break;
  }
  return out;
}

/**
 * Compare our ledger with the processor's balance transactions: cash held,
 * processor fees, every paid invoice's amount against its payment, and every
 * processor charge against an invoice. A charge whose webhook is still on its
 * way is listed apart and kept out of the cash and fee comparison; a charge
 * nothing accounts for is a difference, named by its id. Each run is kept for
 * the finance page.
 */
export async function reconcile(): Promise<Reconciliation> {
  const [ledger, tb, bts, bal] = await Promise.all([
    balances(),
    trialBalance(),
    all(stripe().balanceTransactions.list({ limit: 100 })),
    stripe().balance.retrieve(),
  ]);
  const sum = (types: string[], f: (b: Stripe.BalanceTransaction) => number) =>
    bts.filter((b) => types.includes(b.type)).reduce((n, b) => n + f(b), 0);
  const processor = {
    availableCents: bal.available.reduce((n, a) => n + a.amount, 0) + bal.pending.reduce((n, a) => n + a.amount, 0),
    feesCents: sum(["charge", "payment"], (b) => b.fee),
    chargesCents: sum(["charge", "payment"], (b) => b.amount),
    transfersCents: -sum(["transfer"], (b) => b.amount) - sum(["transfer_refund"], (b) => b.amount),
    refundsCents: -sum(["refund", "payment_refund"], (b) => b.amount),
  };
  const { inFlight, unexplained } = await unmatchedCharges(bts);
  const inFlightNet = inFlight.reduce((n, c) => n + c.amountCents - c.feeCents, 0);
  const inFlightFees = inFlight.reduce((n, c) => n + c.feeCents, 0);
  const differences: string[] = [];
  if (tb !== 0) differences.push(`the ledger does not balance: debits exceed credits by ${tb} cents`);
  if (ledger.cash !== processor.availableCents - inFlightNet) {
    differences.push(
      `cash: ledger ${ledger.cash} cents, processor balance ${processor.availableCents} cents${inFlight.length ? ` (${inFlightNet} cents of it in flight)` : ""}`,
    );
  }
  if (ledger["processor-fees"] !== processor.feesCents - inFlightFees)
    differences.push(`fees: ledger ${ledger["processor-fees"]} cents, processor ${processor.feesCents} cents`);
  for (const c of unexplained) {
    differences.push(
      `processor charge ${c.chargeId}${c.paymentIntentId ? ` (payment ${c.paymentIntentId})` : ""} of ${c.amountCents} cents matches no invoice${c.invoiceId ? ` (it names ${c.invoiceId.slice(0, 40)})` : ""}`,
    );
  }
  const paid = await db().query<{ number: string; total_cents: number; payment_intent_id: string }>(
    `SELECT number, total_cents, payment_intent_id FROM invoices WHERE paid_at IS NOT NULL AND payment_intent_id IS NOT NULL`,
    { type: QueryTypes.SELECT },
  );
  for (const p of paid) {
    const pi = await stripe()
      .paymentIntents.retrieve(p.payment_intent_id)
      .catch(() => null);
    if (!pi || pi.status !== "succeeded")
      differences.push(
        `invoice ${p.number}: payment ${p.payment_intent_id} is ${pi?.status ?? "missing"} at the processor`,
      );
    else if (pi.amount !== p.total_cents)
      differences.push(`invoice ${p.number}: invoiced ${p.total_cents} cents, paid ${pi.amount} cents`);
  }
  const result: Reconciliation = {
    ok: differences.length === 0,
    ranAt: new Date().toISOString(),
    ledger: { cashCents: ledger.cash, processorFeesCents: ledger["processor-fees"], trialBalanceCents: tb },
    processor,
    inFlight,
    differences,
  };
  await db().query(`INSERT INTO reconciliation_runs (ok, details, ran_at) VALUES (:ok, :details::jsonb, now())`, {
    replacements: { ok: result.ok, details: JSON.stringify(result) },
  });
  return result;
}

/** The latest runs, newest first. */
export async function recentReconciliations(limit = 10): Promise<Reconciliation[]> {
  const rows = await db().query<{ details: Reconciliation }>(
    `SELECT details FROM reconciliation_runs ORDER BY id DESC LIMIT :limit`,
    { replacements: { limit }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.details);
}
