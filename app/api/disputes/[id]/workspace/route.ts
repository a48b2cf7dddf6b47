// GET /api/disputes/:id/workspace — per claimed item: listing against report, ranked and graded
import { parseParams, route } from "@/lib/api/route";
import { workspace } from "@/lib/services/disputes/mediation";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "disputes.mediate" }, async ({ params, viewer }) =>
  workspace(viewer, parseParams(IdParam, params).id),
);
