// Benchmark: live-sale bids on one hot lot, through the real app (production build, socket.io watchers).
// Run: node --import tsx scripts/bench-bids.ts [--watchers 200 --bidders 20 --seconds 20 --rate 50 --over socket|http]
//        [--profile (CPU profile of the app, summarised)] [--keep-logs] [--wait-idle <s> (wait for a quiet machine first)]
//
// Phase 1 (saturation): W watchers in the lot's room; M dealers bid at the current minimum as fast as answers
// come back for T s → accepted bids/s; then pgbench runs the same transaction shape on its own lot row with M
// clients for T s → baselineTps. Phase 2 (latency): bids sent open loop at R/s for T s; for each accepted bid,
// submission → its broadcast (matched by seq) reached every watcher → p50/p95/p99.
// Both phases count lost and duplicated bids against the answers, the watchers' receipts and the bids table.
// The last line is one JSON object; the exit code is non-zero when a bid was lost or duplicated or the bids table has a
// seq gap. Broadcasts arriving out of seq order are counted and printed, not failed. --profile slows the app down.
// Everything runs on this machine: the load generator, the watchers, pgbench, the app and PostgreSQL share its cores.
import { loadEnvConfig } from "@next/env";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { readBenchArgs } from "./bench-bids/args";
import { audit, percentile, round, type Audit } from "./bench-bids/checks";
import { CpuMeter, cpuLine, machineBusyCores } from "./bench-bids/cpu";
import {
  BidClient,
  Ledger,
  now,
  openLoop,
  saturate,
  SocketBidClient,
  type Accepted,
  type BidSender,
} from "./bench-bids/bidders";
import { runPgbench } from "./bench-bids/pgbench";
import { monotonicUs, summarise, type Window } from "./bench-bids/profile-summary";
import type { Receipts } from "./bench-bids/protocol";
import { ensureBuild, freePort, startServer, type AppServer } from "./bench-bids/server";
import {
  bidRows,
  createDatabase,
  databaseUrl,
  dropDatabase,
  INCREMENT_CENTS,
  migrate,
  OPENING_CENTS,
  seed,
  sessionCookie,
} from "./bench-bids/setup";
import { startWatchers, type Watchers } from "./bench-bids/watchers";
import { GAP_WAIT_MS } from "../lib/realtime/sequencer";

const cwd = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
loadEnvConfig(cwd, false, { info: () => undefined, error: console.error });

const { argv, W, M, T, R, WAIT_IDLE, DB } = readBenchArgs();

const log = (m: string) => console.log(`bench-bids: ${m}`);
const secret = process.env.NEXTAUTH_SECRET;
if (!secret) {
  console.error("NEXTAUTH_SECRET is not set (scripts/ensure-env.sh writes .env.local)");
  process.exit(2);
}

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "getterline-bench-bids-"));
let server: AppServer | undefined;
let watchers: Watchers | undefined;
let client: BidSender | undefined;
let meter: CpuMeter | undefined;
let dbCreated = false;
let failed = false;

let cleaning: Promise<void> | undefined;
function cleanup(): Promise<void> {
  cleaning ??= (async () => {
    client?.close();
    meter?.stop();
    await watchers?.stop().catch((e: Error) => console.error(`bench-bids: stopping watchers: ${e.message}`));
    await server?.stop().catch((e: Error) => console.error(`bench-bids: stopping the app: ${e.message}`));
    if (dbCreated)
      await dropDatabase(DB)
        .then(() => log(`dropped database ${DB}`))
        .catch((e: Error) => console.error(`bench-bids: dropping ${DB}: ${e.message}`));
    if (failed || argv["keep-logs"] || argv.profile) log(`logs kept in ${tmp}`);
    else fs.rmSync(tmp, { recursive: true, force: true });
  })();
  return cleaning;
}
for (const sig of ["SIGINT", "SIGTERM"] as const) {
  process.once(sig, () => {
    failed = true;
    log(`${sig}: cleaning up`);
    void cleanup().finally(() => process.exit(130));
  });
}
// A hard bound on the whole run, whatever happens.
const watchdog = setTimeout(
  () => {
    failed = true;
    console.error("bench-bids: watchdog fired, giving up");
    void cleanup().finally(() => process.exit(3));
  },
  (4 * T + 900 + WAIT_IDLE) * 1000,
);

/** Poll the watchers until every accepted seq reached all of them, or `maxMs` passes. */
async function drain(accepted: Accepted[], maxMs = 15_000): Promise<Receipts | undefined> {
  if (!accepted.length || !watchers) return undefined;
  const seqs = accepted.map((a) => a.seq);
  const from = seqs.reduce((m, s) => Math.min(m, s), Infinity);
  const to = seqs.reduce((m, s) => Math.max(m, s), 0);
  const deadline = now() + maxMs;
  for (;;) {
    const r = await watchers.query(from, to);
    const missing = seqs.filter((s) => (r.counts[s - from] ?? 0) < W).length;
    if (!missing || now() > deadline) return r;
    await new Promise((res) => setTimeout(res, 100));
  }
}

function describe(l: Ledger): string {
  const fmt = (m: Map<string, number>) => [...m.entries()].map(([k, v]) => `${k} ${v}`).join(", ") || "none";
  return `accepted ${l.accepted.length}; refused: ${fmt(l.refused)}; errors: ${fmt(l.errors)}`;
}

function serverLogTail(n = 30): string {
  try {
    return fs
      .readFileSync(server?.logFile ?? path.join(tmp, "server.log"), "utf8")
      .split("\n")
      .slice(-n)
      .join("\n");
  } catch {
    return "(no server log)";
  }
}

async function main(): Promise<number> {
  log(
    `watchers ${W}, bidders ${M}, ${T} s per phase, offered rate ${R}/s; ${os.cpus().length} cores shared by the load generator, watchers, pgbench, the app and PostgreSQL`,
  );
  await ensureBuild(cwd, log);
  // Other work on the machine skews every figure here: say how busy it is, and optionally wait for a quiet moment.
  let busy = await machineBusyCores();
  const idleBy = now() + WAIT_IDLE * 1000;
  while (busy > 0.3 && now() < idleBy) {
    log(`machine busy (${busy.toFixed(2)} cores): waiting for it to settle (--wait-idle ${WAIT_IDLE})`);
    await new Promise((r) => setTimeout(r, 8_000));
    busy = await machineBusyCores();
  }
  log(
    `machine busy before start: ${busy.toFixed(2)} of ${os.cpus().length} cores (other engineers' servers, tests, builds)`,
  );

  const url = databaseUrl(DB);
  await createDatabase(DB);
  dbCreated = true;
  let t0 = now();
  await migrate(cwd, url);
  log(`database ${DB} created and migrated in ${((now() - t0) / 1000).toFixed(1)} s (fsync as the cluster has it)`);
  const seeded = await seed(url, M, W);
  const dealerCookies = await Promise.all(seeded.dealers.map((u) => sessionCookie(u, secret!)));
  const watcherCookies = await Promise.all(seeded.watchers.map((u) => sessionCookie(u, secret!)));
  log(
    `seeded ${M} dealers, ${W} watchers, lot ${seeded.saleLotId} (opening $${OPENING_CENTS / 100}, flat $${INCREMENT_CENTS / 100} increments)`,
  );

  const port = await freePort(3300, 3399);
  const smtpPort = await freePort(3300, 3399, [port]); // nothing listens there: outbid mail fails fast and is logged
  t0 = now();
  server = await startServer({
    cwd,
    port,
    databaseUrl: url,
    smtpPort,
    logFile: path.join(tmp, "server.log"),
    cpuProfDir: argv.profile ? path.join(tmp, "prof") : undefined,
  });
  meter = new CpuMeter(path.join(cwd, ".data", "pg"), DB);
  meter.pids.app = server.child.pid;
  log(
    `app ready on 127.0.0.1:${port} in ${((now() - t0) / 1000).toFixed(1)} s (production build, pid ${server.child.pid})`,
  );

  const w = await startWatchers({
    url: `http://127.0.0.1:${port}`,
    saleLotId: seeded.saleLotId,
    cookies: watcherCookies,
  });
  watchers = w;
  meter.pids.watchers = w.pid;
  log(
    `${W} watchers connected (websocket) and joined lot:${seeded.saleLotId} in ${(w.joinMs / 1000).toFixed(1)} s (pid ${w.pid})`,
  );

  client =
    argv.over === "http"
      ? new BidClient(port, seeded.saleLotId, dealerCookies, Math.max(M, 256))
      : await SocketBidClient.open(port, seeded.saleLotId, dealerCookies);
  log(
    `dealers bid over ${argv.over === "http" ? "HTTP (POST /api/sale-lots/:id/bids)" : "their sockets (bid.place with an ack)"}`,
  );
  const app = server;
  const appGone = () => app.exited() !== null;
  const assertAppUp = (phase: string) => {
    if (appGone())
      throw new Error(
        `the app under test stopped during ${phase} (${app.exited()}): no figures from this run. Was it stopped from outside? Its log: ${app.logFile}`,
      );
  };
  const all: Accepted[] = [];

  // Warm-up: route modules load, JIT, paddle numbers given; audited, not timed.
  const warm = new Ledger();
  warm.minimumCents = OPENING_CENTS;
  await saturate(client, warm, M, 2, "warm-up", appGone);
  assertAppUp("the warm-up");
  all.push(...warm.accepted);
  log(`warm-up (2 s): ${describe(warm)}`);

  // Phase 1: saturation.
  const sat = new Ledger();
  sat.minimumCents = warm.minimumCents;
  const windows: Window[] = [];
  let mark = monotonicUs();
  let cpu0 = meter.snapshot();
  const satRun = await saturate(client, sat, M, T, "saturation", appGone);
  assertAppUp("saturation");
  windows.push({ label: "saturation", fromUs: mark, toUs: monotonicUs() });
  log(`saturation: ${cpuLine(cpu0, meter.snapshot())}`);
  all.push(...sat.accepted);
  const bidsPerSecond = sat.accepted.length / (satRun.elapsedMs / 1000);
  const answerMs = sat.accepted.map((a) => a.answeredAt - a.sentAt);
  log(
    `saturation: ${satRun.sent} requests in ${(satRun.elapsedMs / 1000).toFixed(1)} s = ${(satRun.sent / (satRun.elapsedMs / 1000)).toFixed(0)} req/s; ${describe(sat)}`,
  );
  log(
    `saturation: ${bidsPerSecond.toFixed(1)} accepted bids/s; answer time of accepted bids p50 ${round(percentile(answerMs, 50))} ms, p99 ${round(percentile(answerMs, 99))} ms`,
  );
  t0 = now();
  const satReceipts = await drain(sat.accepted);
  if (satReceipts) {
    const complete = sat.accepted.filter((a) => (satReceipts.counts[a.seq - satReceipts.from] ?? 0) >= W).length;
    log(
      `saturation: ${complete} of ${sat.accepted.length} accepted bids reached all ${W} watchers (drain ${((now() - t0) / 1000).toFixed(1)} s)`,
    );
  }

  // Baseline: the same transaction shape straight into PostgreSQL, on its own lot row, with M clients.
  cpu0 = meter.snapshot();
  const base = await runPgbench({
    database: DB,
    saleLotId: seeded.pgbenchLotId,
    bidderId: seeded.dealers[0]!.id,
    clients: M,
    seconds: T,
    dir: tmp,
    onStart: (pid) => {
      meter!.pids.pgbench = pid;
    },
  });
  log(`baseline: ${cpuLine(cpu0, meter.snapshot())}`);
  const ratio = base.tps > 0 ? bidsPerSecond / base.tps : NaN;
  log(
    `baseline (pgbench, ${M} clients, ${T} s, one hot row): ${base.tps.toFixed(1)} tps (${base.transactions} transactions); ratio ${ratio.toFixed(3)}`,
  );

  // Phase 2: latency at a fixed offered rate, open loop.
  const lat = new Ledger();
  lat.minimumCents = sat.minimumCents;
  assertAppUp("the baseline");
  cpu0 = meter.snapshot();
  mark = monotonicUs();
  const latRun = await openLoop(client, lat, M, T, R, INCREMENT_CENTS, appGone);
  assertAppUp("the latency phase");
  windows.push({ label: "latency", fromUs: mark, toUs: monotonicUs() });
  log(`latency: ${cpuLine(cpu0, meter.snapshot())}`);
  all.push(...lat.accepted);
  log(
    `latency: ${latRun.sent} bids offered at ${R}/s; ${describe(lat)}; send lag behind schedule p99 ${round(percentile(latRun.sendLagMs, 99), 2)} ms, max ${round(
      latRun.sendLagMs.reduce((m, x) => Math.max(m, x), 0),
      2,
    )} ms`,
  );
  const latReceipts = await drain(lat.accepted);
  const latencies: number[] = [];
  if (latReceipts) {
    for (const a of lat.accepted) {
      const i = a.seq - latReceipts.from;
      if ((latReceipts.counts[i] ?? 0) >= W) latencies.push(latReceipts.lastArrival[i]! - a.sentAt);
    }
  }
  const latAnswer = lat.accepted.map((a) => a.answeredAt - a.sentAt);
  log(
    `latency: submission → answer p50 ${round(percentile(latAnswer, 50))} ms, p99 ${round(percentile(latAnswer, 99))} ms; submission → last of ${W} watchers p50 ${round(percentile(latencies, 50))} ms, p95 ${round(percentile(latencies, 95))} ms, p99 ${round(percentile(latencies, 99))} ms, max ${round(latencies.reduce((m, x) => Math.max(m, x), 0))} ms (${latencies.length} bids)`,
  );

  // Audit every accepted bid of the run against the watchers and the table.
  await drain(all, 5_000);
  const receipts = await watchers.query(
    1,
    all.reduce((m, x) => Math.max(m, x.seq), 1),
  );
  const table = await bidRows(url, seeded.saleLotId);
  const a: Audit = audit(all, receipts, W, table);
  const lost = a.lost;
  const duplicated = a.dupBroadcast + a.dupAnswers + a.dupKeys;
  log(
    `audit: ${all.length} accepted answers, ${table.rows.length} bid rows (sale_lots.seq ${table.lotSeq}); lost: ${a.lostBroadcast} not broadcast to every watcher, ${a.lostTable} not in the table; duplicated: ${a.dupBroadcast} broadcast copies, ${a.dupAnswers} answers, ${a.dupKeys} keys; seq gaps ${a.gaps}; unanswered rows ${a.unanswered}; broadcasts without a row ${a.phantom}`,
  );
  log(
    `audit: order at the watchers: ${receipts.outOfOrder} arrivals behind a later seq, ${receipts.jumps} arrivals skipping a seq not yet seen; ${receipts.refetches} refetches after a ${GAP_WAIT_MS} ms wait; ${receipts.batches} batched frames`,
  );
  if (receipts.orderExamples.length) log(`audit: first arrivals out of order: ${receipts.orderExamples.join("; ")}`);
  log(
    `audit: watcher disconnects ${receipts.disconnects}, connect errors ${receipts.connectErrors}, still connected ${receipts.connected} of ${W}`,
  );
  for (const e of a.examples) log(`  ${e}`);
  const serverLog = fs.readFileSync(server.logFile, "utf8");
  const count = (re: RegExp) => (serverLog.match(re) ?? []).length;
  log(
    `app log: ${count(/\[api\] unexpected error/g)} unexpected errors, ${count(/\[socket adapter\]/g)} adapter errors, ${count(/\[mail\]/g)} mail failures (expected: nothing listens on ${smtpPort})`,
  );

  await watchers.stop();
  watchers = undefined;
  await server.stop();
  if (argv.profile) {
    const dir = path.join(tmp, "prof");
    // The app's main thread only (the other profiles are tsx's loader thread, idle after start).
    const files = (fs.existsSync(dir) ? fs.readdirSync(dir) : []).filter((f) => f.endsWith(".cpuprofile")).sort();
    const main = files.find((f) => /\.0\.\d+\.cpuprofile$/.test(f)) ?? files[0];
    if (main) for (const w of windows) console.log(summarise(path.join(dir, main), 30, w));
  }
  server = undefined;

  const ok = lost === 0 && duplicated === 0 && a.gaps === 0 && a.phantom === 0;
  if (!ok) failed = true;
  await cleanup();
  clearTimeout(watchdog);
  console.log(
    JSON.stringify({
      watchers: W,
      bidders: M,
      seconds: T,
      bidsPerSecond: round(bidsPerSecond),
      baselineTps: round(base.tps),
      ratio: round(ratio, 3),
      offeredRate: R,
      p50Ms: round(percentile(latencies, 50)),
      p95Ms: round(percentile(latencies, 95)),
      p99Ms: round(percentile(latencies, 99)),
      lost,
      duplicated,
      outOfOrder: receipts.outOfOrder + receipts.jumps,
      refetches: receipts.refetches,
    }),
  );
  return ok ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  async (e: Error) => {
    failed = true;
    console.error(`bench-bids: ${e.stack ?? e.message}`);
    if (server) console.error(`bench-bids: last lines of the app's log:\n${serverLogTail()}`);
    await cleanup();
    // Still one JSON line last, saying the run gave no figures.
    console.log(
      JSON.stringify({ watchers: W, bidders: M, seconds: T, offeredRate: R, error: e.message.split("\n")[0] }),
    );
    process.exit(1);
  },
);
