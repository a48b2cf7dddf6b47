// Bid benchmark: the database's own ceiling for one bid's transaction shape on one hot lot row (pgbench).
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { CLUSTER, INCREMENT_CENTS } from "./setup";

export const PGBENCH = process.env.PGBENCH ?? "/usr/lib/postgresql/15/bin/pgbench";

/**
 * The statements placeMaxBid sends, in the same order and under the same
 * row lock: lock the lot row (joined to its sale), look for a prior bid with
 * the key, update the lot (state JSON included), append the bid with the
 * lot's next seq, commit. The seq is read back from the locked, updated row,
 * so it is unique and gapless like the app's.
 */
export function bidScript(saleLotId: string, bidderId: string): string {
  const lot = `'${saleLotId}'`;
  const bidder = `'${bidderId}'`;
  // A fresh key per transaction, as the app gets from each request. (md5(random()) in the WHERE would be volatile,
  // which keeps it out of the index condition and turns the key lookup into a scan of the bidder's bids.)
  return [
    "\\set k random(1, 9000000000000000000)",
    "BEGIN;",
    `SELECT sl.id, sl.sale_id, sl.phase, sl.closes_at, sl.extension_count, sl.seq, sl.state, sl.hammer_cents, s.starts_at, s.soft_close_seconds, now() AS db_now FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id WHERE sl.id = ${lot} FOR UPDATE OF sl;`,
    `SELECT seq, outcome, max_cents FROM bids WHERE sale_lot_id = ${lot} AND bidder_id = ${bidder} AND idempotency_key = 'pgb-' || :k;`,
    `UPDATE sale_lots SET seq = seq + 1, state = jsonb_set(jsonb_set(state, '{bidCount}', to_jsonb(bid_count + 1)), '{priceCents}', to_jsonb(price_cents + ${INCREMENT_CENTS})), price_cents = price_cents + ${INCREMENT_CENTS}, bid_count = bid_count + 1, leader_id = ${bidder}, updated_at = now() WHERE id = ${lot};`,
    `INSERT INTO bids (sale_lot_id, seq, bidder_id, max_cents, price_after_cents, outcome, idempotency_key, placed_at) SELECT id, seq, ${bidder}, price_cents, price_cents, 'new-leader', 'pgb-' || :k, now() FROM sale_lots WHERE id = ${lot};`,
    "COMMIT;",
    "",
  ].join("\n");
}

/** Run pgbench with `clients` connections for `seconds` (no vacuum, simple protocol like the app's); returns its TPS. */
export function runPgbench(opts: {
  database: string;
  saleLotId: string;
  bidderId: string;
  clients: number;
  seconds: number;
  dir: string;
  onStart?: (pid: number) => void;
}): Promise<{ tps: number; transactions: number; output: string }> {
  const file = path.join(opts.dir, "bid.sql");
  fs.writeFileSync(file, bidScript(opts.saleLotId, opts.bidderId));
  const args = [
    "-n",
    "-M",
    "simple",
    "-c",
    String(opts.clients),
    "-j",
    String(Math.min(2, opts.clients)),
    "-T",
    String(opts.seconds),
    "-f",
    file,
    "-h",
    CLUSTER.host,
    "-p",
    String(CLUSTER.port),
    "-U",
    CLUSTER.user,
    opts.database,
  ];
  return new Promise((resolve, reject) => {
    const child = spawn(PGBENCH, args, { stdio: ["ignore", "pipe", "pipe"] });
    if (child.pid) opts.onStart?.(child.pid);
    let out = "";
    child.stdout.on("data", (d: Buffer) => {
      out += d.toString();
    });
    child.stderr.on("data", (d: Buffer) => {
      out += d.toString();
    });
    const timer = setTimeout(() => child.kill("SIGKILL"), (opts.seconds + 60) * 1000);
    child.on("error", (e) => {
      clearTimeout(timer);
      reject(e);
    });
    child.on("exit", (code) => {
      clearTimeout(timer);
      const tps = /tps = ([\d.]+) \(without initial connection time\)/.exec(out);
      const tx = /number of transactions actually processed: (\d+)/.exec(out);
      if (code !== 0 || !tps) return reject(new Error(`pgbench failed (${code}):\n${out.slice(-2000)}`));
      resolve({ tps: Number(tps[1]), transactions: Number(tx?.[1] ?? 0), output: out });
    });
  });
}
