// POST /api/house/lots/:id/decision — ask for changes, approve with estimate and agreed reserve, or decline
import { parseParams, readJson, route } from "@/lib/api/route";
import { decideLot } from "@/lib/services/lot-review";
import { IdParam } from "@/lib/validation/common";
import { ReviewDecisionSchema } from "@/lib/validation/lots";

export const POST = route<{ id: string }>({ permission: "house.manage" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  return { lot: await decideLot(viewer, id, await readJson(req, ReviewDecisionSchema)) };
});
