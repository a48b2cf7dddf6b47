import { randomUUID } from "node:crypto";
import sharp from "sharp";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { MAX_PHOTO_BYTES } from "../photos/formats";
import { PhotoRejected, processPhoto } from "../photos/process";
import { photoObjectKeys } from "../storage/keys";
import { deleteObject, getObject, putObject } from "../storage/objects";
import { db, Lot, LotItem, LotPhoto } from "../../models";
import { assertCanView, assertConsignorCanEdit } from "./lot-access";

/** Most photos one lot may carry. */
export const MAX_PHOTOS_PER_LOT = 60;

export type PhotoView = { id: string; itemId: string | null; caption: string; width: number; height: number };

const present = (p: LotPhoto): PhotoView => ({
  id: p.id,
  itemId: p.itemId,
  caption: p.caption,
  width: p.width,
  height: p.height,
});

/**
 * Add a photo to the consignor's lot: the content decides the type, the image
 * is re-encoded without any metadata, both renditions go to object storage,
 * then one row records them. If anything fails nothing is kept; the same
 * image sent twice is stored once.
 */
export async function addPhoto(
  viewer: Viewer,
  lotId: string,
  file: { name: string; bytes: Buffer },
  opts: { itemId?: string | null; caption?: string },
): Promise<PhotoView> {
  db();
  assertConsignorCanEdit(viewer, await Lot.findByPk(lotId));
  if (opts.itemId && !(await LotItem.findOne({ where: { id: opts.itemId, lotId }, attributes: ["id"] }))) {
    throw new ApiError("validation_failed", "That item is not in this lot", { itemId: "Choose an item of this lot" });
  }
  if ((await LotPhoto.count({ where: { lotId } })) >= MAX_PHOTOS_PER_LOT) {
    throw new ApiError("conflict", `A lot carries at most ${MAX_PHOTOS_PER_LOT} photos`);
  }
  let processed;
  try {
    processed = await processPhoto(file.bytes, file.name, { maxBytes: MAX_PHOTO_BYTES });
  } catch (e) {
    if (e instanceof PhotoRejected) {
      throw new ApiError(
        e.code === "too-large" ? "payload_too_large" : e.code === "empty" ? "bad_request" : "unsupported_media_type",
        e.message,
      );
    }
    throw e;
  }
  const existing = await LotPhoto.findOne({ where: { lotId, sha256: processed.sha256 } });
  if (existing) return present(existing);

  const id = randomUUID();
  const keys = photoObjectKeys(lotId, id);
  try {
    await putObject(keys.full, processed.full.buffer, "image/jpeg");
    await putObject(keys.thumb, processed.thumb.buffer, "image/jpeg");
    const row = await LotPhoto.create({
      id,
      lotId,
      itemId: opts.itemId ?? null,
      fullKey: keys.full,
      thumbKey: keys.thumb,
      width: processed.full.width,
      height: processed.full.height,
      bytes: processed.full.buffer.length,
      sha256: processed.sha256,
      caption: (opts.caption ?? "").slice(0, 200),
      uploadedBy: viewer.id,
    });
    return present(row);
  } catch (e) {
    await Promise.allSettled([deleteObject(keys.full), deleteObject(keys.thumb)]);
    const raced = await LotPhoto.findOne({ where: { lotId, sha256: processed.sha256 } });
    if (raced) return present(raced);
    throw e;
  }
}

/** The consignor removes a photo while the lot is theirs to change. */
export async function removePhoto(viewer: Viewer, lotId: string, photoId: string): Promise<void> {
  db();
  assertConsignorCanEdit(viewer, await Lot.findByPk(lotId));
  const p = await LotPhoto.findOne({ where: { id: photoId, lotId } });
  if (!p) throw new ApiError("not_found", "No such photo");
  await p.destroy();
  await Promise.allSettled([deleteObject(p.fullKey), deleteObject(p.thumbKey)]);
}

/** A photo's bytes, for a viewer who may see its lot (anyone once it is listed); anyone else gets 404. */
/** Side of the square photo lists show, in image pixels. */
export const LIST_SIDE = 192;

export async function readPhoto(viewer: Viewer | null, photoId: string, size: "list" | "thumb" | "full") {
  db();
  const p = await LotPhoto.findByPk(photoId);
  if (!p) throw new ApiError("not_found", "No such photo");
  const lot = assertCanView(viewer, await Lot.findByPk(p.lotId));
  const obj = await getObject(size === "thumb" ? p.thumbKey : p.fullKey);
  if (!obj) throw new ApiError("not_found", "The photo's file is missing");
  if (size !== "list") return { ...obj, listed: lot.state === "approved" };
  // Lists show a 96-pixel square: the thumbnail cut to 192 pixels (sharp for two-times screens), made on request.
  const body = await sharp(obj.body).resize(LIST_SIDE, LIST_SIDE, { fit: "cover" }).jpeg({ quality: 72 }).toBuffer();
  return { body, contentType: "image/jpeg", contentLength: body.length, listed: lot.state === "approved" };
}
