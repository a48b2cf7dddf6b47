/**
 * The claims the sweeper looks for: money movements left unfinished, returns whose receipt the consignor has not
 * confirmed in time, and returns the buyer never shipped. Reads of the `disputes` table only.
 */
import { DISPUTE_COLUMNS, type DisputeRow } from "./disputes";
import { columns, select } from "./query";

const ALL = columns(DISPUTE_COLUMNS);

/** Decisions whose money movement has not finished for half a minute (a crash, or a processor outage). */
export async function stuckSettling(): Promise<{ id: string }[]> {
  return select<{ id: string }>(
    `SELECT id FROM disputes WHERE state = 'settling' AND updated_at < now() - interval '30 seconds' LIMIT 20`,
  );
}

/** Returns shipped at least the sale's receipt-confirmation days ago whose receipt the consignor has not confirmed. */
export async function unconfirmedReturns(fallbackDays: number): Promise<DisputeRow[]> {
  // Each case by its own sale's frozen settings (the invoice's version, else the sale's); `fallbackDays` only for a
  // version document without the figure.
  return select<DisputeRow>(
    `SELECT ${columns(DISPUTE_COLUMNS, "d")} FROM disputes d
       JOIN invoices i ON i.id = d.invoice_id JOIN sale_lots sl ON sl.id = i.sale_lot_id JOIN sales s ON s.id = sl.sale_id
       JOIN house_settings_versions v ON v.version = COALESCE(i.settings_version, s.settings_version)
      WHERE d.state = 'awaiting-return' AND d.return_shipped_at IS NOT NULL
        AND d.return_shipped_at + make_interval(days => COALESCE((v.settings #>> '{claims,receiptConfirmDays}')::int, :days)) <= now()
      LIMIT 20`,
    { days: fallbackDays },
  );
}

/** Returns the buyer did not ship by the deadline. */
export async function overdueReturns(): Promise<DisputeRow[]> {
  return select<DisputeRow>(
    `SELECT ${ALL} FROM disputes WHERE state = 'awaiting-return' AND return_shipped_at IS NULL AND return_due_at <= now() LIMIT 20`,
  );
}
