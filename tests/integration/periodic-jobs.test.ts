import PgBoss from "pg-boss";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { startPeriodic, type PeriodicHandle } from "../../lib/jobs/periodic";
import { reconcile } from "../../lib/services/reconcile";
import { periodicTasks, RECONCILE_EVERY_SECONDS } from "../../lib/services/periodic-jobs";
import { db } from "../../models";
import { startTestStripe, type TestStripe } from "../setup/stripe";

// Two app instances = two pg-boss clients on one database, each with its own ticker and worker, as two
// servers behind a balancer would have. [SUG] Background work runs once per period for the whole cluster.
describe("periodic work runs once per cluster, not once per instance", () => {
  let fake: TestStripe;
  const bosses: PgBoss[] = [];
  const handles: PeriodicHandle[] = [];
  const QUEUE = "reconcile-test";
  const runsNow = async () =>
    Number(
      (
        await db().query<{ n: string }>(`SELECT count(*) AS n FROM reconciliation_runs`, { type: QueryTypes.SELECT })
      )[0]!.n,
    );

  beforeAll(async () => {
    fake = await startTestStripe();
  });
  afterAll(async () => {
    for (const h of handles) h.stop();
    for (const b of bosses) await b.stop({ graceful: true, wait: true, timeout: 5_000 }).catch(() => undefined);
    await fake.stop();
  });

  it("two instances ticking the same 2-second period run reconciliation once per period", async () => {
    const before = await runsNow();
    for (let i = 0; i < 2; i++) {
      const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, max: 2, supervise: false });
      boss.on("error", () => undefined);
      await boss.start();
      bosses.push(boss);
      // The tickers are driven by the test below (one tick per instance per poll), not by their own timers.
      handles.push(
        await startPeriodic(boss, [{ name: QUEUE, everySeconds: 2, run: () => reconcile() }], {
          tickMs: 3_600_000,
          pollingIntervalSeconds: 0.5,
        }),
      );
    }
    await vi.waitFor(
      async () => {
        for (const h of handles) await h.tick();
        expect(await runsNow()).toBeGreaterThanOrEqual(before + 3);
      },
      { timeout: 40_000, interval: 250 },
    );
    for (const h of handles) h.stop();
    // Let the last period's job finish, then compare jobs, periods and ledger runs.
    await vi.waitFor(
      async () => {
        const [open] = await db().query<{ n: string }>(
          `SELECT count(*) AS n FROM pgboss.job WHERE name = :q AND state IN ('created', 'retry', 'active')`,
          { replacements: { q: QUEUE }, type: QueryTypes.SELECT },
        );
        expect(Number(open!.n)).toBe(0);
      },
      { timeout: 20_000, interval: 200 },
    );
    const [jobs] = await db().query<{ n: string; slots: string; done: string }>(
      `SELECT count(*) AS n, count(DISTINCT singleton_on) AS slots, count(*) FILTER (WHERE state = 'completed') AS done
         FROM pgboss.job WHERE name = :q`,
      { replacements: { q: QUEUE }, type: QueryTypes.SELECT },
    );
    // Both instances asked for every period they saw; only one job per period was made.
    const [a, b] = handles.map((h) => h.stats);
    expect(a!.sends).toBeGreaterThan(2);
    expect(b!.sends).toBeGreaterThan(2);
    expect(a!.sends + b!.sends).toBeGreaterThan(Number(jobs!.n));
    expect(a!.created + b!.created).toBe(Number(jobs!.n));
    expect(Number(jobs!.slots)).toBe(Number(jobs!.n));
    // Each period's job ran once: one reconciliation row per completed job, not two.
    expect(Number(jobs!.done)).toBe(Number(jobs!.n));
    expect((await runsNow()) - before).toBe(Number(jobs!.n));
  });

  it("the exchange's own list: reconciliation every ten minutes, every queue singleton and created at start", async () => {
    const tasks = periodicTasks();
    expect(tasks.find((t) => t.name === "reconcile")?.everySeconds).toBe(RECONCILE_EVERY_SECONDS);
    expect(tasks.map((t) => t.name).sort()).toEqual(
      [
        "dispute-sweep",
        "escrow-release",
        "invoice-reminders",
        "reconcile",
        "sweep-due-lots",
        "unexpected-charge-refunds",
      ].sort(),
    );
    const boss = bosses[0]!;
    const h = await startPeriodic(
      boss,
      tasks.map((t) => ({ ...t, run: async () => undefined })),
      { tickMs: 3_600_000 },
    );
    h.stop();
    for (const t of tasks) expect((await boss.getQueue(t.name))?.policy).toBe("singleton");
    // A second tick in the same period makes nothing new for the ten-minute reconciliation.
    const [r] = await db().query<{ n: string }>(`SELECT count(*) AS n FROM pgboss.job WHERE name = 'reconcile'`, {
      type: QueryTypes.SELECT,
    });
    await h.tick();
    const [r2] = await db().query<{ n: string }>(`SELECT count(*) AS n FROM pgboss.job WHERE name = 'reconcile'`, {
      type: QueryTypes.SELECT,
    });
    expect(Number(r2!.n)).toBe(Number(r!.n));
  });
});
