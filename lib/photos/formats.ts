/**
 * What a consignor may upload as condition evidence, shared by the upload form
 * and the server. No sharp import here, so client components can use it.
 */

/** Largest upload accepted, in bytes: 15 MiB, above any phone camera's JPEG. [SUG] */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;

/** Largest decoded size accepted: 50 megapixels, which stops decompression bombs. [SUG] */
export const MAX_PHOTO_PIXELS = 50_000_000;

/** Longest side of the stored full-size rendition, in pixels: enough to read a date code or a getter flash. [SUG] */
export const FULL_MAX_SIDE = 2400;

/** The thumbnail fits inside a square of this side, in pixels. [SUG] */
export const THUMB_MAX_SIDE = 320;

/** Formats accepted, detected from the file's contents (never its name). */
export type PhotoFormat = "jpeg" | "png" | "webp";

export const ACCEPTED_PHOTO_FORMATS: ReadonlyArray<{
  format: PhotoFormat;
  label: string;
  mime: string;
  extensions: readonly string[];
}> = [
  { format: "jpeg", label: "JPEG", mime: "image/jpeg", extensions: [".jpg", ".jpeg"] },
  { format: "png", label: "PNG", mime: "image/png", extensions: [".png"] },
  { format: "webp", label: "WebP", mime: "image/webp", extensions: [".webp"] },
];

/** Value for an `<input type="file" accept>`: a hint for the picker only; the server checks contents. */
export const PHOTO_ACCEPT_ATTRIBUTE = ACCEPTED_PHOTO_FORMATS.flatMap((f) => [f.mime, ...f.extensions]).join(",");

/** "JPEG, PNG or WebP", for messages. */
export const ACCEPTED_PHOTO_LABELS = ACCEPTED_PHOTO_FORMATS.map((f) => f.label)
  .join(", ")
  .replace(/, ([^,]*)$/, " or $1");
