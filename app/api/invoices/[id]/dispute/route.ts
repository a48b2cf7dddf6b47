// POST /api/invoices/:id/dispute — the buyer opens a claim on a delivered lot, inside its inspection window
import { parseParams, readJson, route } from "@/lib/api/route";
import { openDispute } from "@/lib/services/disputes/open";
import { IdParam } from "@/lib/validation/common";
import { OpenDisputeSchema } from "@/lib/validation/disputes";

export const POST = route<{ id: string }>({ permission: "lots.bid" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const dispute = await openDispute(viewer, id, await readJson(req, OpenDisputeSchema, 512 * 1024));
  return Response.json({ dispute }, { status: 201 });
});
