import { jobId, queue, QUEUES } from "../jobs/queue";

/** Queue the close of a sale lot at `closesAt`; the same lot and time queue one job however often this is called. */
export async function scheduleClose(saleLotId: string, closesAt: Date): Promise<void> {
  const boss = queue();
  if (!boss) return; // no worker in this process (the sweeper still closes due lots)
  await boss.send(
    QUEUES.lotClose,
    { saleLotId },
    { id: jobId("close", saleLotId, String(closesAt.getTime())), startAfter: closesAt, retryLimit: 5 },
  );
}
