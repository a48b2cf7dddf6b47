/** A claim's photos: checked by content, re-encoded without metadata, stored in object storage, kept for good. */
import { randomUUID } from "node:crypto";
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import { MAX_PHOTO_BYTES } from "../../photos/formats";
import { PhotoRejected, processPhoto } from "../../photos/process";
import { claimPhotoObjectKeys } from "../../storage/keys";
import { deleteObject, getObject, putObject } from "../../storage/objects";
import { loadCase, requireEvidenceWriter } from "./permissions";
import { findEvidenceBySha, findEvidenceFiles, insertEvidence } from "./tables/dispute-evidence";
import { itemInLot } from "./tables/lot-items";

/** The photo checked and re-encoded, or the matching API error. */
async function processed(file: { name: string; bytes: Buffer }) {
  try {
    return await processPhoto(file.bytes, file.name, { maxBytes: MAX_PHOTO_BYTES });
  } catch (e) {
    if (e instanceof PhotoRejected)
      throw new ApiError(
        e.code === "too-large" ? "payload_too_large" : e.code === "empty" ? "bad_request" : "unsupported_media_type",
        e.message,
      );
    throw e;
  }
}

/** Add a photo to a case's evidence: checked by content, re-encoded without metadata, kept for good. */
export async function addDisputePhoto(
  viewer: Viewer,
  disputeId: string,
  file: { name: string; bytes: Buffer },
  opts: { itemId: string | null; caption: string },
): Promise<{ id: string }> {
  const { d, role } = await loadCase(viewer, disputeId);
  requireEvidenceWriter(d, role, viewer);
  if (opts.itemId && !(await itemInLot(opts.itemId, d.lot_id))) {
    throw new ApiError("validation_failed", "That item is not in this lot", { itemId: "Choose an item of this lot" });
  }
  const photo = await processed(file);
  const seen = await findEvidenceBySha(disputeId, photo.sha256);
  if (seen) return { id: seen.id };
  const id = randomUUID();
  const keys = claimPhotoObjectKeys(disputeId, id);
  try {
    await putObject(keys.full, photo.full.buffer, "image/jpeg");
    await putObject(keys.thumb, photo.thumb.buffer, "image/jpeg");
    await insertEvidence({
      id,
      dispute_id: disputeId,
      author_id: viewer.id,
      author_role: role,
      lot_item_id: opts.itemId,
      caption: opts.caption.slice(0, 200),
      full_key: keys.full,
      thumb_key: keys.thumb,
      width: photo.full.width,
      height: photo.full.height,
      sha256: photo.sha256,
    });
    return { id };
  } catch (e) {
    await Promise.allSettled([deleteObject(keys.full), deleteObject(keys.thumb)]);
    const raced = await findEvidenceBySha(disputeId, photo.sha256);
    if (raced) return { id: raced.id };
    throw e;
  }
}

/** A photo of a case's evidence, for those who may read the case. */
export async function readDisputePhoto(viewer: Viewer, evidenceId: string, size: "thumb" | "full") {
  const e = await findEvidenceFiles(evidenceId);
  if (!e) throw new ApiError("not_found", "No such photo");
  await loadCase(viewer, e.dispute_id);
  const obj = await getObject(size === "thumb" ? e.thumb_key : e.full_key);
  if (!obj) throw new ApiError("not_found", "The photo's file is missing");
  return obj;
}
