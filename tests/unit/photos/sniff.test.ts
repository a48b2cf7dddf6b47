// sniffImageType: what a file is from its first bytes, whatever it is called.
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { sniffImageType } from "@/lib/photos/sniff";
import { ACCEPTED_PHOTO_LABELS, PHOTO_ACCEPT_ATTRIBUTE } from "@/lib/photos/formats";

const tiny = () => sharp({ create: { width: 8, height: 8, channels: 3, background: "#808080" } });

describe("sniffImageType", () => {
  it("recognises the accepted formats from real encoder output", async () => {
    expect(sniffImageType(await tiny().jpeg().toBuffer())).toEqual({ kind: "accepted", format: "jpeg" });
    expect(sniffImageType(await tiny().png().toBuffer())).toEqual({ kind: "accepted", format: "png" });
    expect(sniffImageType(await tiny().webp().toBuffer())).toEqual({ kind: "accepted", format: "webp" });
  });

  it("names image formats we refuse", async () => {
    expect(sniffImageType(await tiny().gif().toBuffer())).toMatchObject({ kind: "unsupported", format: "gif" });
    expect(sniffImageType(await tiny().tiff().toBuffer())).toMatchObject({ kind: "unsupported", format: "tiff" });
    expect(sniffImageType(await tiny().avif().toBuffer())).toMatchObject({ kind: "unsupported", format: "avif" });
    const heic = Buffer.concat([
      Buffer.from([0, 0, 0, 0x18]),
      Buffer.from("ftypheic\0\0\0\0mif1heic"),
      Buffer.alloc(16),
    ]);
    expect(sniffImageType(heic)).toMatchObject({ kind: "unsupported", format: "heic" });
    const bmp = Buffer.alloc(64);
    bmp.write("BM");
    bmp.writeUInt32LE(64, 2);
    expect(sniffImageType(bmp)).toMatchObject({ kind: "unsupported", format: "bmp" });
    expect(sniffImageType(Buffer.from('\uFEFF<!-- drawn by hand -->\n<svg viewBox="0 0 1 1"></svg>'))).toMatchObject({
      format: "svg",
    });
  });

  it("calls text, HTML with inline SVG, and truncated headers unknown", () => {
    for (const s of [
      "hello",
      "<!doctype html><html><body><svg></svg></body></html>",
      "RIFF\0\0\0\0WAVE",
      "BM is a text file",
      "\x89PNG",
    ]) {
      expect(sniffImageType(Buffer.from(s, "latin1")), s).toEqual({ kind: "unknown" });
    }
    expect(sniffImageType(Buffer.from([0xff, 0xd8]))).toEqual({ kind: "unknown" });
  });
});

describe("accepted formats for the upload form", () => {
  it("lists the three formats for people and for the file picker", () => {
    expect(ACCEPTED_PHOTO_LABELS).toBe("JPEG, PNG or WebP");
    expect(PHOTO_ACCEPT_ATTRIBUTE.split(",")).toEqual([
      "image/jpeg",
      ".jpg",
      ".jpeg",
      "image/png",
      ".png",
      "image/webp",
      ".webp",
    ]);
  });
});
