// POST /api/lots/:id/submit — the consignor hands the lot to the house for review
import { parseParams, route } from "@/lib/api/route";
import { submitLot } from "@/lib/services/lot-review";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "lots.consign" }, async ({ params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  return { lot: await submitLot(viewer, id) };
});
