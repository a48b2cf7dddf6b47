// POST /api/sale-lots/:id/watch — {on: true|false} add to or remove from the watchlist
import { z } from "zod";
import { parseParams, readJson, route } from "@/lib/api/route";
import { setWatch } from "@/lib/services/sales";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "lots.bid" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const { on } = await readJson(req, z.object({ on: z.boolean() }));
  return setWatch(viewer, id, on);
});
