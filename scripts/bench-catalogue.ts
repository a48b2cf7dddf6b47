// npm run bench:catalogue — the catalogue at market scale (run `npm run seed:scale` first). Starts the app's
// production server on the scale database and measures, one request at a time on this machine:
//  - search: a mix of designation, equivalent, word, filter, sort and next-page queries through GET /api/catalogue
//    (each distinct query several times, as popular searches are; the first run of each is reported apart);
//  - the server render of the lot page of a lot with 120 items;
//  - matching one newly listed lot against every want list (in this process, as the job does).
// The last line printed is one JSON object with the figures.
import { loadEnvConfig } from "@next/env";
loadEnvConfig(process.cwd());
import { execFileSync, spawn } from "node:child_process";
import { existsSync } from "node:fs";
import { performance } from "node:perf_hooks";
import pg from "pg";
import { scaleDatabaseUrl } from "./scale-db";

const PORT = Number(process.env.BENCH_PORT ?? 3310);
const BASE = `http://127.0.0.1:${PORT}`;
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 8);

const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.ceil(p * s.length) - 1)]!;
};
const round = (x: number) => Math.round(x * 10) / 10;

const QUERIES = [
  "q=6922",
  "q=el84",
  "q=ecc%2083",
  "q=12ax7a",
  "q=6sn7",
  "q=EL34",
  "q=5ar4",
  "q=pcl86",
  "q=12be6",
  "q=6v6gt",
  "q=kt88",
  "q=EF86",
  "q=6922&condition=new-old-stock",
  "q=12AX7&grade=strong&sort=newest",
  "q=EL84&noVacuumLoss=1&sets=pairs",
  "q=12AU7&status=sold",
  "q=estate",
  "q=attic%20cartons",
  "",
  "status=live&sort=closing",
  "status=upcoming",
  "status=sold&sort=newest",
  "family=6SN7GT&tested=yes",
  "estMaxCents=5000&sort=estimate",
  "condition=new-in-box&basis=construction-matched",
  "hazard=none&record=clean",
  "q=6DJ8&sort=estimate&estMinCents=10000",
];

async function get(path: string): Promise<{ ms: number; status: number; body: string }> {
  const t = performance.now();
  const res = await fetch(`${BASE}${path}`);
  const body = await res.text();
  return { ms: performance.now() - t, status: res.status, body };
}

async function main(): Promise<void> {
  const url = scaleDatabaseUrl();
  const c = new pg.Client({ connectionString: url });
  await c.connect().catch(() => {
    throw new Error(`no scale database at ${url}: run npm run seed:scale first`);
  });
  const counts = (
    await c.query(
      `SELECT (SELECT COUNT(*) FROM lots) AS lots, (SELECT COUNT(*) FROM lot_items) AS items, (SELECT COUNT(*) FROM want_lists) AS wants`,
    )
  ).rows[0] as { lots: string; items: string; wants: string };
  const big = (await c.query(`SELECT lot_id FROM lot_items GROUP BY lot_id HAVING COUNT(*) >= 120 LIMIT 1`)).rows[0] as
    { lot_id: string } | undefined;
  if (!existsSync(".next/BUILD_ID"))
    execFileSync("npx", ["next", "build"], { stdio: "inherit", env: { ...process.env, NODE_ENV: "production" } });

  const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    env: {
      ...process.env,
      NODE_ENV: "production",
      PORT: String(PORT),
      DATABASE_URL: url,
      NEXTAUTH_URL: BASE,
      DEMO_LIVE: "",
    },
    stdio: ["ignore", "ignore", "inherit"],
  });
  try {
    for (let k = 0; ; k++) {
      if (k > 240) throw new Error("the server did not start");
      if (
        await fetch(`${BASE}/api/health`).then(
          (r) => r.ok,
          () => false,
        )
      )
        break;
      await new Promise((r) => setTimeout(r, 500));
    }
    // Warm the server's code paths (first renders compile nothing, but caches and pools fill).
    for (const q of QUERIES.slice(0, 5)) await get(`/api/catalogue?${q}`);

    const first: number[] = [];
    const all: number[] = [];
    let pages = 0;
    for (let r = 0; r < ROUNDS; r++) {
      for (const q of QUERIES) {
        const res = await get(`/api/catalogue?${q}`);
        if (res.status !== 200) throw new Error(`search ${q} answered ${res.status}: ${res.body.slice(0, 200)}`);
        all.push(res.ms);
        if (r === 0) first.push(res.ms);
        const next = (JSON.parse(res.body) as { nextCursor: string | null }).nextCursor;
        if (next && r % 2 === 0) {
          // a next page, as a reader scrolls
          const more = await get(`/api/catalogue?${q}${q ? "&" : ""}cursor=${next}`);
          if (more.status !== 200) throw new Error(`next page of ${q} answered ${more.status}`);
          all.push(more.ms);
          pages++;
        }
      }
    }
    const lotPage: number[] = [];
    if (big) {
      await get(`/lots/${big.lot_id}`);
      for (let k = 0; k < 40; k++) {
        const res = await get(`/lots/${big.lot_id}`);
        if (res.status !== 200) throw new Error(`lot page answered ${res.status}`);
        lotPage.push(res.ms);
      }
    }

    // Want-list matching: new lots, each matched against every want list by the job's own function.
    process.env.DATABASE_URL = url;
    const { findWantListHits, matchLotToWantLists } = await import("../lib/services/want-list-matching");
    const matchMs: number[] = [];
    const recordMs: number[] = [];
    let hits = 0;
    for (let k = 0; k < 10; k++) {
      const lot = (
        await c.query(
          `INSERT INTO lots (id, consignor_id, title, state, estimate_low_cents, estimate_high_cents, reserve_cents, approved_at, created_at, updated_at)
          SELECT gen_random_uuid(), id, 'Bench lot ' || $1, 'approved', 5000, 9000, 5000, now(), now(), now() FROM users WHERE 'consignor' = ANY(roles) LIMIT 1 RETURNING id`,
          [k],
        )
      ).rows[0] as { id: string };
      await c.query(
        `INSERT INTO lot_items (id, lot_id, position, designation_typed, designation, designation_known, quantity, condition, created_at, updated_at)
          SELECT gen_random_uuid(), $1, g, d, d, true, 4, 'new-old-stock', now(), now() FROM unnest($2::text[]) WITH ORDINALITY AS t(d, g)`,
        [
          lot.id,
          [["12AX7", "6922", "EL84"], ["ECC88", "6SN7GT"], ["EL34", "5AR4", "12AU7"], ["6V6GT"], ["PCL86", "EF80"]][
            k % 5
          ],
        ],
      );
      const t = performance.now();
      hits += (await findWantListHits(lot.id)).length;
      matchMs.push(performance.now() - t);
      const t2 = performance.now();
      await matchLotToWantLists(lot.id); // the job: match again, record the hits, notices and the digest
      recordMs.push(performance.now() - t2);
    }
    await c.query(`DELETE FROM notices WHERE text LIKE 'Want list match:%Bench lot%'`);

    const figures = {
      lots: Number(counts.lots),
      items: Number(counts.items),
      wantLists: Number(counts.wants),
      searches: all.length,
      nextPages: pages,
      searchP50Ms: round(pct(all, 0.5)),
      searchP95Ms: round(pct(all, 0.95)),
      searchFirstRunP95Ms: round(pct(first, 0.95)),
      lotPageP95Ms: lotPage.length ? round(pct(lotPage, 0.95)) : null,
      lotPageItems: big ? 120 : null,
      wantListMatchMs: round(pct(matchMs, 0.5)),
      wantListMatchMaxMs: round(Math.max(...matchMs)),
      wantListHitsPerLot: round(hits / matchMs.length),
      wantListJobMs: round(pct(recordMs, 0.5)),
    };
    console.log(
      `search: ${all.length} requests (${QUERIES.length} distinct queries × ${ROUNDS}, ${pages} next pages); first run of each p95 ${figures.searchFirstRunP95Ms} ms`,
    );
    console.log(
      `lot page (120 items): p95 ${figures.lotPageP95Ms} ms over ${lotPage.length} renders; want-list match: median ${figures.wantListMatchMs} ms, max ${figures.wantListMatchMaxMs} ms, ${figures.wantListHitsPerLot} hits a lot; the whole job with notices and digests: median ${figures.wantListJobMs} ms`,
    );
    console.log(
      JSON.stringify({
        lots: figures.lots,
        items: figures.items,
        searchP50Ms: figures.searchP50Ms,
        searchP95Ms: figures.searchP95Ms,
        lotPageP95Ms: figures.lotPageP95Ms,
        wantListMatchMs: figures.wantListMatchMs,
        searchFirstRunP95Ms: figures.searchFirstRunP95Ms,
        wantListMatchMaxMs: figures.wantListMatchMaxMs,
        wantLists: figures.wantLists,
      }),
    );
  } finally {
    server.kill("SIGTERM");
    await c.end();
    const { db } = await import("../models");
    await db()
      .close()
      .catch(() => undefined);
  }
}

main().then(
  () => process.exit(0),
  (e) => {
    console.error(e);
    process.exit(1);
  },
);
