// POST /api/disputes/:id/return-received — the consignor confirms the returned lot arrived; the refund is paid
import { parseParams, route } from "@/lib/api/route";
import { confirmReturnReceived } from "@/lib/services/disputes/returns";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "lots.consign" }, async ({ params, viewer }) => {
  await confirmReturnReceived(viewer, parseParams(IdParam, params).id);
  return { refunded: true };
});
