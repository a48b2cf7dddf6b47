// GET /api/lots/:id — a lot with items, photos and trail (404 unless the viewer may see it)
// PATCH /api/lots/:id — the consignor edits the lot's details while it is theirs to change
import { parseParams, readJson, route } from "@/lib/api/route";
import { getLot, updateLotDetails } from "@/lib/services/lots";
import { IdParam } from "@/lib/validation/common";
import { LotDetailsSchema } from "@/lib/validation/lots";

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  return getLot(viewer, id);
});

export const PATCH = route<{ id: string }>({ permission: "lots.consign" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  return { lot: await updateLotDetails(viewer, id, await readJson(req, LotDetailsSchema)) };
});
