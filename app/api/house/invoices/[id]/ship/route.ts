// POST /api/house/invoices/:id/ship — record the shipment {carrier, tracking}
import { parseParams, readJson, route } from "@/lib/api/route";
import { markShipped } from "@/lib/services/escrow";
import { IdParam } from "@/lib/validation/common";
import { ShipmentSchema } from "@/lib/validation/payments";

export const POST = route<{ id: string }>({ permission: "house.manage" }, async ({ req, params }) => {
  const { carrier, tracking } = await readJson(req, ShipmentSchema);
  await markShipped(parseParams(IdParam, params).id, carrier, tracking);
  return { shipped: true };
});
