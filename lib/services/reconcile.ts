import { QueryTypes } from "sequelize";
import type Stripe from "stripe";
import { stripe } from "../stripe/client";
import { db } from "../../models";
import { balances, trialBalance } from "./ledger";

export type Reconciliation = {
  ok: boolean;
  ranAt: string;
  ledger: { cashCents: number; processorFeesCents: number; trialBalanceCents: number };
  processor: { availableCents: number; feesCents: number; chargesCents: number; transfersCents: number; refundsCents: number };
  differences: string[];
};

async function allBalanceTransactions(): Promise<Stripe.BalanceTransaction[]> {
  const out: Stripe.BalanceTransaction[] = [];
  for await (const bt of stripe().balanceTransactions.list({ limit: 100 })) {
    out.push(bt);
    if (out.length > 50_000) break;
  }
  return out;
}

/**
 * Compare our ledger with the processor's balance transactions: cash held,
 * processor fees, and every paid invoice's amount against its payment. Any
 * difference is listed; each run is kept for the finance page.
 */
export async function reconcile(): Promise<Reconciliation> {
  const [ledger, tb, bts, bal] = await Promise.all([balances(), trialBalance(), allBalanceTransactions(), stripe().balance.retrieve()]);
  const sum = (types: string[], f: (b: Stripe.BalanceTransaction) => number) => bts.filter((b) => types.includes(b.type)).reduce((n, b) => n + f(b), 0);
  const processor = {
    availableCents: bal.available.reduce((n, a) => n + a.amount, 0) + bal.pending.reduce((n, a) => n + a.amount, 0),
    feesCents: sum(["charge", "payment"], (b) => b.fee),
    chargesCents: sum(["charge", "payment"], (b) => b.amount),
    transfersCents: -sum(["transfer"], (b) => b.amount) - sum(["transfer_refund"], (b) => b.amount),
    refundsCents: -sum(["refund", "payment_refund"], (b) => b.amount),
  };
  const differences: string[] = [];
  if (tb !== 0) differences.push(`the ledger does not balance: debits exceed credits by ${tb} cents`);
  if (ledger.cash !== processor.availableCents) differences.push(`cash: ledger ${ledger.cash} cents, processor balance ${processor.availableCents} cents`);
  if (ledger["processor-fees"] !== processor.feesCents) differences.push(`fees: ledger ${ledger["processor-fees"]} cents, processor ${processor.feesCents} cents`);
  const paid = await db().query<{ number: string; total_cents: number; payment_intent_id: string }>(
    `SELECT number, total_cents, payment_intent_id FROM invoices WHERE paid_at IS NOT NULL AND payment_intent_id IS NOT NULL`, { type: QueryTypes.SELECT },
  );
  for (const p of paid) {
    const pi = await stripe().paymentIntents.retrieve(p.payment_intent_id).catch(() => null);
    if (!pi || pi.status !== "succeeded") differences.push(`invoice ${p.number}: payment ${p.payment_intent_id} is ${pi?.status ?? "missing"} at the processor`);
    else if (pi.amount !== p.total_cents) differences.push(`invoice ${p.number}: invoiced ${p.total_cents} cents, paid ${pi.amount} cents`);
  }
  const result: Reconciliation = {
    ok: differences.length === 0, ranAt: new Date().toISOString(),
    ledger: { cashCents: ledger.cash, processorFeesCents: ledger["processor-fees"], trialBalanceCents: tb }, processor, differences,
  };
  await db().query(`INSERT INTO reconciliation_runs (ok, details, ran_at) VALUES (:ok, :details::jsonb, now())`, { replacements: { ok: result.ok, details: JSON.stringify(result) } });
  return result;
}

/** The latest runs, newest first. */
export async function recentReconciliations(limit = 10): Promise<Reconciliation[]> {
  const rows = await db().query<{ details: Reconciliation }>(`SELECT details FROM reconciliation_runs ORDER BY id DESC LIMIT :limit`, { replacements: { limit }, type: QueryTypes.SELECT });
  return rows.map((r) => r.details);
}
