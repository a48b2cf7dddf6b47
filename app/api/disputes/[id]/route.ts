// GET /api/disputes/:id — one claim, for its parties, the mediators and the house
import { parseParams, route } from "@/lib/api/route";
import { getCase } from "@/lib/services/disputes/cases";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ params, viewer }) => ({
  dispute: await getCase(viewer, parseParams(IdParam, params).id),
}));
