// POST /api/disputes/:id/messages — post to a claim's conversation (the consignor's first message is their answer)
import { parseParams, readJson, route } from "@/lib/api/route";
import { postMessage } from "@/lib/services/disputes/conversation";
import { IdParam } from "@/lib/validation/common";
import { DisputeMessageSchema } from "@/lib/validation/disputes";

export const POST = route<{ id: string }>({ permission: "account.read" }, async ({ req, params, viewer }) => {
  const message = await postMessage(viewer, parseParams(IdParam, params).id, await readJson(req, DisputeMessageSchema));
  return Response.json({ message }, { status: 201 });
});
