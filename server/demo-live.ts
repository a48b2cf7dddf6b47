// Demo only (DEMO_LIVE=1, set by `npm run demo`; never in production or tests):
// keeps a sale running with lots closing over the next hour, and a few
// simulated dealers bidding at random intervals so a newcomer sees prices move.
import { QueryTypes } from "sequelize";
import { minimumBidFor, type ProxyState } from "../lib/auction/proxy";
import type { Viewer } from "../lib/auth/guards";
import { placeMaxBid } from "../lib/services/bidding";
import { decideLot, submitLot } from "../lib/services/lot-review";
import { addItem, createLot } from "../lib/services/lots";
import { createSale } from "../lib/services/sales";
import type { ItemInput } from "../lib/validation/lots";
import { db } from "../models";
import { ensureDemoCatalogue, pictureDemoLot } from "./demo-catalogue";
import { ensureDemoClaim } from "./demo-claim";
import { item, viewer } from "./demo-helpers";

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
