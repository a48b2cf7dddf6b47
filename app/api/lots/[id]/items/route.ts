// POST /api/lots/:id/items — add an item (unknown designations are flagged, not refused)
import { parseParams, readJson, route } from "@/lib/api/route";
import { addItem } from "@/lib/services/lots";
import { IdParam } from "@/lib/validation/common";
import { ItemSchema } from "@/lib/validation/lots";

export const POST = route<{ id: string }>({ permission: "lots.consign" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const item = await addItem(viewer, id, await readJson(req, ItemSchema, 256 * 1024));
  return Response.json({ item }, { status: 201 });
});
