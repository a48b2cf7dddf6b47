// POST /api/sale-lots/:id/bids — place a maximum bid {maxCents, idempotencyKey}; refusals are 409 with the reason
import { ApiError } from "@/lib/api/errors";
import { parseParams, readJson, route } from "@/lib/api/route";
import { placeMaxBid } from "@/lib/services/bidding";
import { IdParam } from "@/lib/validation/common";
import { BidSchema } from "@/lib/validation/sales";

export const POST = route<{ id: string }>({ permission: "lots.bid" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const { maxCents, idempotencyKey } = await readJson(req, BidSchema, 4 * 1024);
  const r = await placeMaxBid(viewer, id, maxCents, idempotencyKey);
  if (!r.accepted)
    throw new ApiError("conflict", r.message, undefined, undefined, {
      reason: r.reason,
      minimumCents: r.minimumCents,
      live: r.live,
    });
  return r;
});
