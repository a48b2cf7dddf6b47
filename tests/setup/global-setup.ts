// vitest global setup for integration tests: a database of this run's own
// (created, migrated, dropped afterwards) and the mail catcher on test ports.
import { mkdtemp, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import type { TestProject } from "vitest/node";
import { startDatabase, startMailCatcher, TEST_INBOX_PORT, TEST_SMTP_PORT, withDatabase } from "./services";

export default async function setup(project: TestProject) {
  const base = startDatabase();
  const name = `getterline_test_${process.pid}_${Date.now()}`;
  const admin = new pg.Client({ connectionString: withDatabase(base, "postgres") });
  await admin.connect();
  await admin.query(`CREATE DATABASE "${name}"`);
  await admin.end();
  const url = withDatabase(base, name);

  process.env.DATABASE_URL = url;
  process.env.NEXTAUTH_SECRET ??= "integration-test-secret-not-for-production";
  process.env.SMTP_PORT = String(TEST_SMTP_PORT);
  process.env.MAIL_CATCHER_URL = `http://127.0.0.1:${TEST_INBOX_PORT}`;
  process.env.MIGRATE_QUIET = "1";

  const { sequelizeFor } = await import("../../lib/db/sequelize");
  const { migrator } = await import("../../lib/db/migrator");
  const s = sequelizeFor(url, 2);
  await migrator(s).up();
  await s.close();

  const catcher = await startMailCatcher();
  project.provide("databaseUrl", url);
  // One payment processor for the whole run, as the one ledger is: each file's fake loads the state the
  // previous file left, so a reconciliation in any file compares like with like.
  const stripeDir = await mkdtemp(path.join(os.tmpdir(), "getterline-stripe-run-"));
  project.provide("stripeDir", stripeDir);

  return async () => {
    catcher?.kill();
    await rm(stripeDir, { recursive: true, force: true });
    const c = new pg.Client({ connectionString: withDatabase(base, "postgres") });
    await c.connect();
    await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    await c.end();
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
    stripeDir: string;
  }
}
