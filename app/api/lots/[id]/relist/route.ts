// POST /api/lots/:id/relist — the consignor asks the house to offer an unsold lot in a later sale
import { parseParams, route } from "@/lib/api/route";
import { askToRelist } from "@/lib/services/relist";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "lots.consign" }, async ({ params, viewer }) =>
  askToRelist(viewer, parseParams(IdParam, params).id),
);
