// Runs in each integration test worker: point the app at this run's database
// and close the pool when the file is done so workers do not hang.
import { afterAll, inject } from "vitest";

process.env.DATABASE_URL = inject("databaseUrl");
process.env.STRIPE_TEST_DIR = inject("stripeDir");
process.env.NEXTAUTH_SECRET ??= "integration-test-secret-not-for-production";
process.env.SMTP_PORT ??= "2525";
process.env.MAIL_CATCHER_URL ??= "http://127.0.0.1:2580";

afterAll(async () => {
  const { getSequelize, setSequelize } = await import("../../lib/db/sequelize");
  await getSequelize()
    .close()
    .catch(() => undefined);
  setSequelize(undefined);
});
