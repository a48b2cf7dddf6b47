// POST /api/lots/:id/photos — upload a photo (multipart: file, itemId?, caption?); checked by content, re-encoded
import { parseParams, parseWith, route } from "@/lib/api/route";
import { readPhotoUpload } from "@/lib/api/upload";
import { addPhoto } from "@/lib/services/lot-photos";
import { IdParam, PhotoFieldsSchema } from "@/lib/validation/common";

export const POST = route<{ id: string }>({ permission: "lots.consign" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const upload = await readPhotoUpload(req);
  const fields = parseWith(PhotoFieldsSchema, {
    itemId: upload.field("itemId") || null,
    caption: upload.field("caption") ?? "",
  });
  const photo = await addPhoto(viewer, id, { name: upload.name, bytes: upload.bytes }, fields);
  return Response.json({ photo }, { status: 201 });
});
