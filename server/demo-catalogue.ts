// Demo only (DEMO_LIVE=1): a catalogue worth searching. Invented lots from the demo consignors, each with
// drawn pictures, listed for sale; and a history of sold lots (paid, shipped, accepted and settled through the
// real paths) spread over the past year, so price history and estimates have something to show.
import { QueryTypes } from "sequelize";
import type { Viewer } from "../lib/auth/guards";
import { placeMaxBid } from "../lib/services/bidding";
import { repairCatalogue } from "../lib/services/catalogue/entries";
import { acceptDelivery, markDelivered, markShipped } from "../lib/services/escrow";
import { closeSaleLot } from "../lib/services/lot-closing";
import { addPhoto } from "../lib/services/lot-photos";
import { decideLot, submitLot } from "../lib/services/lot-review";
import { forgetComparables } from "../lib/services/lot-summary";
import { addItem, createLot } from "../lib/services/lots";
import { payInvoice } from "../lib/services/payments";
import { createSale } from "../lib/services/sales";
import type { ItemInput } from "../lib/validation/lots";
import { db } from "../models";
import { cartonPicture, closeUpPicture } from "./demo-pictures";

type Line = {
  designation: string;
  quantity: number;
  label: string;
  condition: ItemInput["condition"];
  vacuumLoss?: boolean;
  chart?: number;
};
type Listing = { consignor: string; title: string; lines: Line[]; estimate: [number, number] };

const MARKER = "Demo catalogue lot (invented).";
const ESTATE = "voss-estate@consignor.getterline.test";
const SHOP = "marrow-creek@consignor.getterline.test";
const ODETTE = "odette@consignor.getterline.test";

// Service-bench and audio stock as estate boxes hold it; labels are the demo's invented ones.
const LISTINGS: Listing[] = [
  {
    consignor: SHOP,
    title: "TV bench drawer: PCL86 x 8, PCF80 x 6",
    lines: [
      { designation: "PCL86", quantity: 8, label: "Tri-County Parts", condition: "new-old-stock" },
      { designation: "PCF80", quantity: 6, label: "Tri-County Parts", condition: "new-old-stock" },
    ],
    estimate: [4_000, 7_000],
  },
  {
    consignor: SHOP,
    title: "Series-string radio set: 12BE6, 12BA6, 12AV6, 50C5, 35W4",
    lines: [
      { designation: "12BE6", quantity: 5, label: "Fairmont Home Radio", condition: "new-in-box" },
      { designation: "12BA6", quantity: 5, label: "Fairmont Home Radio", condition: "new-in-box" },
      { designation: "12AV6", quantity: 5, label: "Fairmont Home Radio", condition: "new-in-box" },
      { designation: "50C5", quantity: 5, label: "Fairmont Home Radio", condition: "new-in-box" },
      { designation: "35W4", quantity: 5, label: "Fairmont Home Radio", condition: "new-in-box" },
    ],
    estimate: [3_000, 6_000],
  },
  {
    consignor: ESTATE,
    title: "Attic box two: ECC83 x 12, some white getters",
    lines: [
      { designation: "ECC83", quantity: 9, label: "Carrow Instruments", condition: "used", chart: 1600 },
      { designation: "ECC83", quantity: 3, label: "Carrow Instruments", condition: "used", vacuumLoss: true },
    ],
    estimate: [6_000, 12_000],
  },
  {
    consignor: ODETTE,
    title: "6DJ8 x 4 and ECC88 x 4, tested",
    lines: [
      { designation: "6DJ8", quantity: 4, label: "Tri-County Parts", condition: "used", chart: 12500 },
      { designation: "ECC88", quantity: 4, label: "Carrow Instruments", condition: "used", chart: 12500 },
    ],
    estimate: [7_000, 12_000],
  },
  {
    consignor: ODETTE,
    title: "Special-quality 6922 x 4, new old stock",
    lines: [{ designation: "6922", quantity: 4, label: "Carrow Instruments", condition: "new-old-stock" }],
    estimate: [9_000, 16_000],
  },
  {
    consignor: SHOP,
    title: "6BQ5 output pairs x 6, boxed",
    lines: [{ designation: "6BQ5", quantity: 6, label: "Fairmont Home Radio", condition: "new-in-box" }],
    estimate: [8_000, 13_000],
  },
  {
    consignor: ESTATE,
    title: "Rectifiers: 5Y3GT x 4, 5U4G x 2, EZ80 x 3",
    lines: [
      { designation: "5Y3GT", quantity: 4, label: "Carrow Instruments", condition: "used" },
      { designation: "5U4G", quantity: 2, label: "Carrow Instruments", condition: "used" },
      { designation: "EZ80", quantity: 3, label: "Tri-County Parts", condition: "used" },
    ],
    estimate: [3_000, 6_000],
  },
  {
    consignor: ODETTE,
    title: "EL34 x 4 from a retired technician's amplifier",
    lines: [{ designation: "EL34", quantity: 4, label: "Carrow Instruments", condition: "used", chart: 11000 }],
    estimate: [12_000, 20_000],
  },
  {
    consignor: SHOP,
    title: "12AU7 x 10, shop stock",
    lines: [{ designation: "12AU7", quantity: 10, label: "Fairmont Home Radio", condition: "new-in-box" }],
    estimate: [8_000, 14_000],
  },
  {
    consignor: ESTATE,
    title: "Mixed audio drawer: 6SN7GT, 6V6GT, 5AR4",
    lines: [
      { designation: "6SN7GT", quantity: 4, label: "Carrow Instruments", condition: "used" },
      { designation: "6V6GT", quantity: 4, label: "Tri-County Parts", condition: "used" },
      { designation: "5AR4", quantity: 1, label: "Carrow Instruments", condition: "used" },
    ],
    estimate: [6_000, 10_000],
  },
  {
    consignor: ODETTE,
    title: "UCL82 and UY85 from a table radio",
    lines: [
      { designation: "UCL82", quantity: 3, label: "Tri-County Parts", condition: "used" },
      { designation: "UY85", quantity: 2, label: "Tri-County Parts", condition: "used" },
    ],
    estimate: [1_500, 3_000],
  },
  {
    consignor: SHOP,
    title: "EF80 and ECH81 IF and mixer stock",
    lines: [
      { designation: "EF80", quantity: 10, label: "Tri-County Parts", condition: "new-old-stock" },
      { designation: "ECH81", quantity: 6, label: "Tri-County Parts", condition: "new-old-stock" },
    ],
    estimate: [2_500, 5_000],
  },
];

// Sold history: single-type lots (so they count as comparables), months back from today.
const HISTORY: (Line & { consignor: string; monthsAgo: number; hammerMax: number })[] = [
  ...[11, 9, 7, 5, 3, 1].map((m, i) => ({
    consignor: SHOP,
    designation: "12AX7",
    quantity: 4,
    label: "Fairmont Home Radio",
    condition: "used" as const,
    monthsAgo: m,
    hammerMax: 4_000 + i * 600,
  })),
  ...[10, 8, 6, 4, 2].map((m, i) => ({
    consignor: ODETTE,
    designation: "ECC88",
    quantity: 2,
    label: "Tri-County Parts",
    condition: "new-old-stock" as const,
    monthsAgo: m,
    hammerMax: 3_000 + i * 500,
  })),
  ...[9, 6, 3].map((m, i) => ({
    consignor: ESTATE,
    designation: "EL84",
    quantity: 4,
    label: "Carrow Instruments",
    condition: "used" as const,
    monthsAgo: m,
    hammerMax: 3_600 + i * 400,
  })),
];

const item = (l: Line): ItemInput => ({
  designation: l.designation,
  quantity: l.chart ? 1 : l.quantity,
  labelBrand: l.label,
  makerName: null,
  makerBasis: "unconfirmed",
  sourceCode: null,
  dateCode: null,
  features: {},
  condition: l.condition,
  vacuumLoss: l.vacuumLoss ?? false,
  defects: [],
  hazards: [],
  notes: "",
  readings: l.chart ? [{ tubeNo: 1, measure: "gm", sections: [l.chart], chartNewValue: l.chart }] : [],
});

/** Items (a tested line becomes one item per tube) and two drawn pictures, while the lot is a draft. */
async function fillLot(c: Viewer, lotId: string, lines: Line[]): Promise<void> {
  for (const l of lines) {
    const n = l.chart ? l.quantity : 1;
    for (let k = 0; k < n; k++)
      await addItem(
        c,
        lotId,
        item({ ...l, chart: l.chart ? Math.round(l.chart * (0.82 + ((k * 29) % 30) / 100)) : undefined }),
      );
  }
  const first = lines[0]!;
  const tubes = lines.reduce((s, l) => s + l.quantity, 0);
  const white = lines.filter((l) => l.vacuumLoss).reduce((s, l) => s + l.quantity, 0);
  await addPhoto(
    c,
    lotId,
    {
      name: "carton.png",
      bytes: await cartonPicture({
        designation: first.designation,
        count: tubes,
        label: first.label,
        key: lotId,
        vacuumLoss: white,
      }),
    },
    { caption: "The carton as received" },
  );
  await addPhoto(
    c,
    lotId,
    {
      name: "close-up.png",
      bytes: await closeUpPicture({
        designation: first.designation,
        key: lotId,
        vacuumLoss: Boolean(first.vacuumLoss),
      }),
    },
    { caption: `One ${first.designation} up close` },
  );
}

/** Draw pictures for a demo lot made elsewhere (the evening sale's lots), from its first item. */
export async function pictureDemoLot(
  c: Viewer,
  lotId: string,
  designation: string,
  count: number,
  label: string,
): Promise<void> {
  await addPhoto(
    c,
    lotId,
    { name: "carton.png", bytes: await cartonPicture({ designation, count, label, key: lotId }) },
    { caption: "The carton as received" },
  );
  await addPhoto(
    c,
    lotId,
    { name: "close-up.png", bytes: await closeUpPicture({ designation, key: lotId }) },
    { caption: `One ${designation} up close` },
  );
}

async function listLot(viewer: (email: string) => Promise<Viewer>, admin: Viewer, l: Listing): Promise<string> {
  const c = await viewer(l.consignor);
  const lot = await createLot(c, {
    title: l.title,
    provenance: MARKER,
    shippingOrigin: "Demo county",
    testerKind: l.lines.some((x) => x.chart) ? "mutual-conductance" : "untested",
    testerNotes: "",
  });
  await fillLot(c, lot.id, l.lines);
  await submitLot(c, lot.id);
  await decideLot(admin, lot.id, {
    action: "approve",
    comment: "Demo lot",
    estimateLowCents: l.estimate[0],
    estimateHighCents: l.estimate[1],
    reserveCents: l.estimate[0],
    reserveAgreed: true,
  });
  return lot.id;
}

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Sell one history lot through the real paths, then date its sale and invoice back. */
async function sellHistoryLot(
  viewer: (email: string) => Promise<Viewer>,
  admin: Viewer,
  h: (typeof HISTORY)[number],
  buyer: Viewer,
  n: number,
): Promise<void> {
  const lotId = await listLot(viewer, admin, {
    consignor: h.consignor,
    title: `${h.quantity} × ${h.designation} (sold, demo history)`,
    lines: [h],
    estimate: [h.hammerMax / 2, h.hammerMax],
  });
  const sale = await createSale(admin, {
    title: "Past sale (demo history)",
    startsAt: new Date(Date.now() - 60_000).toISOString(),
    firstCloseAt: new Date(Date.now() + 2_000).toISOString(),
    gapSeconds: 30,
    softCloseSeconds: 1,
    lots: [{ lotId, openingCents: 1_000 }],
  });
  const [sl] = await db().query<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, {
    replacements: { id: sale.id },
    type: QueryTypes.SELECT,
  });
  await placeMaxBid(buyer, sl!.id, h.hammerMax, `demo-history-${lotId}`);
  await pause(2_500);
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
    attemptKey: `demo-history-pay-${n}`,
  });
  for (let k = 0; k < 60; k++) {
    const [row] = await db().query<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, {
      replacements: { id: inv.id },
      type: QueryTypes.SELECT,
    });
    if (row?.state === "paid-held") break;
    await pause(500);
  }
  await markShipped(inv.id, "Demo Parcel Co.", `DP-HIST-${String(n).padStart(4, "0")}`);
  await markDelivered(inv.id);
  await acceptDelivery(buyer, inv.id);
  const back = `${h.monthsAgo * 30 + (n % 9)} days`;
  await db().query(`UPDATE invoices SET created_at = now() - :back::interval WHERE id = :id`, {
    replacements: { back, id: inv.id },
  });
  await db().query(`UPDATE sale_lots SET closed_at = now() - :back::interval WHERE id = :id`, {
    replacements: { back, id: sl!.id },
  });
  await db().query(`UPDATE sales SET starts_at = now() - :back::interval - interval '1 hour' WHERE id = :id`, {
    replacements: { back, id: sale.id },
  });
}

/** The demo catalogue, once per database (its lots carry a marker in their provenance). */
export async function ensureDemoCatalogue(viewer: (email: string) => Promise<Viewer>): Promise<void> {
  const [done] = await db().query<{ n: string }>(`SELECT COUNT(*) AS n FROM lots WHERE provenance = :m`, {
    replacements: { m: MARKER },
    type: QueryTypes.SELECT,
  });
  if (Number(done?.n ?? 0) > 0) return;
  const admin = await viewer("priya@house.getterline.test");
  for (const l of LISTINGS) await listLot(viewer, admin, l);
  console.log(`demo: ${LISTINGS.length} lots listed in the catalogue`);
  const buyers = await Promise.all(
    ["bellweather@dealer.getterline.test", "northbank@dealer.getterline.test"].map(viewer),
  );
  for (const [n, h] of HISTORY.entries()) await sellHistoryLot(viewer, admin, h, buyers[n % 2]!, n);
  forgetComparables();
  await repairCatalogue(true);
  console.log(`demo: ${HISTORY.length} lots sold over the past year (price history)`);
}
