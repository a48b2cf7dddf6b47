// GET /api/sales/:id — a sale with every lot's live state
import { parseParams, route } from "@/lib/api/route";
import { getSale } from "@/lib/services/sales";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ params, viewer }) =>
  getSale(parseParams(IdParam, params).id, viewer),
);
