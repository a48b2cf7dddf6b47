import { jobId, queue, QUEUES } from "../jobs/queue";
import type { LotLive } from "../realtime/events";
import { notifyOutbid } from "./notices";

type Job = { userId: string; live: LotLive };

/**
 * Tell a dealer another is ahead, off the bid's path: a job keyed by person,
 * lot and seq (queued once however often this runs). Without a queue in the
 * process (a script, a test) the notice is sent at once.
 */
export async function queueOutbidNotice(userId: string, live: LotLive): Promise<void> {
  const boss = queue();
  if (!boss) return notifyOutbid(userId, live.saleLotId, live);
  await boss.send(QUEUES.outbidNotice, { userId, live } satisfies Job, {
    id: jobId("outbid", userId, live.saleLotId, String(live.seq)),
    retryLimit: 3,
  });
}

/** Work outbid notices in this process. */
export async function startOutbidWorker(): Promise<void> {
  const boss = queue();
  if (!boss) throw new Error("start the job queue first");
  await boss.work<Job>(QUEUES.outbidNotice, { pollingIntervalSeconds: 0.5, batchSize: 20 }, async (jobs) => {
    for (const job of jobs) await notifyOutbid(job.data.userId, job.data.live.saleLotId, job.data.live);
  });
}
