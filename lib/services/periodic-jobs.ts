import type PgBoss from "pg-boss";
import { startPeriodic, type PeriodicHandle, type PeriodicTask } from "../jobs/periodic";

/** Reconciliation of our ledger against the processor: once every ten minutes across the cluster. */
export const RECONCILE_EVERY_SECONDS = 10 * 60;
/** The sweeps (late closes, escrow release, reminders, disputes, unexpected charges): every ten seconds. */
export const SWEEP_EVERY_SECONDS = 10;

/**
 * The exchange's periodic work, each task once per period for the whole cluster (lib/jobs/periodic.ts).
 * Every handler is idempotent: guarded updates and business keys, so a retried job changes nothing twice.
 * Services are loaded lazily so this list does not pull the payment code into every importer.
 */
export function periodicTasks(): PeriodicTask[] {
  const every = SWEEP_EVERY_SECONDS;
  return [
    { name: "sweep-due-lots", everySeconds: every, run: async () => (await import("./lot-closing")).sweepDueLots() },
    { name: "escrow-release", everySeconds: every, run: async () => (await import("./escrow")).releaseDue() },
    { name: "invoice-reminders", everySeconds: every, run: async () => (await import("./invoices")).sendReminders() },
    { name: "dispute-sweep", everySeconds: every, run: async () => (await import("./disputes")).disputeSweep() },
    {
      name: "unexpected-charge-refunds",
      everySeconds: every,
      run: async () => (await import("./unexpected-charges")).refundDueUnexpectedCharges(),
    },
    {
      name: "reconcile",
      everySeconds: RECONCILE_EVERY_SECONDS,
      run: async () => (await import("./reconcile")).reconcile(),
    },
  ];
}

/** Start the periodic work on this instance's queue (the server calls it once at start). */
export function startPeriodicJobs(boss: PgBoss): Promise<PeriodicHandle> {
  return startPeriodic(boss, periodicTasks(), { log: (m) => console.error(m) });
}
