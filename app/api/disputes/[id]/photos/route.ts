// POST /api/disputes/:id/photos — add a photo to a claim's evidence (multipart: file, itemId?, caption?)
import { z } from "zod";
import { parseParams, parseWith, route } from "@/lib/api/route";
import { readPhotoUpload } from "@/lib/api/upload";
import { addDisputePhoto } from "@/lib/services/disputes";
import { IdParam } from "@/lib/validation/common";

const Fields = z.object({
  itemId: z.uuid("Choose an item of this lot").nullable(),
  caption: z.string().trim().max(200, "At most 200 characters"),
});

export const POST = route<{ id: string }>({ permission: "account.read" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const upload = await readPhotoUpload(req);
  const fields = parseWith(Fields, { itemId: upload.field("itemId") || null, caption: upload.field("caption") ?? "" });
  const photo = await addDisputePhoto(viewer!, id, { name: upload.name, bytes: upload.bytes }, fields);
  return Response.json({ photo }, { status: 201 });
});
