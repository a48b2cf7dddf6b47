// POST /api/disputes/:id/return — the buyer records the return shipment (carrier and tracking)
import { parseParams, readJson, route } from "@/lib/api/route";
import { recordReturn } from "@/lib/services/disputes/returns";
import { IdParam } from "@/lib/validation/common";
import { ReturnShipmentSchema } from "@/lib/validation/disputes";

export const POST = route<{ id: string }>({ permission: "lots.bid" }, async ({ req, params, viewer }) => {
  await recordReturn(viewer, parseParams(IdParam, params).id, await readJson(req, ReturnShipmentSchema));
  return { recorded: true };
});
