// GET /api/sale-lots/:id — live state, bid history by paddle, and the viewer's own standing
import { parseParams, route } from "@/lib/api/route";
import { getSaleLot } from "@/lib/services/sales";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ params, viewer }) =>
  getSaleLot(viewer, parseParams(IdParam, params).id),
);
