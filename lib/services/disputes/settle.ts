/**
 * Moving the money a decision calls for: refunds out of held escrow through
 * the processor (keyed by case) and the ledger (once per invoice), escrow
 * released, the case closed, and the written decision sent.
 */
import { ApiError } from "../../api/errors";
import { refundEntries } from "../../money/ledger";
import type { RefundSettlement } from "../../money/refunds";
import { returnRefundEntries, type ReturnedCharges } from "../../money/return-refund";
import { stripe } from "../../stripe/client";
import { db } from "../../../models";
import { release } from "../escrow";
import { post } from "../ledger";
import { mail, notice } from "./mail";
import { DAY_MS } from "./shared";
import { awaitReturn, closeDispute, findDispute, isDecided, recordRefund, type DisputeRow } from "./tables/disputes";
import { addRefunded, claimInvoice, lockInvoice, postedOnInvoice, type CaseInvoice } from "./tables/invoices";
import { displayNames } from "./tables/users";
import { settingsForInvoice } from "../house-settings";
import { casePath, decidedNotice, decisionToBuyer, decisionToConsignor, returnNext, settledNext } from "./templates";

/** The parts of a settlement a refund moves. */
export type RefundMoves = Pick<
  RefundSettlement,
  | "buyerRefundCents"
  | "hammerRefundCents"
  | "premiumRefundCents"
  | "commissionReductionCents"
  | "consignorChangeCents"
  | "houseChangeCents"
>;

/**
 * Pay a refund out of held escrow through the processor and post it, once per
 * case. Returned goods also bring back their shipping and tax (`returned`),
 * in the same card refund.
 */
export async function payRefund(
  d: DisputeRow,
  inv: CaseInvoice,
  s: RefundMoves,
  returned: ReturnedCharges = { shippingCents: 0, taxCents: 0 },
): Promise<void> {
  if (s.buyerRefundCents <= 0) return;
  if (!inv.payment_intent_id) throw new Error(`invoice ${inv.number} has no payment to refund`);
  if (await postedOnInvoice(inv.id, "dispute-refund")) return; // paid before: a retry, or a second click that raced the first
  const heldHammer = inv.hammer_cents - inv.hammer_refunded_cents - inv.released_hammer_cents;
  const heldPremium = inv.premium_cents - inv.premium_refunded_cents - inv.released_premium_cents;
  if (s.hammerRefundCents > heldHammer || s.premiumRefundCents > heldPremium) {
    throw new ApiError(
      "conflict",
      `Invoice ${inv.number}: the refund exceeds what is still held`,
      undefined,
      undefined,
      { state: inv.state },
    );
  }
  const refund = await stripe().refunds.create(
    {
      payment_intent: inv.payment_intent_id,
      amount: s.buyerRefundCents + returned.shippingCents + returned.taxCents,
      reason: "requested_by_customer",
      metadata: { invoice_id: inv.id, dispute_id: d.id },
    },
    { idempotencyKey: `dispute:${d.id}:refund` },
  );
  await db().transaction(async (t) => {
    await lockInvoice(inv.id, t);
    const entries =
      returned.shippingCents + returned.taxCents > 0
        ? returnRefundEntries({ heldCents: s.buyerRefundCents, ...returned })
        : refundEntries(s as RefundSettlement, "held");
    const posted = await post(t, "dispute-refund", inv.id, entries, refund.id);
    if (!posted) return;
    await addRefunded(
      inv.id,
      {
        hammerCents: s.hammerRefundCents,
        premiumCents: s.premiumRefundCents,
        commissionCents: s.commissionReductionCents,
      },
      t,
    );
    await recordRefund(d.id, refund.id, refund.amount, t);
  });
}

/**
 * Move the money a decision calls for. Safe to run again after a crash:
 * every processor call carries a key tied to the case and every posting is
 * once per invoice. Dismissed: escrow released. Partial refund: the refund
 * from escrow, then the rest released to the consignor. Refund on return:
 * the case waits for the return.
 */
export async function settleDecision(id: string): Promise<void> {
  const d = await findDispute(id);
  if (!d || d.state !== "settling" || !d.decision) return;
  const inv = await claimInvoice(d.invoice_id);
  const decision = d.decision;
  if (decision.outcome === "refund-on-return") {
    const { claims } = await settingsForInvoice(d.invoice_id); // the sale's frozen settings
    const due = new Date(Date.now() + claims.returnShipDays * DAY_MS);
    if (await awaitReturn(id, due)) await mailDecision(d, inv, returnNext(due, claims.receiptConfirmDays));
    return;
  }
  if (decision.outcome === "partial-refund" && decision.settlement) await payRefund(d, inv, decision.settlement);
  await release(
    inv.id,
    decision.outcome === "dismissed" ? `claim ${d.number} dismissed` : `claim ${d.number} settled by a partial refund`,
    { fromDispute: true },
  );
  if (await closeDispute(d.id, "settling")) {
    await mailDecision(d, inv, settledNext(decision.outcome, decision.settlement?.buyerRefundCents ?? null));
  }
}

/** The written decision, to both parties. */
async function mailDecision(d: DisputeRow, inv: CaseInvoice, next: string): Promise<void> {
  const fresh = await findDispute(d.id);
  if (!fresh || !isDecided(fresh)) throw new Error(`claim ${d.id} has no recorded decision`);
  const names = fresh.decided_by ? await displayNames([fresh.decided_by]) : new Map<string, string>();
  const facts = {
    id: d.id,
    number: d.number,
    invoiceNumber: inv.number,
    reason: d.reason,
    outcome: fresh.decision.outcome,
    reasons: fresh.decision.reasons,
    mediatorName: (fresh.decided_by && names.get(fresh.decided_by)) || null,
    decidedAt: fresh.decided_at,
    settlement: fresh.decision.settlement,
    next,
  };
  await mail(d.buyer_id, decisionToBuyer(facts));
  await mail(d.consignor_id, decisionToConsignor(facts));
  for (const u of [d.buyer_id, d.consignor_id])
    await notice(u, decidedNotice(d.number, fresh.decision.outcome), casePath(d.id));
}
