/** Typed access to `dispute_items`: the lines a claim names, with the buyer's report (rows are immutable). */
import type { Transaction } from "sequelize";
import type { BuyerReport } from "../../../disputes/weigh";
import { LOT_ITEM_COLUMNS, type LotItemRow } from "./lot-items";
import { columns, exec, select } from "./query";

/** One row of `dispute_items`. */
export type DisputeItemRow = { dispute_id: string; lot_item_id: string; tubes: number; report: BuyerReport };

/** A claimed line with the lot item as listed. */
export type ClaimedLineRow = LotItemRow & Pick<DisputeItemRow, "tubes" | "report">;

/** Adds a claimed line. */
export async function insertDisputeItem(row: DisputeItemRow, t: Transaction): Promise<void> {
  await exec(
    `INSERT INTO dispute_items (dispute_id, lot_item_id, tubes, report) VALUES (:id, :itemId, :tubes, :report::jsonb)`,
    { id: row.dispute_id, itemId: row.lot_item_id, tubes: row.tubes, report: JSON.stringify(row.report) },
    t,
  );
}

/** How many tubes the claim names on each line. */
export async function claimedTubes(disputeId: string): Promise<Pick<DisputeItemRow, "lot_item_id" | "tubes">[]> {
  return select<Pick<DisputeItemRow, "lot_item_id" | "tubes">>(
    `SELECT lot_item_id, tubes FROM dispute_items WHERE dispute_id = :id`,
    { id: disputeId },
  );
}

/** The claimed lines with the listing beside the buyer's report, in lot order. */
export async function claimedLines(disputeId: string): Promise<ClaimedLineRow[]> {
  return select<ClaimedLineRow>(
    `SELECT ${columns(LOT_ITEM_COLUMNS, "li")}, di.tubes, di.report
       FROM dispute_items di JOIN lot_items li ON li.id = di.lot_item_id WHERE di.dispute_id = :id ORDER BY li.position`,
    { id: disputeId },
  );
}
