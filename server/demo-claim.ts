// Demo only (DEMO_LIVE=1): the demo's claim story, run once per database.
import { QueryTypes } from "sequelize";
import { placeMaxBid } from "../lib/services/bidding";
import { postMessage } from "../lib/services/disputes/conversation";
import { openDispute } from "../lib/services/disputes/open";
import { markDelivered, markShipped } from "../lib/services/escrow";
import { closeSaleLot } from "../lib/services/lot-closing";
import { decideLot, submitLot } from "../lib/services/lot-review";
import { addItem, createLot } from "../lib/services/lots";
import { payInvoice } from "../lib/services/payments";
import { createSale } from "../lib/services/sales";
import { db } from "../models";
import { item, pause, viewer } from "./demo-helpers";

/**
 * The demo's claim story, once per database: the Voss estate sells a small box
 * whose 12AX7s it attributed to one maker by construction; the dealer Quill &
 * Cathode wins, pays with the test card, receives it, and claims three tubes
 * carry another maker's code and construction; the estate contests. The claim
 * waits in the mediators' queue (sign in as a mediator to decide it).
 */
export async function ensureDemoClaim(): Promise<void> {
  const [any] = await db().query<{ n: string }>(`SELECT COUNT(*) AS n FROM disputes`, { type: QueryTypes.SELECT });
  if (Number(any?.n ?? 0) > 0) return;
  const [estate, buyer, admin] = await Promise.all([
    viewer("voss-estate@consignor.getterline.test"),
    viewer("quill@dealer.getterline.test"),
    viewer("priya@house.getterline.test"),
  ]);
  const lot = await createLot(estate, {
    title: "Voss estate: 12AX7 x 6 in cartons, with 6SN7GT",
    provenance: "Demo lot (invented): cartons from the late Mr Voss's bench.",
    shippingOrigin: "Demo county",
    testerKind: "untested",
    testerNotes: "",
  });
  await addItem(
    estate,
    lot.id,
    item({
      designation: "12AX7",
      quantity: 6,
      labelBrand: "Carrow Instruments",
      makerName: "Kestrel Valve Company",
      makerBasis: "construction-matched",
      features: { plateColour: "black", getterShape: "d-shape", getterPosition: "side" },
    }),
  );
  await addItem(estate, lot.id, item({ designation: "6SN7GT", quantity: 4, labelBrand: "Fairmont Home Radio" }));
  await submitLot(estate, lot.id);
  await decideLot(admin, lot.id, {
    action: "approve",
    comment: "Demo lot",
    estimateLowCents: 8_000,
    estimateHighCents: 14_000,
    reserveCents: 8_000,
    reserveAgreed: true,
  });
  const sale = await createSale(admin, {
    title: "Private treaty (demo claim)",
    startsAt: new Date(Date.now() - 60_000).toISOString(),
    firstCloseAt: new Date(Date.now() + 3_000).toISOString(),
    gapSeconds: 30,
    softCloseSeconds: 1,
    lots: [{ lotId: lot.id, openingCents: 2_000 }],
  });
  const [sl] = await db().query<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, {
    replacements: { id: sale.id },
    type: QueryTypes.SELECT,
  });
  await placeMaxBid(buyer, sl!.id, 12_000, "demo-claim-bid");
  await pause(4_000);
  await closeSaleLot(sl!.id);
  const [inv] = await db().query<{ id: string }>(`SELECT id FROM invoices WHERE sale_lot_id = :id`, {
    replacements: { id: sl!.id },
    type: QueryTypes.SELECT,
  });
  if (!inv) return;
  await payInvoice(buyer, inv.id, {
    number: "4242424242424242",
    expMonth: 12,
    expYear: 2031,
    cvc: "123",
    attemptKey: "demo-claim-pay",
  });
  for (let k = 0; k < 60; k++) {
    // the payment lands when the processor's webhook arrives
    const [row] = await db().query<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, {
      replacements: { id: inv.id },
      type: QueryTypes.SELECT,
    });
    if (row?.state === "paid-held") break;
    await pause(1_000);
  }
  await markShipped(inv.id, "Demo Parcel Co.", "DP-DEMO-0001");
  await markDelivered(inv.id);
  const [line] = await db().query<{ id: string }>(`SELECT id FROM lot_items WHERE lot_id = :id AND position = 1`, {
    replacements: { id: lot.id },
    type: QueryTypes.SELECT,
  });
  const claim = await openDispute(buyer, inv.id, {
    reason: "maker-misattributed",
    remedy: "refund-affected-items",
    statement:
      "Three of the six 12AX7s carry source code X46 and square top getters with dimpled grey plates: not the construction listed.",
    items: [
      {
        itemId: line!.id,
        tubes: 3,
        sourceCode: "X46",
        dateCode: "6231",
        designationSeen: null,
        tubesReceived: null,
        vacuumLoss: false,
        features: { getterShape: "square", getterPosition: "top", plateSurface: "dimpled", plateColour: "grey" },
        readings: [],
        note: "Tubes 4–6 in the carton.",
      },
    ],
  });
  await postMessage(estate, claim.id, {
    body: "The cartons were marked that way on Mr Voss's bench; we listed what we were told.",
    stance: "contests",
  });
  console.log(`demo: claim ${claim.number} waits in the mediators' queue`);
}
