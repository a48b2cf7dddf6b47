// npm run seed:scale — an invented catalogue at market scale in its own database (getterline_scale by default,
// or SCALE_DATABASE_URL): 100,000 lots with 1,000,000 items (a realistic mix of types, equivalents, conditions and
// readings), 20,000 sold lots for price history, 2,000 lots in upcoming and live sales, a shared tiny thumbnail
// per lot, and 10,000 want lists. Everything is generated; nothing here is real. Prints what it built and how long.
import { loadEnvConfig } from "@next/env";
loadEnvConfig(process.cwd());
import { execFileSync } from "node:child_process";
import pg from "pg";
import { scaleDatabaseUrl } from "./scale-db";
import { initialProxyState } from "../lib/auction/proxy";
import { DEFAULT_INCREMENT_LADDER } from "../lib/auction/increments";

const LOTS = Number(process.env.SCALE_LOTS ?? 100_000);
const SOLD = Math.round(LOTS / 5);
const IN_SALE = Math.round(LOTS / 50);
const WANT_LISTS = Number(process.env.SCALE_WANT_LISTS ?? 10_000);

// Types as estate boxes hold them, weighted by how often they turn up (our own guess for invented data).
const TYPES: [string, number][] = [
  ["12AX7", 9],
  ["ECC83", 6],
  ["12AU7", 7],
  ["ECC82", 4],
  ["12AT7", 5],
  ["ECC81", 3],
  ["6922", 3],
  ["6DJ8", 4],
  ["ECC88", 4],
  ["E88CC", 1],
  ["EL84", 5],
  ["6BQ5", 3],
  ["EL34", 4],
  ["6CA7", 1],
  ["6L6GC", 3],
  ["6V6GT", 4],
  ["KT88", 2],
  ["6550", 1],
  ["5AR4", 2],
  ["GZ34", 1],
  ["5Y3GT", 3],
  ["5U4G", 2],
  ["EZ80", 2],
  ["EZ81", 1],
  ["6SN7GT", 4],
  ["6SL7GT", 2],
  ["6AU6", 3],
  ["6BA6", 3],
  ["6BE6", 3],
  ["12BE6", 3],
  ["12BA6", 3],
  ["12AV6", 3],
  ["50C5", 2],
  ["35W4", 2],
  ["PCL86", 2],
  ["PCF80", 2],
  ["PCL82", 1],
  ["ECC85", 1],
  ["EF80", 2],
  ["ECH81", 2],
  ["EF86", 2],
  ["ECL86", 1],
  ["UCL82", 1],
  ["UY85", 1],
  ["PL36", 1],
  ["PY88", 1],
  ["0A2", 1],
  ["0B2", 1],
  ["6X4", 2],
  ["6AQ5", 2],
];
const CHART: Record<string, number> = {
  "12AX7": 1600,
  ECC83: 1600,
  "12AU7": 2200,
  ECC82: 2200,
  "12AT7": 5500,
  ECC81: 5500,
  "6922": 12500,
  "6DJ8": 12500,
  ECC88: 12500,
  EL84: 11300,
  "6BQ5": 11300,
  EL34: 11000,
  "6L6GC": 6000,
  "6V6GT": 4100,
  KT88: 11500,
  "6SN7GT": 2600,
};
const WORDS = [
  "estate",
  "attic",
  "bench",
  "drawer",
  "shop",
  "stock",
  "boxed",
  "tested",
  "sleeves",
  "cartons",
  "radio",
  "amplifier",
  "console",
  "service",
  "spares",
];

async function main(): Promise<void> {
  const started = Date.now();
  const url = scaleDatabaseUrl();
  const step = (what: string) => console.log(`seed:scale ${((Date.now() - started) / 1000).toFixed(1)} s — ${what}`);
  const admin = new URL(url);
  const name = admin.pathname.slice(1);
  admin.pathname = "/postgres";
  const a = new pg.Client({ connectionString: admin.toString() });
  await a.connect();
  await a.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  await a.query(`CREATE DATABASE "${name}"`);
  await a.end();
  execFileSync(process.execPath, ["--import", "tsx", "scripts/migrate.ts", "up"], {
    env: { ...process.env, DATABASE_URL: url, MIGRATE_QUIET: "1" },
    stdio: "inherit",
  });
  step("migrated");
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  await c.query("SET synchronous_commit = off");
  const hash = "$2b$10$abcdefghijklmnopqrstuuJ6zH3sS2wN6l7f0v3t0X1yQ5m0X8a2."; // no one signs in to the scale database
  await c.query(
    `INSERT INTO users (id, email, display_name, password_hash, roles, created_at, updated_at)
    SELECT gen_random_uuid(), 'consignor' || g || '@scale.getterline.test', 'Scale consignor ' || g, $1, ARRAY['consignor'], now(), now() FROM generate_series(1, 500) g
    UNION ALL SELECT gen_random_uuid(), 'dealer' || g || '@scale.getterline.test', 'Scale dealer ' || g, $1, ARRAY['dealer'], now(), now() FROM generate_series(1, 3000) g
    UNION ALL SELECT gen_random_uuid(), 'house@scale.getterline.test', 'Scale house', $1, ARRAY['admin'], now(), now()`,
    [hash],
  );
  await c.query(
    `CREATE TEMP TABLE consignors AS SELECT row_number() OVER () AS n, id FROM users WHERE 'consignor' = ANY(roles)`,
  );
  await c.query(
    `CREATE TEMP TABLE dealers AS SELECT row_number() OVER () AS n, id FROM users WHERE 'dealer' = ANY(roles)`,
  );
  await c.query(`CREATE TEMP TABLE types (n int, designation text, chart int)`);
  let n = 0;
  for (const [d, w] of TYPES)
    for (let k = 0; k < w; k++) await c.query(`INSERT INTO types VALUES ($1, $2, $3)`, [++n, d, CHART[d] ?? null]);
  const typeCount = n;
  step("users and types");

  // Lots: every one approved; the first SOLD are sold, the next IN_SALE are in sales. Listed over two years.
  await c.query(`CREATE TEMP TABLE words AS SELECT row_number() OVER () AS n, w FROM unnest($1::text[]) w`, [WORDS]);
  await c.query(
    `INSERT INTO lots (id, consignor_id, title, provenance, shipping_origin, tester_kind, tester_notes, state, estimate_low_cents, estimate_high_cents, reserve_cents, reserve_agreed_at, submitted_at, approved_at, extra_review, created_at, updated_at)
    SELECT gen_random_uuid(), (SELECT id FROM consignors WHERE n = 1 + (g * 7919) % 500), 'Scale lot ' || g || ': ' || w1.w || ' ' || w2.w,
           'Invented scale lot number ' || g || ' from an ' || w3.w || '.', 'Scale county', CASE WHEN g % 3 = 0 THEN 'mutual-conductance' ELSE 'untested' END, '', 'approved',
           e.low, e.low * 2, e.low, now(), now(), now() - ((g % 730) || ' days')::interval - ((g % 1440) || ' minutes')::interval, false, now(), now()
      FROM generate_series(1, $1::int) g
      JOIN words w1 ON w1.n = 1 + g % ${WORDS.length} JOIN words w2 ON w2.n = 1 + (g / 7) % ${WORDS.length} JOIN words w3 ON w3.n = 1 + (g / 3) % ${WORDS.length}
      CROSS JOIN LATERAL (SELECT (1000 + (g * 37) % 60000) AS low) e`,
    [LOTS],
  );
  await c.query(`CREATE TEMP TABLE lot_seq AS SELECT row_number() OVER (ORDER BY approved_at, id) AS n, id FROM lots`);
  await c.query(`CREATE INDEX ON lot_seq (n)`);
  step(`${LOTS.toLocaleString("en")} lots`);

  // Items: 1 to 19 lines per lot (10 on average) of one to three types, as a drawer or a carton holds them; the
  // bench's page lot (lot 1) has 120. Tested lots carry Gm readings.
  await c.query(`INSERT INTO lot_items (id, lot_id, position, designation_typed, designation, designation_known, quantity, label_brand, maker_name, maker_basis, source_code, date_code, features, condition, vacuum_loss, defects, hazards, readings, notes, created_at, updated_at)
    SELECT gen_random_uuid(), s.id, k, t.designation, t.designation, true, 1 + (s.n * k) % 4, 'Scale Label ' || (1 + s.n % 9), NULL,
           CASE WHEN (s.n + k) % 11 = 0 THEN 'construction-matched' ELSE 'unconfirmed' END, NULL, NULL, '{}'::jsonb,
           (ARRAY['used','used','used','new-old-stock','new-in-box'])[1 + (s.n + k) % 5], (s.n * k) % 29 = 0, '{}', '{}',
           CASE WHEN s.n % 3 = 0 AND t.chart IS NOT NULL THEN jsonb_build_array(jsonb_build_object('tubeNo', 1, 'measure', 'gm', 'sections', jsonb_build_array(round(t.chart * (0.7 + ((s.n * k) % 45) / 100.0))), 'chartNewValue', t.chart)) ELSE '[]'::jsonb END,
           '', now(), now()
      FROM lot_seq s
      CROSS JOIN LATERAL generate_series(1, CASE WHEN s.n = 1 THEN 120 ELSE 1 + (s.n * 13) % 19 END) k
      JOIN types t ON t.n = 1 + ((s.n * 31 + (k % (1 + s.n % 3)) * 17) % ${typeCount})`);
  // Tested lines are single tubes (one reading each).
  await c.query(`UPDATE lot_items SET quantity = 1 WHERE jsonb_array_length(readings) > 0`);
  const items = Number((await c.query(`SELECT COUNT(*) AS n FROM lot_items`)).rows[0].n);
  step(`${items.toLocaleString("en")} items`);

  // Sales: sold lots in 200 past sales with invoices (released), lots in sales closing over the next days.
  const state = JSON.stringify(
    initialProxyState({
      openingCents: 1000,
      reserveCents: null,
      ladder: DEFAULT_INCREMENT_LADDER,
      consignorId: "00000000-0000-4000-8000-000000000000",
    }),
  );
  await c.query(`INSERT INTO sales (id, title, starts_at, soft_close_seconds, is_demo, created_at, updated_at)
    SELECT gen_random_uuid(), 'Scale sale ' || g, now() - ((g * 3) || ' days')::interval, 120, false, now(), now() FROM generate_series(1, 200) g
    UNION ALL SELECT gen_random_uuid(), 'Scale sale upcoming ' || g, now() + (g || ' hours')::interval - interval '3 hours', 120, false, now(), now() FROM generate_series(1, 10) g`);
  await c.query(
    `CREATE TEMP TABLE sale_seq AS SELECT row_number() OVER (ORDER BY starts_at) AS n, id, starts_at FROM sales`,
  );
  await c.query(
    `INSERT INTO sale_lots (id, sale_id, lot_id, position, consignor_id, phase, opening_cents, closes_at, original_close_at, extension_count, seq, price_cents, bid_count, leader_id, reserve_met, state, closed_at, buyer_id, hammer_cents, unsold_reason, created_at, updated_at)
    SELECT gen_random_uuid(), ss.id, l.id, s.n, l.consignor_id, 'sold', 1000, ss.starts_at + interval '1 hour', ss.starts_at + interval '1 hour', 0, 1, h.hammer, 3, d.id, true, $1::jsonb,
           ss.starts_at + interval '1 hour', d.id, h.hammer, NULL, now(), now()
      FROM lot_seq s JOIN lots l ON l.id = s.id JOIN sale_seq ss ON ss.n = 1 + s.n % 200 JOIN dealers d ON d.n = 1 + (s.n * 13) % 3000
      CROSS JOIN LATERAL (SELECT l.estimate_low_cents + (s.n * 53) % greatest(l.estimate_low_cents, 1) AS hammer) h
     WHERE s.n > 1 AND s.n <= $2::int + 1`,
    [state, SOLD],
  );
  await c.query(
    `INSERT INTO sale_lots (id, sale_id, lot_id, position, consignor_id, phase, opening_cents, closes_at, original_close_at, extension_count, seq, price_cents, bid_count, leader_id, reserve_met, state, created_at, updated_at)
    SELECT gen_random_uuid(), ss.id, l.id, s.n, l.consignor_id, 'open', 1000, ss.starts_at + ((s.n % 500) || ' minutes')::interval + interval '4 hours', ss.starts_at + interval '4 hours', 0, 0, 0, 0, NULL, false, $1::jsonb, now(), now()
      FROM lot_seq s JOIN lots l ON l.id = s.id JOIN sale_seq ss ON ss.n = 201 + s.n % 10
     WHERE s.n > $2::int + 1 AND s.n <= $2::int + 1 + $3::int`,
    [state, SOLD, IN_SALE],
  );
  await c.query(`INSERT INTO invoices (id, number, sale_lot_id, lot_id, buyer_id, consignor_id, state, hammer_cents, premium_bp, premium_cents, shipping_cents, tax_cents, total_cents, commission_cents, tube_count, due_at, paid_at, released_at, created_at, updated_at)
    SELECT gen_random_uuid(), 'SC-' || row_number() OVER (), sl.id, sl.lot_id, sl.buyer_id, sl.consignor_id, 'released', sl.hammer_cents, 1000, sl.hammer_cents / 10, 900, 0,
           sl.hammer_cents + sl.hammer_cents / 10 + 900, sl.hammer_cents / 5, 1, sl.closed_at + interval '7 days', sl.closed_at, sl.closed_at + interval '14 days', sl.closed_at, now()
      FROM sale_lots sl WHERE sl.phase = 'sold'`);
  step(`${SOLD.toLocaleString("en")} sold lots with invoices, ${IN_SALE.toLocaleString("en")} lots in sales`);

  // Thumbnails: one tiny generated picture per lot, shared objects (the bench does not load images).
  await c.query(`INSERT INTO lot_photos (id, lot_id, item_id, full_key, thumb_key, width, height, bytes, sha256, caption, uploaded_by, created_at)
    SELECT gen_random_uuid(), l.id, NULL, 'scale/full-' || (s.n % 20) || '.jpg', 'scale/thumb-' || (s.n % 20) || '.jpg', 64, 64, 600, md5(l.id::text) || md5(l.id::text), 'Scale picture', l.consignor_id, now()
      FROM lot_seq s JOIN lots l ON l.id = s.id`);
  step("thumbnails");
  await c.end();

  // Catalogue entries and want lists through the app's own code (the same aggregate a listing writes).
  execFileSync(process.execPath, ["--import", "tsx", "scripts/seed-scale-entries.ts"], {
    env: { ...process.env, DATABASE_URL: url, SCALE_WANT_LISTS: String(WANT_LISTS) },
    stdio: "inherit",
  });
  step("done");
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
