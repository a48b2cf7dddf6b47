// POST /api/disputes/:id/photos — add a photo to a claim's evidence (multipart: file, itemId?, caption?)
import { parseParams, parseWith, route } from "@/lib/api/route";
import { readPhotoUpload } from "@/lib/api/upload";
import { addDisputePhoto } from "@/lib/services/disputes/evidence";
import { IdParam, PhotoFieldsSchema } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "account.read" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const upload = await readPhotoUpload(req);
  const fields = parseWith(PhotoFieldsSchema, {
    itemId: upload.field("itemId") || null,
    caption: upload.field("caption") ?? "",
  });
  const photo = await addDisputePhoto(viewer, id, { name: upload.name, bytes: upload.bytes }, fields);
  return Response.json({ photo }, { status: 201 });
});
