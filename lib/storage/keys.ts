/**
 * Object keys for stored evidence. Every segment is checked so a key can never
 * climb out of its prefix or carry characters a store treats specially.
 */
const SEGMENT = /^[A-Za-z0-9][A-Za-z0-9_-]{0,63}$/;

function segment(value: string, what: string): string {
  if (!SEGMENT.test(value)) throw new Error(`invalid ${what} for an object key: ${JSON.stringify(value)}`);
  return value;
}

/** The two renditions kept for a lot photo. */
export type PhotoRendition = "full" | "thumb";

/** photos/<lotId>/<photoId>/<rendition>.jpg — both renditions are JPEG. */
export function photoObjectKey(lotId: string, photoId: string, rendition: PhotoRendition): string {
  return `photos/${segment(lotId, "lot id")}/${segment(photoId, "photo id")}/${rendition}.jpg`;
}

/** Both keys of one photo, for writing or deleting them together. */
export function photoObjectKeys(lotId: string, photoId: string): Record<PhotoRendition, string> {
  return { full: photoObjectKey(lotId, photoId, "full"), thumb: photoObjectKey(lotId, photoId, "thumb") };
}

/** The prefix holding every photo of a lot. */
export function lotPhotoPrefix(lotId: string): string {
  return `photos/${segment(lotId, "lot id")}/`;
}

/** Reject keys that are empty, absolute, climb with "..", or exceed S3's 1,024-byte limit. */
export function assertObjectKey(key: string): string {
  if (key === "" || key.startsWith("/") || key.split("/").some((p) => p === "" || p === "." || p === "..")) {
    throw new Error(`invalid object key: ${JSON.stringify(key)}`);
  }
  if (Buffer.byteLength(key, "utf8") > 1024) throw new Error("object key longer than 1,024 bytes");
  return key;
}

/** claims/<disputeId>/<evidenceId>/<rendition>.jpg — a photo posted as evidence in a claim. */
export function claimPhotoObjectKeys(disputeId: string, evidenceId: string): Record<PhotoRendition, string> {
  const base = `claims/${segment(disputeId, "claim id")}/${segment(evidenceId, "evidence id")}`;
  return { full: `${base}/full.jpg`, thumb: `${base}/thumb.jpg` };
}
