// POST /api/disputes/:id/take — a mediator takes the claim from the queue
import { parseParams, route } from "@/lib/api/route";
import { takeCase } from "@/lib/services/disputes/mediation";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "disputes.mediate" }, async ({ params, viewer }) => {
  await takeCase(viewer, parseParams(IdParam, params).id);
  return { taken: true };
});
