// Bid benchmark: its own database (created, migrated, seeded with invented rows, dropped) and session cookies.
import { randomUUID } from "node:crypto";
import { spawn } from "node:child_process";
import { encode } from "next-auth/jwt";
import pg from "pg";
import { flatLadder } from "../../lib/auction/increments";
import { initialProxyState } from "../../lib/auction/proxy";
import type { Role } from "../../lib/auth/roles";

/** Where the private cluster listens (see scripts/db.sh). */
export const CLUSTER = { host: "127.0.0.1", port: 54329, user: "app" } as const;

/** Opening price and flat increment of the bench lots: $1.00 and $1.00, so ~10^6 bids fit under the route's cap. */
export const OPENING_CENTS = 100;
export const INCREMENT_CENTS = 100;

export type BenchUser = { id: string; email: string; name: string; roles: Role[] };
export type Seeded = {
  saleId: string;
  /** The lot the app is benchmarked on. */
  saleLotId: string;
  /** A second lot, written only by pgbench. */
  pgbenchLotId: string;
  dealers: BenchUser[];
  watchers: BenchUser[];
};

export function databaseUrl(name: string): string {
  return `postgres://${CLUSTER.user}@${CLUSTER.host}:${CLUSTER.port}/${name}`;
}

async function withAdmin<T>(run: (c: pg.Client) => Promise<T>): Promise<T> {
  const c = new pg.Client({ connectionString: databaseUrl("postgres"), connectionTimeoutMillis: 5_000 });
  await c.connect();
  try {
    return await run(c);
  } finally {
    await c.end();
  }
}

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;

/** Drop (if left over) and create the bench database. */
export async function createDatabase(name: string): Promise<void> {
  await withAdmin(async (c) => {
    await c.query(`DROP DATABASE IF EXISTS ${quoteIdent(name)} WITH (FORCE)`);
    await c.query(`CREATE DATABASE ${quoteIdent(name)}`);
  });
}

/** Drop the bench database, closing whatever is still connected to it. */
export async function dropDatabase(name: string): Promise<void> {
  await withAdmin((c) => c.query(`DROP DATABASE IF EXISTS ${quoteIdent(name)} WITH (FORCE)`));
}

/** Run the project's migrations against the bench database (a child process, bounded in time). */
export function migrate(cwd: string, url: string, timeoutMs = 180_000): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", "scripts/migrate.ts", "up"], {
      cwd,
      env: { ...process.env, DATABASE_URL: url },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    child.stdout.on("data", (d: Buffer) => {
      out += d.toString();
    });
    child.stderr.on("data", (d: Buffer) => {
      out += d.toString();
    });
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
    }, timeoutMs);
    child.on("error", (e) => {
      clearTimeout(timer);
      reject(e);
    });
    child.on("exit", (code, signal) => {
      clearTimeout(timer);
      if (code === 0) resolve();
      else reject(new Error(`migrate exited with ${code ?? signal}:\n${out.slice(-3000)}`));
    });
  });
}

/**
 * Invented rows only: one consignor and one approved lot per bench lot, a
 * sale that started a minute ago, lots closing in a day (so no soft-close
 * extension and no close during the run), M dealers and W watchers.
 */
export async function seed(url: string, dealers: number, watchers: number): Promise<Seeded> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    const now = new Date();
    const user = (kind: string, i: number, roles: Role[]): BenchUser => {
      const n = String(i + 1).padStart(3, "0");
      return { id: randomUUID(), email: `bench-${kind}-${n}@bench.getterline.test`, name: `Bench ${kind} ${n}`, roles };
    };
    const consignor = user("consignor", 0, ["consignor"]);
    const ds = Array.from({ length: dealers }, (_, i) => user("dealer", i, ["dealer"]));
    const ws = Array.from({ length: watchers }, (_, i) => user("watcher", i, ["dealer"]));
    const all = [consignor, ...ds, ...ws];
    // Nobody signs in with a password here: the hash is a placeholder no password matches.
    for (let i = 0; i < all.length; i += 500) {
      const chunk = all.slice(i, i + 500);
      const values: unknown[] = [];
      const rows = chunk.map((u, k) => {
        values.push(u.id, u.email, u.name, "!bench-no-password", u.roles);
        const b = k * 5;
        return `($${b + 1}, $${b + 2}, $${b + 3}, $${b + 4}, $${b + 5}::varchar[], now(), now())`;
      });
      await c.query(
        `INSERT INTO users (id, email, display_name, password_hash, roles, created_at, updated_at) VALUES ${rows.join(",")}`,
        values,
      );
    }

    const saleId = randomUUID();
    await c.query(
      `INSERT INTO sales (id, title, starts_at, soft_close_seconds, is_demo, created_by, created_at, updated_at)
       VALUES ($1, 'Bench sale (synthetic)', now() - interval '1 minute', 120, false, NULL, now(), now())`,
      [saleId],
    );
    const closesAt = new Date(now.getTime() + 24 * 3600 * 1000);
    const makeLot = async (position: number, title: string): Promise<string> => {
      const lotId = randomUUID();
      await c.query(
        `INSERT INTO lots (id, consignor_id, title, provenance, shipping_origin, tester_kind, tester_notes, state, estimate_low_cents,
                           estimate_high_cents, reserve_cents, reserve_agreed_at, submitted_at, approved_at, approved_by, extra_review, created_at, updated_at)
         VALUES ($1, $2, $3, 'Synthetic benchmark lot', 'Nowhere', 'untested', '', 'approved', 1000, 5000, NULL, now(), now(), now(), NULL, false, now(), now())`,
        [lotId, consignor.id, title],
      );
      const state = initialProxyState({
        openingCents: OPENING_CENTS,
        reserveCents: null,
        ladder: flatLadder(INCREMENT_CENTS),
        consignorId: consignor.id,
      });
      const saleLotId = randomUUID();
      await c.query(
        `INSERT INTO sale_lots (id, sale_id, lot_id, position, consignor_id, phase, opening_cents, closes_at, original_close_at,
                                extension_count, seq, price_cents, bid_count, leader_id, reserve_met, state, created_at, updated_at)
         VALUES ($1, $2, $3, $4, $5, 'open', $6, $7, $7, 0, 0, 0, 0, NULL, false, $8::jsonb, now(), now())`,
        [saleLotId, saleId, lotId, position, consignor.id, OPENING_CENTS, closesAt, JSON.stringify(state)],
      );
      return saleLotId;
    };
    const saleLotId = await makeLot(1, "Bench lot: a drawer of mixed receiving tubes (synthetic)");
    const pgbenchLotId = await makeLot(2, "Bench lot: baseline row for pgbench (synthetic)");
    return { saleId, saleLotId, pgbenchLotId, dealers: ds, watchers: ws };
  } finally {
    await c.end();
  }
}

/** A next-auth session cookie for a bench user, as tests/support/factories.ts mints them. */
export async function sessionCookie(u: BenchUser, secret: string): Promise<string> {
  const token = await encode({ token: { uid: u.id, roles: u.roles, email: u.email, name: u.name, sub: u.id }, secret });
  return `next-auth.session-token=${token}`;
}

export type BidRow = { seq: number; bidder_id: string; idempotency_key: string };

/** Every bid row of a lot, in sequence order. */
export async function bidRows(
  url: string,
  saleLotId: string,
): Promise<{ rows: BidRow[]; lotSeq: number; dupKeys: number }> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    const r = await c.query<BidRow>(
      `SELECT seq, bidder_id, idempotency_key FROM bids WHERE sale_lot_id = $1 ORDER BY seq`,
      [saleLotId],
    );
    const l = await c.query<{ seq: number }>(`SELECT seq FROM sale_lots WHERE id = $1`, [saleLotId]);
    const d = await c.query<{ n: string }>(
      `SELECT count(*) AS n FROM (SELECT idempotency_key FROM bids WHERE sale_lot_id = $1 GROUP BY idempotency_key HAVING count(*) > 1) x`,
      [saleLotId],
    );
    return { rows: r.rows, lotSeq: l.rows[0]?.seq ?? 0, dupKeys: Number(d.rows[0]?.n ?? 0) };
  } finally {
    await c.end();
  }
}
