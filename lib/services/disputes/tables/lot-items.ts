/** The lot items a claim reads (listing as sold); lot_items is owned by models/LotItem.ts, this is a read-only face. */
import type { Transaction } from "sequelize";
import type { TubeReading } from "../../../lots/item";
import { columns, select } from "./query";

/** A lot item as a claim sees it. */
export type LotItemRow = {
  id: string;
  position: number;
  designation: string;
  quantity: number;
  label_brand: string;
  maker_name: string | null;
  maker_basis: string;
  source_code: string | null;
  date_code: string | null;
  features: Record<string, string>;
  vacuum_loss: boolean;
  readings: TubeReading[];
  sold_as_set: boolean;
};

export const LOT_ITEM_COLUMNS = [
  "id",
  "position",
  "designation",
  "quantity",
  "label_brand",
  "maker_name",
  "maker_basis",
  "source_code",
  "date_code",
  "features",
  "vacuum_loss",
  "readings",
  "sold_as_set",
] as const satisfies readonly (keyof LotItemRow)[];

/** A lot's items in order. */
export async function lotItems(lotId: string, t?: Transaction): Promise<LotItemRow[]> {
  return select<LotItemRow>(
    `SELECT ${columns(LOT_ITEM_COLUMNS)} FROM lot_items WHERE lot_id = :lotId ORDER BY position`,
    { lotId },
    t,
  );
}

/** True when the item belongs to the lot. */
export async function itemInLot(itemId: string, lotId: string): Promise<boolean> {
  return (await select(`SELECT 1 FROM lot_items WHERE id = :itemId AND lot_id = :lotId`, { itemId, lotId })).length > 0;
}
