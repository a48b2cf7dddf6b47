import { createHash } from "node:crypto";
import sharp, { type Metadata, type OutputInfo } from "sharp";
import {
  ACCEPTED_PHOTO_LABELS,
  FULL_MAX_SIDE,
  MAX_PHOTO_BYTES,
  MAX_PHOTO_PIXELS,
  THUMB_MAX_SIDE,
  type PhotoFormat,
} from "./formats";
import { sniffImageType } from "./sniff";

export { ACCEPTED_PHOTO_FORMATS, MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS, PHOTO_ACCEPT_ATTRIBUTE } from "./formats";

/** Why an upload was refused; the message names the file and is fit to show its sender. */
export type PhotoRejectionCode = "empty" | "too-large" | "not-an-image" | "unsupported-format" | "too-many-pixels";

export class PhotoRejected extends Error {
  override readonly name = "PhotoRejected";
  constructor(
    readonly code: PhotoRejectionCode,
    message: string,
    readonly fileName: string,
  ) {
    super(message);
  }
}

export type PhotoLimits = { maxBytes: number; maxPixels: number };
export const DEFAULT_PHOTO_LIMITS: PhotoLimits = { maxBytes: MAX_PHOTO_BYTES, maxPixels: MAX_PHOTO_PIXELS };

export type PhotoRendition = { buffer: Buffer; contentType: "image/jpeg"; width: number; height: number };

export type ProcessedPhoto = {
  /** Upright, at most FULL_MAX_SIDE on its longest side, sRGB JPEG without metadata. */
  full: PhotoRendition;
  /** The same picture fitted inside THUMB_MAX_SIDE × THUMB_MAX_SIDE. */
  thumb: PhotoRendition;
  /** Hex SHA-256 of the bytes as uploaded: the evidence fingerprint and a duplicate check. */
  sha256: string;
  detectedFormat: PhotoFormat;
  originalBytes: number;
};

/**
 * Check an uploaded photo and make the two renditions we store. The type is
 * judged from the contents alone; size and pixel count are checked before
 * anything is decoded. Output is re-encoded from pixels, turned upright by
 * its EXIF orientation, so no EXIF (GPS position, camera serial), XMP, IPTC
 * or ICC data survives. Throws PhotoRejected for anything we will not keep.
 */
export async function processPhoto(
  input: Buffer,
  declaredName: string,
  limits: Partial<PhotoLimits> = {},
): Promise<ProcessedPhoto> {
  const { maxBytes, maxPixels } = { ...DEFAULT_PHOTO_LIMITS, ...limits };
  const name = displayName(declaredName);
  const reject = (code: PhotoRejectionCode, message: string) => new PhotoRejected(code, message, name);

  if (input.length === 0) throw reject("empty", `“${name}” is empty (0 bytes).`);
  if (input.length > maxBytes) {
    throw reject(
      "too-large",
      `“${name}” is ${megabytes(input.length)}; a photo may be at most ${megabytes(maxBytes)}.`,
    );
  }

  const sniffed = sniffImageType(input);
  if (sniffed.kind === "unknown") {
    throw reject(
      "not-an-image",
      `“${name}” is not an image: its contents are not ${ACCEPTED_PHOTO_LABELS}, whatever its name says.`,
    );
  }
  if (sniffed.kind === "unsupported") {
    throw reject(
      "unsupported-format",
      `“${name}” is a ${sniffed.label} file; please send ${ACCEPTED_PHOTO_LABELS} (a phone or editor can export JPEG).`,
    );
  }

  const damaged = () =>
    reject("not-an-image", `“${name}” could not be read as a picture; it may be damaged or cut short.`);
  let meta: Metadata;
  try {
    // Reads the header only; the pixel count is checked next, with a message of our own.
    meta = await sharp(input, { limitInputPixels: false }).metadata();
  } catch {
    throw damaged();
  }
  if (meta.format !== sniffed.format || !meta.width || !meta.height) throw damaged();
  if (meta.width * meta.height > maxPixels) {
    throw reject(
      "too-many-pixels",
      `“${name}” is ${meta.width} × ${meta.height} pixels (${megapixels(meta.width * meta.height)}); the limit is ${megapixels(maxPixels)}.`,
    );
  }

  // rotate() without an angle applies the EXIF orientation; nothing after it asks sharp to keep metadata.
  const upright = sharp(input, { limitInputPixels: maxPixels })
    .rotate()
    .flatten({ background: "#ffffff" })
    .toColourspace("srgb");
  const fit = (side: number) => ({ width: side, height: side, fit: "inside" as const, withoutEnlargement: true });
  let full: { data: Buffer; info: OutputInfo };
  let thumb: { data: Buffer; info: OutputInfo };
  try {
    [full, thumb] = await Promise.all([
      upright.clone().resize(fit(FULL_MAX_SIDE)).jpeg({ quality: 85 }).toBuffer({ resolveWithObject: true }),
      upright.clone().resize(fit(THUMB_MAX_SIDE)).jpeg({ quality: 78 }).toBuffer({ resolveWithObject: true }),
    ]);
  } catch {
    throw damaged();
  }

  return {
    full: rendition(full),
    thumb: rendition(thumb),
    sha256: createHash("sha256").update(input).digest("hex"),
    detectedFormat: sniffed.format,
    originalBytes: input.length,
  };
}

function rendition(r: { data: Buffer; info: OutputInfo }): PhotoRendition {
  return { buffer: r.data, contentType: "image/jpeg", width: r.info.width, height: r.info.height };
}

/** The file name as the sender knows it: last path part, no control characters, at most 120 characters. */
function displayName(declared: string): string {
  const base = (declared.split(/[\\/]/).pop() ?? "").replace(/[\u0000-\u001f\u007f]/g, "").trim();
  const short = base.length > 120 ? `${base.slice(0, 117)}…` : base;
  return short || "the file";
}

function megabytes(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return `${mb >= 10 ? Math.round(mb) : mb.toFixed(1)} MB`;
}

function megapixels(pixels: number): string {
  const mp = pixels / 1_000_000;
  return `${mp >= 10 ? Math.round(mp) : mp.toFixed(1)} MP`;
}
