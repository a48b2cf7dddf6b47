/** Opening a claim. */
import { randomUUID } from "node:crypto";
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import { answerDueAt, misattributionRefusal, openingRefusal } from "../../disputes/rules";
import type { BuyerReport } from "../../disputes/weigh";
import type { TubeReading } from "../../lots/item";
import type { OpenDisputeInput } from "../../validation/disputes";
import { db } from "../../../models";
import { settingsForInvoice } from "../house-settings";
import { mail, notice } from "./mail";
import { findDisputeForInvoice, insertDispute, nextDisputeSerial } from "./tables/disputes";
import { insertDisputeItem } from "./tables/dispute-items";
import { insertMessage } from "./tables/dispute-messages";
import { invoiceForCase, markInvoiceDisputed } from "./tables/invoices";
import { lotItems, type LotItemRow } from "./tables/lot-items";
import { casePath, openedNotice, openedToBuyer, openedToConsignor } from "./templates";

/** Field errors for claimed lines that do not fit the lot (keyed as the form names them). */
function lineProblems(input: OpenDisputeInput, items: Map<string, LotItemRow>): Record<string, string> {
  const fields: Record<string, string> = {};
  input.items.forEach((c, k) => {
    const item = items.get(c.itemId);
    if (!item) {
      fields[`items.${k}.itemId`] = "That item is not in this lot";
      return;
    }
    if (c.tubes > item.quantity)
      fields[`items.${k}.tubes`] = `Line ${item.position} holds ${item.quantity} tube${item.quantity === 1 ? "" : "s"}`;
    if (input.reason === "maker-misattributed") {
      const why = misattributionRefusal({
        position: item.position,
        designation: item.designation,
        labelBrand: item.label_brand,
        makerName: item.maker_name,
        makerBasis: item.maker_basis,
      });
      if (why) fields[`items.${k}.itemId`] = why;
    }
    c.readings.forEach((r, j) => {
      if (r.tubeNo > item.quantity)
        fields[`items.${k}.readings.${j}.tubeNo`] = `Line ${item.position} has tubes 1–${item.quantity}`;
    });
  });
  return fields;
}

/** The buyer's report on one claimed line, as stored. */
const reportOf = (c: OpenDisputeInput["items"][number]): BuyerReport => ({
  tubes: c.tubes,
  sourceCode: c.sourceCode ?? null,
  dateCode: c.dateCode ?? null,
  designationSeen: c.designationSeen ?? null,
  tubesReceived: c.tubesReceived ?? null,
  vacuumLoss: c.vacuumLoss ?? false,
  features: c.features,
  readings: c.readings as TubeReading[],
  note: c.note ?? "",
});

type Opened =
  | { fresh: false; id: string; number: string }
  | { fresh: true; id: string; number: string; buyerId: string; consignorId: string; invoiceNumber: string; due: Date };

/**
 * The buyer opens a claim on a delivered lot inside its inspection window.
 * The invoice moves to "disputed", so escrow is not released while the case
 * is open; the consignor is told and has until the answer deadline. A retry
 * of the same claim returns the open case.
 */
export async function openDispute(
  viewer: Viewer,
  invoiceId: string,
  input: OpenDisputeInput,
): Promise<{ id: string; number: string }> {
  const created = await db().transaction(async (t): Promise<Opened> => {
    const inv = await invoiceForCase(invoiceId, { t, lock: true });
    if (!inv || inv.buyer_id !== viewer.id) throw new ApiError("not_found", "No such invoice");
    const existing = await findDisputeForInvoice(invoiceId, t);
    if (existing) return { fresh: false, id: existing.id, number: existing.number };
    const { claims } = await settingsForInvoice(invoiceId, t); // the sale's frozen settings
    const refusal = openingRefusal(
      {
        state: inv.state,
        deliveredAtMs: inv.delivered_at?.getTime() ?? null,
        inspectionEndsAtMs: inv.inspection_ends_at?.getTime() ?? null,
      },
      Date.now(),
      input.reason,
      claims.breakageClaimHours,
    );
    if (refusal) throw new ApiError("conflict", refusal);

    const fields = lineProblems(input, new Map((await lotItems(inv.lot_id, t)).map((i) => [i.id, i])));
    const [first, ...more] = Object.values(fields);
    if (first !== undefined) {
      throw new ApiError(
        "validation_failed",
        more.length === 0 ? first : `${first} (and ${more.length} more: see the lines)`,
        fields,
      );
    }

    const id = randomUUID();
    const number = `CL-${new Date().getUTCFullYear()}-${await nextDisputeSerial(t)}`;
    const due = new Date(answerDueAt(Date.now(), claims.answerBusinessDays));
    await insertDispute(
      {
        id,
        number,
        invoice_id: invoiceId,
        lot_id: inv.lot_id,
        buyer_id: inv.buyer_id,
        consignor_id: inv.consignor_id,
        reason: input.reason,
        remedy: input.remedy,
        answer_due_at: due,
      },
      t,
    );
    for (const c of input.items)
      await insertDisputeItem({ dispute_id: id, lot_item_id: c.itemId, tubes: c.tubes, report: reportOf(c) }, t);
    await insertMessage(
      {
        id: randomUUID(),
        dispute_id: id,
        author_id: viewer.id,
        author_role: "buyer",
        body: input.statement,
        client_key: null,
      },
      t,
    );
    await markInvoiceDisputed(invoiceId, t);
    return {
      fresh: true,
      id,
      number,
      buyerId: inv.buyer_id,
      consignorId: inv.consignor_id,
      invoiceNumber: inv.number,
      due,
    };
  });
  if (created.fresh) {
    const facts = { id: created.id, number: created.number, invoiceNumber: created.invoiceNumber, due: created.due };
    const tubes = input.items.reduce((n, i) => n + i.tubes, 0);
    await notice(created.consignorId, openedNotice(facts), casePath(created.id));
    await mail(
      created.consignorId,
      openedToConsignor({ ...facts, reason: input.reason, remedy: input.remedy, lines: input.items.length, tubes }),
    );
    await mail(created.buyerId, openedToBuyer(facts));
  }
  return { id: created.id, number: created.number };
}
