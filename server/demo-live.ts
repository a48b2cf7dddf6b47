// Demo only (DEMO_LIVE=1, set by `npm run demo`; never in production or tests):
// keeps a sale running with lots closing over the next hour, and a few
// simulated dealers bidding at random intervals so a newcomer sees prices move.
import { QueryTypes } from "sequelize";
import { minimumBidFor, type ProxyState } from "../lib/auction/proxy";
import type { Viewer } from "../lib/auth/guards";
import type { Role } from "../lib/auth/roles";
import { placeMaxBid } from "../lib/services/bidding";
import { openDispute } from "../lib/services/disputes/open";
import { postMessage } from "../lib/services/disputes/conversation";
import { markDelivered, markShipped } from "../lib/services/escrow";
import { closeSaleLot } from "../lib/services/lot-closing";
import { payInvoice } from "../lib/services/payments";
import { decideLot, submitLot } from "../lib/services/lot-review";
import { addItem, createLot } from "../lib/services/lots";
import { createSale } from "../lib/services/sales";
import type { ItemInput } from "../lib/validation/lots";
import { db, User } from "../models";
import { ensureDemoCatalogue, pictureDemoLot } from "./demo-catalogue";

const SIMULATED = [
  "bellweather@dealer.getterline.test",
  "northbank@dealer.getterline.test",
  "sablehill@dealer.getterline.test",
];
const LOCK_KEY = 7_331_001; // advisory lock: one instance runs the demo life

type LotSpec = {
  consignor: string;
  title: string;
  items: Partial<ItemInput>[];
  estimate: [number, number];
  reserve: number;
  opening: number;
};

const tubes = (
  designation: string,
  n: number,
  chart: number,
  label: string,
  condition: ItemInput["condition"] = "used",
): Partial<ItemInput>[] =>
  Array.from({ length: n }, (_, i) => ({
    designation,
    quantity: 1,
    labelBrand: label,
    condition,
    readings: [
      {
        tubeNo: 1,
        measure: "gm",
        sections: [Math.round(chart * (0.85 + ((i * 37) % 30) / 100))],
        chartNewValue: chart,
      },
    ],
  }));

// Invented demo lots (demo consignors, invented labels), offered fresh at each demo start.
const SPECS: LotSpec[] = [
  {
    consignor: "odette@consignor.getterline.test",
    title: "Matched quad: 6L6GC, tested strong",
    items: tubes("6L6GC", 4, 6000, "Carrow Instruments", "new-old-stock"),
    estimate: [18_000, 26_000],
    reserve: 15_000,
    opening: 5_000,
  },
  {
    consignor: "marrow-creek@consignor.getterline.test",
    title: "Boxed 12AX7 x 10, shop stock",
    items: tubes("12AX7", 10, 1600, "Fairmont Home Radio", "new-in-box"),
    estimate: [20_000, 30_000],
    reserve: 18_000,
    opening: 5_000,
  },
  {
    consignor: "sablehill@dealer.getterline.test",
    title: "EL84 pairs from a console amplifier",
    items: tubes("EL84", 6, 11300, "Tri-County Parts"),
    estimate: [9_000, 14_000],
    reserve: 8_000,
    opening: 2_000,
  },
  {
    consignor: "odette@consignor.getterline.test",
    title: "5AR4 rectifiers, new in box",
    items: [{ designation: "5AR4", quantity: 3, labelBrand: "Carrow Instruments", condition: "new-in-box" }],
    estimate: [12_000, 18_000],
    reserve: 10_000,
    opening: 3_000,
  },
  {
    consignor: "marrow-creek@consignor.getterline.test",
    title: "Radio drawer: 6BA6, 6BE6, 6AU6 (40 tubes)",
    items: [
      { designation: "6BA6", quantity: 15, labelBrand: "Tri-County Parts", condition: "new-old-stock" },
      { designation: "6BE6", quantity: 15, labelBrand: "Tri-County Parts", condition: "new-old-stock" },
      { designation: "6AU6", quantity: 10, labelBrand: "Fairmont Home Radio", condition: "new-old-stock" },
    ],
    estimate: [4_000, 7_000],
    reserve: 3_000,
    opening: 1_000,
  },
  {
    consignor: "odette@consignor.getterline.test",
    title: "6SN7GT x 8, graded",
    items: tubes("6SN7GT", 8, 2600, "Carrow Instruments"),
    estimate: [10_000, 16_000],
    reserve: 9_000,
    opening: 2_000,
  },
  {
    consignor: "sablehill@dealer.getterline.test",
    title: "12AU7 and 12AT7 mixed, tested",
    items: [...tubes("12AU7", 5, 2200, "Fairmont Home Radio"), ...tubes("12AT7", 5, 5500, "Fairmont Home Radio")],
    estimate: [6_000, 10_000],
    reserve: 5_000,
    opening: 1_500,
  },
  {
    consignor: "marrow-creek@consignor.getterline.test",
    title: "0A2 regulators, boxed (radioactive priming possible)",
    items: [{ designation: "0A2", quantity: 8, labelBrand: "Carrow Instruments", condition: "new-in-box" }],
    estimate: [3_000, 5_000],
    reserve: 2_500,
    opening: 800,
  },
  {
    consignor: "odette@consignor.getterline.test",
    title: "KT88 pair, used, strong",
    items: tubes("KT88", 2, 11500, "Carrow Instruments"),
    estimate: [15_000, 24_000],
    reserve: 20_000,
    opening: 4_000,
  },
  {
    consignor: "marrow-creek@consignor.getterline.test",
    title: "6V6GT x 6 from a closed shop",
    items: tubes("6V6GT", 6, 4100, "Tri-County Parts"),
    estimate: [7_000, 11_000],
    reserve: 6_000,
    opening: 1_500,
  },
  {
    consignor: "sablehill@dealer.getterline.test",
    title: "EF86 low-noise pentodes x 4",
    items: tubes("EF86", 4, 2000, "Fairmont Home Radio", "new-old-stock"),
    estimate: [8_000, 12_000],
    reserve: 7_000,
    opening: 2_000,
  },
  {
    consignor: "odette@consignor.getterline.test",
    title: "ECC88 x 6, new old stock",
    items: tubes("ECC88", 6, 12500, "Tri-County Parts", "new-old-stock"),
    estimate: [9_000, 15_000],
    reserve: 8_000,
    opening: 2_000,
  },
];

async function viewer(email: string): Promise<Viewer> {
  const u = await User.findOne({ where: { email } });
  if (!u) throw new Error(`demo account ${email} missing (run the seeders)`);
  return { id: u.id, email: u.email, name: u.displayName, roles: [...u.roles] as Role[] };
}

const item = (p: Partial<ItemInput>): ItemInput => ({
  designation: "",
  quantity: 1,
  labelBrand: "",
  makerName: null,
  makerBasis: "unconfirmed",
  sourceCode: null,
  dateCode: null,
  features: {},
  condition: "used",
  vacuumLoss: false,
  defects: [],
  hazards: [],
  readings: [],
  notes: "",
  ...p,
});

/** A fresh demo sale unless one is still running with lots closing later than ten minutes from now. */
async function ensureDemoSale(): Promise<void> {
  const [running] = await db().query<{ n: string }>(
    `SELECT COUNT(*) AS n FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id WHERE s.is_demo AND sl.phase = 'open' AND sl.closes_at > now() + interval '10 minutes'`,
    { type: QueryTypes.SELECT },
  );
  if (Number(running?.n ?? 0) > 0) return;
  const admin = await viewer("priya@house.getterline.test");
  const lots: { lotId: string; openingCents: number }[] = [];
  for (const spec of SPECS) {
    const c = await viewer(spec.consignor);
    const lot = await createLot(c, {
      title: spec.title,
      provenance: "Demo lot (invented).",
      shippingOrigin: "Demo county",
      testerKind: "mutual-conductance",
      testerNotes: "",
    });
    for (const it of spec.items) await addItem(c, lot.id, item(it));
    const first = spec.items[0]!;
    await pictureDemoLot(
      c,
      lot.id,
      first.designation!,
      spec.items.reduce((n, i) => n + (i.quantity ?? 1), 0),
      first.labelBrand ?? "",
    );
    await submitLot(c, lot.id);
    await decideLot(admin, lot.id, {
      action: "approve",
      comment: "Demo lot",
      estimateLowCents: spec.estimate[0],
      estimateHighCents: spec.estimate[1],
      reserveCents: spec.reserve,
      reserveAgreed: true,
    });
    lots.push({ lotId: lot.id, openingCents: spec.opening });
  }
  const now = Date.now();
  await createSale(
    admin,
    {
      title: `Evening sale (demo) ${new Date(now).toISOString().slice(0, 10)}`,
      startsAt: new Date(now - 60_000).toISOString(),
      firstCloseAt: new Date(now + 5 * 60_000).toISOString(),
      gapSeconds: 300,
      softCloseSeconds: 120,
      lots,
    },
    { isDemo: true },
  );
  console.log(`demo: a sale of ${lots.length} lots is running; the first closes in 5 minutes, the last in an hour`);
}

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * The demo's claim story, once per database: the Voss estate sells a small box
 * whose 12AX7s it attributed to one maker by construction; the dealer Quill &
 * Cathode wins, pays with the test card, receives it, and claims three tubes
 * carry another maker's code and construction; the estate contests. The claim
 * waits in the mediators' queue (sign in as a mediator to decide it).
 */
async function ensureDemoClaim(): Promise<void> {
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

/** One simulated dealer bids on one open demo lot, up to a limit of their own. */
async function simulatedBid(bidders: Viewer[]): Promise<void> {
  const open = await db().query<{
    id: string;
    price_cents: number;
    estimate_high_cents: number;
    bid_count: number;
    state: ProxyState;
  }>(
    `SELECT sl.id, sl.price_cents, l.estimate_high_cents, sl.bid_count, sl.state FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id JOIN lots l ON l.id = sl.lot_id
      WHERE s.is_demo AND sl.phase = 'open' AND sl.closes_at > now() AND s.starts_at <= now()`,
    { type: QueryTypes.SELECT },
  );
  if (!open.length) return;
  const lot = open[Math.floor(Math.random() * open.length)]!;
  const who = bidders[Math.floor(Math.random() * bidders.length)]!;
  const limit = Math.round(lot.estimate_high_cents * (0.6 + Math.random() * 0.6));
  const minimum = minimumBidFor(lot.state);
  if (minimum > limit) return;
  const max = Math.min(limit, Math.round(minimum * (1 + Math.random() * 0.2)));
  const r = await placeMaxBid(who, lot.id, max, `demo-${Date.now()}-${Math.random().toString(36).slice(2)}`);
  if (!r.accepted && r.reason !== "own-lot" && r.reason !== "max-not-raised")
    console.log(`demo: simulated bid refused (${r.reason})`);
}

/** Start the demo's life in this instance if no other instance runs it. */
export async function startDemoLife(): Promise<() => void> {
  const [got] = await db().query<{ ok: boolean }>(`SELECT pg_try_advisory_lock(${LOCK_KEY}) AS ok`, {
    type: QueryTypes.SELECT,
  });
  if (!got?.ok) return () => undefined;
  await ensureDemoSale();
  void ensureDemoClaim()
    .catch((e: Error) => console.error("[demo] claim story failed", e.message))
    .then(() => ensureDemoCatalogue(viewer))
    .catch((e: Error) => console.error("[demo] catalogue failed", e.message));
  const bidders = await Promise.all(SIMULATED.map(viewer));
  let stopped = false;
  const tick = () => {
    if (stopped) return;
    void simulatedBid(bidders)
      .catch(() => undefined)
      .finally(() => {
        if (!stopped) timer = setTimeout(tick, 2_000 + Math.random() * 6_000);
      });
  };
  let timer = setTimeout(tick, 3_000);
  const renew = setInterval(
    () => void ensureDemoSale().catch((e: Error) => console.error("[demo]", e.message)),
    5 * 60_000,
  );
  renew.unref();
  return () => {
    stopped = true;
    clearTimeout(timer);
    clearInterval(renew);
  };
}
