// POST /api/disputes/:id/refund-preview — the refund a partial-refund decision would pay, to the cent; nothing moves
import { parseParams, readJson, route } from "@/lib/api/route";
import { refundPreview } from "@/lib/services/disputes/mediation";
import { IdParam } from "@/lib/validation/common";
import { RefundPreviewSchema } from "@/lib/validation/disputes";

export const POST = route<{ id: string }>({ permission: "disputes.mediate" }, async ({ req, params, viewer }) => ({
  settlement: await refundPreview(
    viewer,
    parseParams(IdParam, params).id,
    await readJson(req, RefundPreviewSchema, 256 * 1024),
  ),
}));
