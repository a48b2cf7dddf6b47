// POST /api/disputes/:id/release-undisputed — the case's mediator pays the consignor the share the claim does not touch
import { parseParams, readJson, route } from "@/lib/api/route";
import { releaseUndisputedShare } from "@/lib/services/disputes/early-release";
import { IdParam } from "@/lib/validation/common";
import { LineValuesSchema } from "@/lib/validation/disputes";

export const POST = route<{ id: string }>({ permission: "disputes.mediate" }, async ({ req, params, viewer }) => ({
  release: await releaseUndisputedShare(
    viewer,
    parseParams(IdParam, params).id,
    await readJson(req, LineValuesSchema, 256 * 1024),
  ),
}));
