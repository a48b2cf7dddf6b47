// POST /api/lots/:id/photos — upload a photo (multipart: file, itemId?, caption?); checked by content, re-encoded
import { z } from "zod";
import { ApiError } from "@/lib/api/errors";
import { parseParams, parseWith, route } from "@/lib/api/route";
import { MAX_PHOTO_BYTES } from "@/lib/photos/formats";
import { addPhoto } from "@/lib/services/lot-photos";
import { IdParam } from "@/lib/validation/common";

const Fields = z.object({
  itemId: z.uuid("Choose an item of this lot").nullable(),
  caption: z.string().trim().max(200, "At most 200 characters"),
});

export const POST = route<{ id: string }>({ permission: "lots.consign" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const declared = Number(req.headers.get("content-length") ?? "0");
  // Refuse before reading the body: a 50 MB upload never reaches memory.
  if (declared > MAX_PHOTO_BYTES + 64 * 1024) throw new ApiError("payload_too_large", `A photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB`);
  if (!(req.headers.get("content-type") ?? "").startsWith("multipart/form-data")) throw new ApiError("unsupported_media_type", "Send the photo as multipart/form-data");
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new ApiError("bad_request", "The upload could not be read");
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new ApiError("validation_failed", "Choose a photo to upload", { file: "Choose a photo" });
  if (file.size > MAX_PHOTO_BYTES) throw new ApiError("payload_too_large", `A photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB`);
  const fields = parseWith(Fields, { itemId: (form.get("itemId") as string | null) || null, caption: (form.get("caption") as string | null) ?? "" });
  const photo = await addPhoto(viewer!, id, { name: file.name, bytes: Buffer.from(await file.arrayBuffer()) }, fields);
  return Response.json({ photo }, { status: 201 });
});
