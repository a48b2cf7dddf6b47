// POST /api/house/invoices/:id/cancel — cancel an invoice unpaid past its due date {offerToUnderbidder}
import { z } from "zod";
import { parseParams, readJson, route } from "@/lib/api/route";
import { cancelUnpaid } from "@/lib/services/second-chance";
import { IdParam } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "house.manage" }, async ({ req, params }) => {
  const { offerToUnderbidder } = await readJson(req, z.object({ offerToUnderbidder: z.boolean() }));
  return cancelUnpaid(parseParams(IdParam, params).id, offerToUnderbidder);
});
