// Database CLI: node --import tsx scripts/migrate.ts up|down|seed|reset|fresh (development, demo, tests), or compiled
// by scripts/build-migrate.mjs: node dist/migrate.js up|down|seed|reset|fresh (production: npm run db:migrate).
// Creates the database named in DATABASE_URL when it does not exist yet.
import { loadEnvConfig } from "@next/env";
loadEnvConfig(process.cwd());
import pg from "pg";
import { env } from "../lib/config/env";
import { migrator, seeder } from "../lib/db/migrator";
import { sequelizeFor } from "../lib/db/sequelize";

/** Run `fn` on a connection to the server's maintenance database, with the target database's quoted name. */
async function onServer(url: string, fn: (c: pg.Client, name: string, quoted: string) => Promise<void>): Promise<void> {
  const u = new URL(url);
  const name = u.pathname.replace(/^\//, "");
  u.pathname = "/postgres";
  const c = new pg.Client({ connectionString: u.toString() });
  await c.connect();
  try {
    await fn(c, name, `"${name.replace(/"/g, '""')}"`);
  } finally {
    await c.end();
  }
}

const ensureDatabase = (url: string) =>
  onServer(url, async (c, name, quoted) => {
    const r = await c.query("SELECT 1 FROM pg_database WHERE datname = $1", [name]);
    if (r.rowCount === 0) {
      await c.query(`CREATE DATABASE ${quoted}`);
      console.log(`migrate: created database ${name}`);
    }
  });

const dropDatabase = (url: string) =>
  onServer(url, async (c, _name, quoted) => {
    await c.query(`DROP DATABASE IF EXISTS ${quoted} WITH (FORCE)`);
  });

async function main(): Promise<void> {
  const cmd = process.argv[2] ?? "up";
  const url = env().DATABASE_URL;
  // "fresh": drop, recreate, migrate and seed (used for the browser tests' database).
  if (cmd === "fresh") await dropDatabase(url);
  await ensureDatabase(url);
  const s = sequelizeFor(url, 2);
  try {
    if (cmd === "up") await migrator(s).up();
    else if (cmd === "down") await migrator(s).down();
    else if (cmd === "seed" || cmd === "fresh") {
      await migrator(s).up();
      await seeder(s).up();
    } else if (cmd === "reset") {
      await seeder(s).down({ to: 0 });
      await migrator(s).down({ to: 0 });
      await migrator(s).up();
      await seeder(s).up();
    } else throw new Error(`unknown command ${cmd}`);
  } finally {
    await s.close();
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
