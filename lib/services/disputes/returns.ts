/** The return of a lot after a refund-on-return decision: shipment, receipt, and the full refund. */
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import { buildManifest, defaultLineValues } from "../../disputes/manifest";
import { settleLotRejection } from "../../money/refunds";
import { repayablePostage, returnedCharges, returnPostageEntries } from "../../money/return-refund";
import { stripe, stripeConfig } from "../../stripe/client";
import type { ReturnShipmentInput } from "../../validation/disputes";
import { db } from "../../../models";
import { payoutAccount } from "../escrow";
import { settingsForInvoice } from "../house-settings";
import { post } from "../ledger";
import { mail, notice } from "./mail";
import { saleOf } from "./mediation";
import { loadCase, requireParty } from "./permissions";
import { payRefund } from "./settle";
import { asManifestItem } from "./shared";
import {
  closeDispute,
  findDispute,
  markReturnReceived,
  recordPostageTransfer,
  recordReturnShipment,
  recordSettlement,
  type DisputeRow,
} from "./tables/disputes";
import { claimInvoice, lockInvoice, markInvoiceRefunded, postedOnInvoice, type CaseInvoice } from "./tables/invoices";
import { lotItems } from "./tables/lot-items";
import {
  casePath,
  returnRefundedToBuyer,
  returnRefundedToConsignor,
  returnShippedNotice,
  returnShippedToConsignor,
} from "./templates";

/** The buyer records the return shipment (refund-on-return). */
export async function recordReturn(viewer: Viewer, id: string, input: ReturnShipmentInput): Promise<void> {
  const { d, role } = await loadCase(viewer, id);
  requireParty(role, "buyer", "Only the buyer records the return");
  if (d.state !== "awaiting-return") throw new ApiError("conflict", "No return is expected on this case");
  if (d.return_shipped_at) {
    if (d.return_tracking === input.tracking) return; // a retry
    throw new ApiError("conflict", "The return is already recorded");
  }
  await recordReturnShipment(id, {
    carrier: input.carrier,
    tracking: input.tracking,
    postageCents: input.postageCents ?? 0,
    postageReceipt: input.postageReceipt || null,
  });
  const facts = { id: d.id, number: d.number, carrier: input.carrier, tracking: input.tracking };
  await notice(d.consignor_id, returnShippedNotice(facts), casePath(d.id));
  const { claims } = await settingsForInvoice(d.invoice_id); // the sale's frozen settings, as the sweep uses
  await mail(d.consignor_id, returnShippedToConsignor({ ...facts, receiptConfirmDays: claims.receiptConfirmDays }));
}

/** Pay the full refund on a returned lot and close the case (the consignor confirmed, or the deadline passed). */
export async function refundReturnedLot(d: DisputeRow, why: string): Promise<void> {
  const inv = await claimInvoice(d.invoice_id);
  const manifestItems = (await lotItems(d.lot_id)).map(asManifestItem);
  const s = settleLotRejection(
    saleOf(inv),
    buildManifest(manifestItems, defaultLineValues(manifestItems, inv.hammer_cents)),
  );
  // The whole lot came back: its shipping and tax follow it [SUG].
  const returned = returnedCharges(
    { shippingCents: inv.shipping_cents, taxCents: inv.tax_cents },
    { returnedValueCents: s.lotValueCents, lotValueCents: s.lotValueCents },
  );
  // Postage first: its transfer draws on the buyer's charge (source_transaction) while the charge still holds funds.
  const postageCents = await repayPostage(d, inv);
  await payRefund(d, inv, s, returned);
  await db().transaction(async (t) => {
    await markInvoiceRefunded(inv.id, t);
    await recordSettlement(d.id, { ...s, items: undefined, ...returned, postageCents }, t);
  });
  if (await closeDispute(d.id, "awaiting-return", why)) {
    const cardCents = s.buyerRefundCents + returned.shippingCents + returned.taxCents;
    const facts = { id: d.id, number: d.number, why, buyerRefundCents: cardCents, postageCents };
    await mail(d.buyer_id, returnRefundedToBuyer(facts));
    await mail(d.consignor_id, returnRefundedToConsignor(facts));
  }
}

/**
 * Repay the buyer's return postage (bounded), charged to the consignor [SUG].
 * A card refund cannot exceed the charge, which the refund of the lot uses
 * up, so the postage goes to the buyer's payout account as a transfer keyed
 * by case, drawn on the buyer's own charge; posted once per invoice. Returns
 * the amount repaid.
 */
async function repayPostage(d: DisputeRow, inv: CaseInvoice): Promise<number> {
  const postage = repayablePostage(d.return_postage_cents);
  if (postage <= 0 || (await postedOnInvoice(inv.id, "dispute-return-postage"))) return postage;
  if (!inv.payment_intent_id) throw new Error(`invoice ${inv.number} has no payment to draw the postage from`);
  const pi = await stripe().paymentIntents.retrieve(inv.payment_intent_id);
  const charge = typeof pi.latest_charge === "string" ? pi.latest_charge : (pi.latest_charge?.id ?? undefined);
  const transfer = await stripe().transfers.create(
    {
      amount: postage,
      currency: stripeConfig().CURRENCY,
      destination: await payoutAccount(d.buyer_id),
      transfer_group: `invoice:${inv.id}`,
      source_transaction: charge,
      metadata: { invoice_id: inv.id, dispute_id: d.id, purpose: "return-postage" },
    },
    { idempotencyKey: `dispute:${d.id}:postage` },
  );
  await db().transaction(async (t) => {
    await lockInvoice(inv.id, t);
    if (await post(t, "dispute-return-postage", inv.id, returnPostageEntries(postage), transfer.id))
      await recordPostageTransfer(d.id, transfer.id, t);
  });
  return postage;
}

/** The consignor confirms the returned lot arrived; the refund is paid at once. */
export async function confirmReturnReceived(viewer: Viewer, id: string): Promise<void> {
  const { d, role } = await loadCase(viewer, id);
  requireParty(role, "consignor", "Only the consignor confirms receipt");
  if (d.state !== "awaiting-return" || !d.return_shipped_at || d.return_received_at) throw returnConflict(d);
  if (!(await markReturnReceived(id))) throw returnConflict((await findDispute(id)) ?? d);
  await refundReturnedLot(d, "the consignor confirmed receipt");
}

/** A second confirmation of a return (a double click, or two tabs): 409 with the case as it stands. */
function returnConflict(d: DisputeRow): ApiError {
  const message = d.return_received_at
    ? `Receipt of the return was already confirmed on ${d.return_received_at.toISOString().slice(0, 10)}; the refund ${d.state === "closed" ? "has been paid" : "is being paid"}`
    : "The buyer has not recorded a return shipment yet";
  return new ApiError("conflict", message, undefined, undefined, {
    state: d.state,
    returnReceivedAt: d.return_received_at?.toISOString() ?? null,
  });
}
