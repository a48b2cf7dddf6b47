// POST /api/invoices/:id/accept — the buyer accepts the delivered lot; escrow is released at once
import { parseParams, route } from "@/lib/api/route";
import { acceptDelivery } from "@/lib/services/escrow";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "lots.bid" }, async ({ params, viewer }) => {
  await acceptDelivery(viewer, parseParams(IdParam, params).id);
  return { released: true };
});
