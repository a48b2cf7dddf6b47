import type PgBoss from "pg-boss";

/**
 * Background work that must run once per period for the whole cluster, not once per app instance.
 *
 * Each task has its own pg-boss queue with the `singleton` policy (never two active at once). Every instance
 * ticks and sends a throttled job (`singletonKey` + `singletonSeconds`): pg-boss gives the job a slot computed
 * from the database clock and a unique index keeps one job per slot, so however many instances tick, the
 * period's job exists once and one worker runs it. pg-boss's own cron (`schedule`) is cluster-wide too but
 * has a one-minute resolution; the sweeps run every few seconds. Handlers stay idempotent: a job runs at
 * least once (a crash mid-run retries it).
 */
export type PeriodicTask = {
  /** Queue name; also the singleton key. */
  name: string;
  /** One run per this many seconds, cluster-wide (pg-boss wants whole seconds). */
  everySeconds: number;
  run: () => Promise<unknown>;
};

export type PeriodicHandle = {
  /** Send every task's job for the current slot; answers how many were new (0 when another instance was first). */
  tick: () => Promise<number>;
  stop: () => void;
  /** This instance's sends so far and how many of them made a new job. */
  readonly stats: { sends: number; created: number };
};

/** Create the queues, start a worker per task and this instance's ticker. */
export async function startPeriodic(
  boss: PgBoss,
  tasks: readonly PeriodicTask[],
  opts: { tickMs?: number; pollingIntervalSeconds?: number; log?: (m: string) => void } = {},
): Promise<PeriodicHandle> {
  const log = opts.log ?? ((m: string) => console.error(m));
  for (const t of tasks) {
    if (!Number.isInteger(t.everySeconds) || t.everySeconds < 1) throw new Error(`${t.name}: everySeconds must be ≥ 1`);
    // A send to a queue that was never created returns null silently: create them all first.
    await boss.createQueue(t.name, {
      name: t.name,
      policy: "singleton",
      retryLimit: 2,
      retryDelay: 5,
      expireInSeconds: Math.max(60, t.everySeconds * 2),
    });
    await boss.work(
      t.name,
      { pollingIntervalSeconds: opts.pollingIntervalSeconds ?? Math.min(2, Math.max(0.5, t.everySeconds / 4)) },
      async () => {
        await t.run();
      },
    );
  }
  const stats = { sends: 0, created: 0 };
  const tick = async (): Promise<number> => {
    let created = 0;
    for (const t of tasks) {
      const id = await boss
        .send(t.name, {}, { singletonKey: t.name, singletonSeconds: t.everySeconds })
        .catch((e: Error) => (log(`[jobs] ${t.name}: ${e.message}`), null));
      stats.sends++;
      if (id) created++;
    }
    stats.created += created;
    return created;
  };
  const shortest = Math.min(...tasks.map((t) => t.everySeconds));
  const timer = setInterval(() => void tick(), opts.tickMs ?? Math.max(500, (shortest * 1000) / 2));
  timer.unref();
  await tick();
  return { tick, stop: () => clearInterval(timer), stats };
}
