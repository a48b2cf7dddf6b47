import { createHash } from "node:crypto";
import PgBoss from "pg-boss";

/**
 * The Postgres-backed job queue (pg-boss), one per process, shared through
 * globalThis by the custom server and Next's bundle. Jobs run at least once,
 * so every handler is idempotent.
 */
const g = globalThis as unknown as { __getterlineBoss?: PgBoss };

export const QUEUES = {
  lotClose: "lot-close",
  outbidNotice: "outbid-notice",
  wantListMatch: "want-list-match",
  wantListDigest: "want-list-digest",
} as const;

/** Start pg-boss and create its queues (a send to a queue that does not exist is silently dropped). */
export async function startQueue(connectionString: string): Promise<PgBoss> {
  if (g.__getterlineBoss) return g.__getterlineBoss;
  const boss = new PgBoss({ connectionString, max: 4, application_name: "getterline-jobs", supervise: true });
  boss.on("error", (e: Error) => console.error("[jobs]", e.message));
  await boss.start();
  for (const name of Object.values(QUEUES))
    await boss.createQueue(name, { name, retryLimit: 5, retryDelay: 2, expireInSeconds: 60 });
  g.__getterlineBoss = boss;
  return boss;
}

export function queue(): PgBoss | undefined {
  return g.__getterlineBoss;
}

export async function stopQueue(): Promise<void> {
  const boss = g.__getterlineBoss;
  g.__getterlineBoss = undefined;
  if (boss) await boss.stop({ graceful: true, timeout: 5_000, wait: true }).catch(() => undefined);
}

/** A stable job id from its parts, so sending the same job twice queues it once. */
export function jobId(...parts: string[]): string {
  const h = createHash("sha256").update(parts.join("|")).digest("hex");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-a${h.slice(17, 20)}-${h.slice(20, 32)}`;
}
