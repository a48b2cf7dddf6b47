// POST /api/house/invoices/:id/deliver — record delivery; the inspection window starts
import { parseParams, route } from "@/lib/api/route";
import { markDelivered } from "@/lib/services/escrow";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "house.manage" }, async ({ params }) => {
  const ends = await markDelivered(parseParams(IdParam, params).id);
  return { delivered: true, inspectionEndsAt: ends.toISOString() };
});
