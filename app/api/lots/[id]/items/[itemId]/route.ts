// PUT /api/lots/:id/items/:itemId — replace an item; DELETE — remove it (consignor, while editable)
import { parseParams, readJson, route } from "@/lib/api/route";
import { removeItem, updateItem } from "@/lib/services/lots";
import { LotItemParams } from "@/lib/validation/common";
import { ItemSchema } from "@/lib/validation/lots";

type P = { id: string; itemId: string };

export const PUT = route<P>({ permission: "lots.consign" }, async ({ req, params, viewer }) => {
  const { id, itemId } = parseParams(LotItemParams, params);
  return { item: await updateItem(viewer, id, itemId, await readJson(req, ItemSchema, 256 * 1024)) };
});

export const DELETE = route<P>({ permission: "lots.consign" }, async ({ params, viewer }) => {
  const { id, itemId } = parseParams(LotItemParams, params);
  await removeItem(viewer, id, itemId);
  return { removed: true };
});
