import type { PhotoFormat } from "./formats";

/**
 * What a file is, judged from its first bytes (its "magic number"), never from
 * its name or declared MIME type. Only accepted formats go on to the decoder;
 * other image formats are named so the message can say what to send instead.
 */
export type SniffResult =
  | { kind: "accepted"; format: PhotoFormat }
  | { kind: "unsupported"; format: "gif" | "tiff" | "bmp" | "heic" | "avif" | "jxl" | "svg"; label: string }
  | { kind: "unknown" };

const startsWith = (buf: Buffer, bytes: number[], at = 0) =>
  buf.length >= at + bytes.length && bytes.every((b, i) => buf[at + i] === b);
const ascii = (buf: Buffer, from: number, to: number) => buf.subarray(from, to).toString("latin1");

// ISO base media file brands (ISO/IEC 23008-12 for HEIF, AV1 Image File Format for AVIF).
const AVIF_BRANDS = new Set(["avif", "avis"]);
const HEIF_BRANDS = new Set(["heic", "heix", "hevc", "hevx", "heim", "heis", "hevm", "hevs", "mif1", "msf1"]);

// An SVG document: optional XML declaration, comments and doctype, then an <svg> root.
const SVG_ROOT =
  /^(?:<\?xml[^>]*\?>\s*)?(?:<!--[\s\S]*?-->\s*)*(?:<!DOCTYPE\s+svg[^>]*>\s*)?(?:<!--[\s\S]*?-->\s*)*<svg[\s>]/i;

/** Identify an image by content. */
export function sniffImageType(buf: Buffer): SniffResult {
  if (startsWith(buf, [0xff, 0xd8, 0xff])) return { kind: "accepted", format: "jpeg" };
  if (startsWith(buf, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { kind: "accepted", format: "png" };
  if (buf.length >= 12 && ascii(buf, 0, 4) === "RIFF" && ascii(buf, 8, 12) === "WEBP")
    return { kind: "accepted", format: "webp" };

  if (ascii(buf, 0, 6) === "GIF87a" || ascii(buf, 0, 6) === "GIF89a")
    return { kind: "unsupported", format: "gif", label: "GIF" };
  if (startsWith(buf, [0x49, 0x49, 0x2a, 0x00]) || startsWith(buf, [0x4d, 0x4d, 0x00, 0x2a])) {
    return { kind: "unsupported", format: "tiff", label: "TIFF" };
  }
  if (buf.length >= 14 && ascii(buf, 0, 2) === "BM" && buf.readUInt32LE(6) === 0)
    return { kind: "unsupported", format: "bmp", label: "BMP" };
  if (
    startsWith(buf, [0xff, 0x0a]) ||
    startsWith(buf, [0, 0, 0, 0x0c, 0x4a, 0x58, 0x4c, 0x20, 0x0d, 0x0a, 0x87, 0x0a])
  ) {
    return { kind: "unsupported", format: "jxl", label: "JPEG XL" };
  }
  const brands = isoBrands(buf);
  if (brands.some((b) => AVIF_BRANDS.has(b))) return { kind: "unsupported", format: "avif", label: "AVIF" };
  if (brands.some((b) => HEIF_BRANDS.has(b))) return { kind: "unsupported", format: "heic", label: "HEIC/HEIF" };
  if (
    SVG_ROOT.test(
      buf
        .subarray(0, 4096)
        .toString("utf8")
        .replace(/^\uFEFF/, "")
        .trimStart(),
    )
  ) {
    return { kind: "unsupported", format: "svg", label: "SVG" };
  }
  return { kind: "unknown" };
}

/** Major and compatible brands of an ISO base media file's leading ftyp box, or [] when there is none. */
function isoBrands(buf: Buffer): string[] {
  if (buf.length < 16 || ascii(buf, 4, 8) !== "ftyp") return [];
  const size = Math.min(buf.readUInt32BE(0), buf.length, 256);
  const brands = [ascii(buf, 8, 12)];
  for (let at = 16; at + 4 <= size; at += 4) brands.push(ascii(buf, at, at + 4));
  return brands;
}
