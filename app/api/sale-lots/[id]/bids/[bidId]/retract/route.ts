// POST /api/sale-lots/:id/bids/:bidId/retract — the house retracts a bid, with the reason on record
import { z } from "zod";
import { parseParams, readJson, route } from "@/lib/api/route";
import { retractBid } from "@/lib/services/bid-retraction";
import { RetractSchema } from "@/lib/validation/sales";

const Params = z.object({ id: z.uuid(), bidId: z.string().regex(/^\d{1,18}$/) });

export const POST = route<{ id: string; bidId: string }>(
  { permission: "house.manage" },
  async ({ req, params, viewer }) => {
    const { id, bidId } = parseParams(Params, params);
    const { reason } = await readJson(req, RetractSchema);
    return { live: await retractBid(viewer, id, bidId, reason) };
  },
);
