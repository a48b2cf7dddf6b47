// POST /api/disputes/:id/decision — the case's mediator decides, once; the money moves
import { parseParams, readJson, route } from "@/lib/api/route";
import { decide } from "@/lib/services/disputes/decide";
import { IdParam } from "@/lib/validation/common";
import { DecisionSchema } from "@/lib/validation/disputes";

export const POST = route<{ id: string }>({ permission: "disputes.mediate" }, async ({ req, params, viewer }) => ({
  dispute: await decide(viewer, parseParams(IdParam, params).id, await readJson(req, DecisionSchema, 256 * 1024)),
}));
