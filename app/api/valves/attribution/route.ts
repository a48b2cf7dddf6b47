// POST /api/valves/attribution — construction features in; makers ranked by similarity to confirmed references out
import { readJson, route } from "@/lib/api/route";
import { rankForFeatures } from "@/lib/services/shelf";
import { AttributionQuerySchema } from "@/lib/validation/shelf";

export const POST = route({ permission: "account.read" }, async ({ req }) =>
  rankForFeatures(await readJson(req, AttributionQuerySchema, 32 * 1024)),
);
