import type { NextRequest } from "next/server";
import { MAX_PHOTO_BYTES } from "../photos/formats";
import { ApiError } from "./errors";

/**
 * Read a photo upload (multipart/form-data with a `file` field). The declared
 * length is checked before the body is read, so an oversized upload never
 * reaches memory. Returns the file's bytes and the form's other fields.
 */
export async function readPhotoUpload(
  req: NextRequest,
): Promise<{ name: string; bytes: Buffer; field: (k: string) => string | null }> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > MAX_PHOTO_BYTES + 64 * 1024)
    throw new ApiError("payload_too_large", `A photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB`);
  if (!(req.headers.get("content-type") ?? "").startsWith("multipart/form-data"))
    throw new ApiError("unsupported_media_type", "Send the photo as multipart/form-data");
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new ApiError("bad_request", "The upload could not be read");
  }
  const file = form.get("file");
  if (!(file instanceof File))
    throw new ApiError("validation_failed", "Choose a photo to upload", { file: "Choose a photo" });
  if (file.size > MAX_PHOTO_BYTES)
    throw new ApiError("payload_too_large", `A photo may be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB`);
  const field = (k: string) => {
    const v = form.get(k);
    return typeof v === "string" ? v : null;
  };
  return { name: file.name, bytes: Buffer.from(await file.arrayBuffer()), field };
}

/** The response for a stored photo: private, never sniffed. */
/**
 * A stored photo. A photo never changes under its id (a new upload is a new id), so a listed lot's photos may
 * be cached by anyone for a day; others stay private to the browser.
 */
export function photoResponse(obj: {
  body: Buffer | Uint8Array;
  contentType: string;
  contentLength: number;
  listed?: boolean;
}): Response {
  return new Response(new Uint8Array(obj.body), {
    headers: {
      "content-type": obj.contentType,
      "content-length": String(obj.contentLength),
      "cache-control": obj.listed ? "public, max-age=86400, stale-while-revalidate=604800" : "private, max-age=300",
      "x-content-type-options": "nosniff",
      "content-disposition": "inline",
    },
  });
}
