// Transfers to connected accounts and their reversals.
// Without source_transaction a transfer needs that much available platform balance (else 400
// balance_insufficient). With source_transaction it draws on that charge instead, like Stripe, and may not
// exceed what is left of it (captured − refunded − already transferred from it + reversed).
import type Stripe from "stripe";
import type { Handler } from "./context";
import { invalid, noSuch } from "./errors";
import { newId } from "./ids";
import { platformAvailable, record } from "./ledger";
import { LIST_PARAMS, page } from "./lists";
import { applyMetadata, currency, int, onlyParams, requiredStr, str } from "./params";
import type { State } from "./store";

function findTransfer(state: State, id: string): Stripe.Transfer {
  const t = state.transfers[id];
  if (!t) throw noSuch("transfer", id);
  return t;
}

/** What is left of a charge for transfers that name it as source_transaction. */
function leftOfCharge(state: State, charge: Stripe.Charge): number {
  const moved = Object.values(state.transfers)
    .filter((t) => t.source_transaction === charge.id)
    .reduce((sum, t) => sum + t.amount - t.amount_reversed, 0);
  return charge.amount_captured - charge.amount_refunded - moved;
}

/** POST /v1/transfers */
export const createTransfer: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [
    "amount",
    "currency",
    "destination",
    "transfer_group",
    "source_transaction",
    "metadata",
    "description",
    "expand",
  ]);
  const amount = int(p, "amount", { min: 1 });
  if (amount === undefined) throw invalid("Missing required param: amount.", "amount", "parameter_missing");
  const cur = currency(p)!;
  const destination = requiredStr(p, "destination");
  const account = ctx.state.accounts[destination];
  if (!account) throw noSuch("destination", destination, "destination", 400);
  if (account.type !== "standard" && account.capabilities?.transfers !== "active") {
    throw invalid(
      `Your destination account needs to have the transfers capability enabled (request it with capabilities[transfers][requested]=true): ${destination}`,
      "destination",
      "insufficient_capabilities_for_transfer",
    );
  }
  const sourceId = str(p, "source_transaction");
  if (sourceId !== undefined) {
    const charge = ctx.state.charges[sourceId];
    if (!charge) throw noSuch("charge", sourceId, "source_transaction", 400);
    if (charge.status !== "succeeded" || !charge.captured)
      throw invalid(`Charge ${sourceId} has no captured funds to transfer.`, "source_transaction");
    if (charge.currency !== cur) {
      throw invalid(
        `The currency of source_transaction's balance transaction (${charge.currency}) must be the same as the transfer currency (${cur}).`,
        "currency",
      );
    }
    const left = leftOfCharge(ctx.state, charge);
    if (amount > left) {
      throw invalid(
        `Insufficient funds in source_transaction ${sourceId}: ${left} ${cur} is left of it for transfers, ${amount} was asked.`,
        "amount",
        "balance_insufficient",
      );
    }
  } else {
    const available = platformAvailable(ctx.state).get(cur) ?? 0;
    if (amount > available) {
      throw invalid(
        `You have insufficient available funds in your account: ${available} ${cur} available, ${amount} ${cur} asked.`,
        undefined,
        "balance_insufficient",
      );
    }
  }
  const id = newId("tr");
  const txn = record(ctx.state, {
    amount: -amount,
    fee: 0,
    currency: cur,
    type: "transfer",
    reportingCategory: "transfer",
    source: id,
    description: str(p, "description") ?? null,
    created: ctx.now,
  });
  const transfer: Stripe.Transfer = {
    id,
    object: "transfer",
    amount,
    amount_reversed: 0,
    balance_transaction: txn.id,
    created: ctx.now,
    currency: cur,
    description: str(p, "description") ?? null,
    destination,
    destination_payment: newId("py"),
    livemode: false,
    metadata: applyMetadata(p),
    reversals: { object: "list", data: [], has_more: false, url: `/v1/transfers/${id}/reversals` },
    reversed: false,
    source_transaction: sourceId ?? null,
    source_type: "card",
    transfer_group: str(p, "transfer_group") ?? null,
  };
  ctx.state.transfers[id] = transfer;
  ctx.emit("transfer.created", transfer);
  return transfer;
};

/** GET /v1/transfers/:id */
export const retrieveTransfer: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand"]);
  return findTransfer(ctx.state, id);
};

/** POST /v1/transfers/:id — description and metadata. */
export const updateTransfer: Handler = (ctx, id) => {
  const p = ctx.params;
  onlyParams(p, ["description", "metadata", "expand"]);
  const t = findTransfer(ctx.state, id);
  const metadata = applyMetadata(p, t.metadata);
  const description = str(p, "description");
  t.metadata = metadata;
  if (description !== undefined) t.description = description || null;
  return t;
};

/** GET /v1/transfers — filters destination, transfer_group. */
export const listTransfers: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [...LIST_PARAMS, "destination", "transfer_group"]);
  const destination = str(p, "destination");
  const group = str(p, "transfer_group");
  const items = Object.values(ctx.state.transfers).filter(
    (t) =>
      (destination === undefined || t.destination === destination) &&
      (group === undefined || t.transfer_group === group),
  );
  return page(items, p, "/v1/transfers");
};

/** POST /v1/transfers/:id/reversals — amount (default: all that is not yet reversed). */
export const createReversal: Handler = (ctx, transferId) => {
  const p = ctx.params;
  onlyParams(p, ["amount", "description", "metadata", "expand"]);
  const transfer = findTransfer(ctx.state, transferId);
  const left = transfer.amount - transfer.amount_reversed;
  if (left <= 0) throw invalid(`Transfer ${transferId} has already been fully reversed.`, "amount", "amount_too_large");
  const amount = int(p, "amount", { min: 1 }) ?? left;
  if (amount > left) {
    throw invalid(
      `Reversal amount (${amount}) is greater than the amount left on transfer ${transferId} (${left}).`,
      "amount",
      "amount_too_large",
    );
  }
  const id = newId("trr");
  const txn = record(ctx.state, {
    amount,
    fee: 0,
    currency: transfer.currency,
    type: "transfer_refund",
    reportingCategory: "transfer_reversal",
    source: id,
    description: str(p, "description") ?? null,
    created: ctx.now,
  });
  const reversal: Stripe.TransferReversal = {
    id,
    object: "transfer_reversal",
    amount,
    balance_transaction: txn.id,
    created: ctx.now,
    currency: transfer.currency,
    destination_payment_refund: newId("pyr"),
    metadata: applyMetadata(p),
    source_refund: null,
    transfer: transferId,
  };
  ctx.state.transfer_reversals[id] = reversal;
  transfer.amount_reversed += amount;
  transfer.reversed = transfer.amount_reversed >= transfer.amount;
  transfer.reversals.data.unshift(structuredClone(reversal));
  ctx.emit("transfer.reversed", transfer);
  return reversal;
};

/** GET /v1/transfers/:id/reversals */
export const listReversals: Handler = (ctx, transferId) => {
  onlyParams(ctx.params, [...LIST_PARAMS]);
  findTransfer(ctx.state, transferId);
  const items = Object.values(ctx.state.transfer_reversals).filter((r) => r.transfer === transferId);
  return page(items, ctx.params, `/v1/transfers/${transferId}/reversals`);
};

/** GET /v1/transfers/:id/reversals/:reversal */
export const retrieveReversal: Handler = (ctx, transferId, id) => {
  onlyParams(ctx.params, ["expand"]);
  findTransfer(ctx.state, transferId);
  const r = ctx.state.transfer_reversals[id];
  if (!r || r.transfer !== transferId) throw noSuch("transfer_reversal", id);
  return r;
};
