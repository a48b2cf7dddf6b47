// The platform's ledger: one balance transaction per money movement, and balances summed from them.
// Simplification: funds are available at once (available_on = created), so an escrow flow can pay out
// in the same test run. Transfers to connected accounts add to those accounts' own balances.
import type Stripe from "stripe";
import { FEE_DESCRIPTION } from "./fees";
import { newId } from "./ids";
import type { State } from "./store";

type Movement = {
  amount: number;
  fee: number;
  currency: string;
  type: Stripe.BalanceTransaction.Type;
  reportingCategory: string;
  source: string;
  description: string | null;
  created: number;
};

/** Records a balance transaction on the platform and returns it. */
export function record(state: State, m: Movement): Stripe.BalanceTransaction {
  const txn: Stripe.BalanceTransaction = {
    id: newId("txn"),
    object: "balance_transaction",
    amount: m.amount,
    available_on: m.created,
    balance_type: "payments",
    created: m.created,
    currency: m.currency,
    description: m.description,
    exchange_rate: null,
    fee: m.fee,
    fee_details:
      m.fee === 0
        ? []
        : [
            {
              amount: m.fee,
              application: null,
              currency: m.currency,
              description: FEE_DESCRIPTION,
              type: "stripe_fee",
            },
          ],
    net: m.amount - m.fee,
    reporting_category: m.reportingCategory,
    source: m.source,
    status: "available",
    type: m.type,
  };
  state.balance_transactions[txn.id] = txn;
  return txn;
}

/** The platform's available balance per currency: the sum of every balance transaction's net. */
export function platformAvailable(state: State): Map<string, number> {
  const out = new Map<string, number>();
  for (const t of Object.values(state.balance_transactions)) out.set(t.currency, (out.get(t.currency) ?? 0) + t.net);
  return out;
}

/** A connected account's balance per currency: transfers to it less their reversals. */
export function connectedAvailable(state: State, account: string): Map<string, number> {
  const out = new Map<string, number>();
  for (const t of Object.values(state.transfers)) {
    if (t.destination !== account) continue;
    out.set(t.currency, (out.get(t.currency) ?? 0) + t.amount - t.amount_reversed);
  }
  return out;
}

/** A Balance object from per-currency amounts (usd 0 when there is nothing yet). */
export function balanceObject(available: Map<string, number>, withConnectReserved: boolean): Stripe.Balance {
  const entries = available.size ? [...available.entries()] : [["usd", 0] as [string, number]];
  return {
    object: "balance",
    available: entries.map(([currency, amount]) => ({ amount, currency, source_types: { card: amount } })),
    ...(withConnectReserved ? { connect_reserved: entries.map(([currency]) => ({ amount: 0, currency })) } : {}),
    livemode: false,
    pending: entries.map(([currency]) => ({ amount: 0, currency, source_types: { card: 0 } })),
  };
}
