// POST /api/house/lots/:id/amendments — a dated correction to an approved lot
import { parseParams, readJson, route } from "@/lib/api/route";
import { amendLot } from "@/lib/services/lot-review";
import { IdParam } from "@/lib/validation/common";
import { AmendmentSchema } from "@/lib/validation/lots";

export const POST = route<{ id: string }>({ permission: "house.manage" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  await amendLot(viewer, id, await readJson(req, AmendmentSchema));
  return Response.json({ amended: true }, { status: 201 });
});
