import type { BidOutcome } from "../auction/proxy";

/**
 * The typed face of the `bids` table: one accepted bid in a lot's log,
 * numbered by the lot's `seq`. Written only by the bid transaction
 * (bid-lock.ts); retracted by the house, never deleted.
 */
export type BidRow = {
  id: string; // BIGINT: pg returns it as text
  sale_lot_id: string;
  seq: number;
  bidder_id: string;
  max_cents: number;
  price_after_cents: number;
  outcome: BidOutcome;
  idempotency_key: string;
  placed_at: Date;
  retracted_at: Date | null;
  retracted_by: string | null;
  retract_reason: string | null;
};

/** The columns of BidRow, in table order. */
export const BID_COLUMNS = [
  "id",
  "sale_lot_id",
  "seq",
  "bidder_id",
  "max_cents",
  "price_after_cents",
  "outcome",
  "idempotency_key",
  "placed_at",
  "retracted_at",
  "retracted_by",
  "retract_reason",
] as const satisfies readonly (keyof BidRow)[];

/** A select list of some bid columns, optionally qualified by a table alias. */
export function bidColumns<K extends keyof BidRow>(columns: readonly K[], alias?: string): string {
  return columns.map((c) => (alias ? `${alias}.${c}` : c)).join(", ");
}

/** The bid-log columns a lot's page shows (the paddle number is joined beside them). */
export const BID_LOG_COLUMNS = [
  "id",
  "seq",
  "bidder_id",
  "max_cents",
  "price_after_cents",
  "outcome",
  "placed_at",
  "retracted_at",
  "retract_reason",
] as const satisfies readonly (keyof BidRow)[];

/** One row of a lot's bid log. */
export type BidLogRow = Pick<BidRow, (typeof BID_LOG_COLUMNS)[number]>;
