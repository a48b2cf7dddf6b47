// processPhoto: type by content, limits before decoding, upright JPEG renditions with no metadata.
import { createHash } from "node:crypto";
import { crc32 } from "node:zlib";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { processPhoto, PhotoRejected, type PhotoRejectionCode } from "@/lib/photos/process";
import { FULL_MAX_SIDE, MAX_PHOTO_BYTES, THUMB_MAX_SIDE } from "@/lib/photos/formats";

const JPEG_MAGIC = Buffer.from([0xff, 0xd8, 0xff]);

/** The rejection code processPhoto throws, failing the test when it does not throw PhotoRejected. */
async function rejection(input: Buffer, name: string, limits?: Parameters<typeof processPhoto>[2]) {
  try {
    await processPhoto(input, name, limits);
  } catch (e) {
    if (e instanceof PhotoRejected) return { code: e.code as PhotoRejectionCode, message: e.message };
    throw e;
  }
  throw new Error(`${name} was accepted`);
}

describe("processPhoto strips metadata", () => {
  it("drops EXIF (GPS position included), XMP, IPTC and the ICC profile from both renditions", async () => {
    const tagged = await plain(400, 300)
      .jpeg()
      .withExif({
        IFD0: { Make: "Bench Camera Works", Copyright: "Consignor 17" },
        IFD3: {
          GPSLatitudeRef: "N",
          GPSLatitude: "51/1 30/1 0/1",
          GPSLongitudeRef: "W",
          GPSLongitude: "0/1 7/1 0/1",
          GPSMapDatum: "WGS-84",
        },
      })
      .withXmp(
        '<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><rdf:Description xmlns:dc="http://purl.org/dc/elements/1.1/" dc:creator="Consignor 17"/></rdf:RDF></x:xmpmeta>',
      )
      .withIccProfile("p3")
      .toBuffer();
    const input = withIptcCaption(tagged, "Shelf 4, north wall");

    // The input really carries every kind of metadata, or the test proves nothing.
    const before = await sharp(input).metadata();
    expect(before.exif?.includes("WGS-84")).toBe(true);
    expect(before.xmp?.includes("Consignor 17")).toBe(true);
    expect(before.iptc?.includes("Shelf 4")).toBe(true);
    expect(before.icc).toBeDefined();

    const out = await processPhoto(input, "valve-lot.jpg");
    for (const r of [out.full, out.thumb]) {
      const after = await sharp(r.buffer).metadata();
      expect(after.format).toBe("jpeg");
      expect(after.exif).toBeUndefined();
      expect(after.xmp).toBeUndefined();
      expect(after.iptc).toBeUndefined();
      expect(after.icc).toBeUndefined();
      expect(after.orientation).toBeUndefined();
      for (const needle of ["Exif\0", "WGS-84", "Bench Camera", "Consignor 17", "Shelf 4", "Photoshop 3.0"]) {
        expect(r.buffer.includes(needle), needle).toBe(false);
      }
    }
  });
});

describe("processPhoto renditions", () => {
  it("turns the picture upright by its EXIF orientation (6: rotate 90° clockwise)", async () => {
    const input = await leftRedRightBlue(200, 100).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    expect((await sharp(input).metadata()).orientation).toBe(6);

    const out = await processPhoto(input, "sideways.jpg");
    expect([out.full.width, out.full.height]).toEqual([100, 200]);
    // The stored left (red) half is the top once upright, the blue half the bottom.
    const top = await pixelAt(out.full.buffer, 50, 20);
    const bottom = await pixelAt(out.full.buffer, 50, 180);
    expect(top.r).toBeGreaterThan(180);
    expect(top.b).toBeLessThan(60);
    expect(bottom.b).toBeGreaterThan(180);
    expect(bottom.r).toBeLessThan(60);
  });

  it("caps the full image's longest side and fits the thumbnail inside 320 × 320", async () => {
    const wide = await processPhoto(await plain(3000, 1000).png().toBuffer(), "wide.png");
    expect([wide.full.width, wide.full.height]).toEqual([FULL_MAX_SIDE, 800]);
    expect(wide.thumb.width).toBe(THUMB_MAX_SIDE);
    expect(wide.thumb.height).toBeLessThanOrEqual(THUMB_MAX_SIDE);

    const tall = await processPhoto(await plain(500, 1200).jpeg().toBuffer(), "tall.jpg");
    expect([tall.full.width, tall.full.height]).toEqual([500, 1200]);
    expect(tall.thumb.height).toBe(THUMB_MAX_SIDE);
    expect(tall.thumb.width).toBeLessThanOrEqual(THUMB_MAX_SIDE);
    const thumbMeta = await sharp(tall.thumb.buffer).metadata();
    expect([thumbMeta.width, thumbMeta.height]).toEqual([tall.thumb.width, tall.thumb.height]);
  });

  it("does not enlarge a small picture", async () => {
    const out = await processPhoto(await plain(300, 200).webp().toBuffer(), "small.webp");
    expect([out.full.width, out.full.height]).toEqual([300, 200]);
    expect([out.thumb.width, out.thumb.height]).toEqual([300, 200]);
    expect(out.detectedFormat).toBe("webp");
  });

  it("accepts a PNG with transparency and re-encodes it as a JPEG on white", async () => {
    const png = await sharp({
      create: { width: 64, height: 64, channels: 4, background: { r: 0, g: 0, b: 0, alpha: 0 } },
    })
      .png()
      .toBuffer();
    const out = await processPhoto(png, "cutout.png");
    expect(out.detectedFormat).toBe("png");
    expect(out.full.contentType).toBe("image/jpeg");
    expect(out.full.buffer.subarray(0, 3)).toEqual(JPEG_MAGIC);
    expect(out.thumb.buffer.subarray(0, 3)).toEqual(JPEG_MAGIC);
    const meta = await sharp(out.full.buffer).metadata();
    expect(meta.format).toBe("jpeg");
    expect(meta.hasAlpha).toBe(false);
    const corner = await pixelAt(out.full.buffer, 0, 0);
    expect(Math.min(corner.r, corner.g, corner.b)).toBeGreaterThan(245);
  });

  it("judges type by content: a PNG named .jpg is read as PNG", async () => {
    const out = await processPhoto(await plain(40, 30).png().toBuffer(), "holiday.jpg");
    expect(out.detectedFormat).toBe("png");
  });

  it("fingerprints the bytes as uploaded", async () => {
    const input = await plain(120, 90).jpeg().toBuffer();
    const out = await processPhoto(input, "print.jpg");
    expect(out.sha256).toBe(createHash("sha256").update(input).digest("hex"));
    expect(out.sha256).not.toBe(createHash("sha256").update(out.full.buffer).digest("hex"));
    expect(out.originalBytes).toBe(input.length);
  });
});

describe("processPhoto refusals", () => {
  it("refuses an empty file", async () => {
    const r = await rejection(Buffer.alloc(0), "blank.jpg");
    expect(r.code).toBe("empty");
    expect(r.message).toContain("blank.jpg");
  });

  it("refuses an HTML page renamed .jpg as not an image", async () => {
    const html = Buffer.from("<!doctype html><html><body><script>alert(1)</script></body></html>");
    const r = await rejection(html, "photo.jpg");
    expect(r.code).toBe("not-an-image");
    expect(r.message).toContain("photo.jpg");
  });

  it("refuses a 50 MB upload as too large before looking at its contents", async () => {
    // HTML padded to 50 MB: had the contents been read first, this would be "not-an-image".
    const big = Buffer.alloc(50 * 1024 * 1024, 0x20);
    big.write("<!doctype html><html>");
    const r = await rejection(big, "scan.jpg");
    expect(r.code).toBe("too-large");
    expect(r.message).toContain("scan.jpg");
    expect(r.message).toContain("50 MB");
    expect(big.length).toBeGreaterThan(MAX_PHOTO_BYTES);
  });

  it("refuses a real picture over a smaller byte limit", async () => {
    const jpeg = await plain(200, 200).jpeg().toBuffer();
    expect((await rejection(jpeg, "a.jpg", { maxBytes: jpeg.length - 1 })).code).toBe("too-large");
    await expect(processPhoto(jpeg, "a.jpg", { maxBytes: jpeg.length })).resolves.toBeDefined();
  });

  it("refuses a header claiming 20000 × 20000 pixels without decoding it", async () => {
    const r = await rejection(pngHeaderClaiming(20000, 20000), "bomb.png");
    expect(r.code).toBe("too-many-pixels");
    expect(r.message).toContain("20000 × 20000");
  });

  it("refuses a real picture over a smaller pixel limit", async () => {
    const png = await plain(200, 100).png().toBuffer();
    expect((await rejection(png, "p.png", { maxPixels: 19_999 })).code).toBe("too-many-pixels");
    await expect(processPhoto(png, "p.png", { maxPixels: 20_000 })).resolves.toBeDefined();
  });

  it("refuses image formats we do not take, naming the format", async () => {
    const gif = await plain(20, 20).gif().toBuffer();
    const avif = await plain(20, 20).avif().toBuffer();
    const heicHeader = Buffer.concat([
      Buffer.from([0, 0, 0, 0x18]),
      Buffer.from("ftypheic\0\0\0\0mif1heic"),
      Buffer.alloc(64),
    ]);
    const svg = Buffer.from('<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"/>');
    for (const [input, name, label] of [
      [gif, "a.gif", "GIF"],
      [avif, "b.jpg", "AVIF"],
      [heicHeader, "IMG_0001.HEIC", "HEIC"],
      [svg, "c.png", "SVG"],
    ] as const) {
      const r = await rejection(input, name);
      expect(r.code, name).toBe("unsupported-format");
      expect(r.message).toContain(label);
      expect(r.message).toContain(name);
    }
  });

  it("keeps HEIC refused: sharp's prebuilt libvips decodes AVIF but not HEIC", () => {
    // If a future sharp lists .heic here, HEIC could be accepted; revisit lib/photos/sniff.ts.
    expect(sharp.format.heif.input.fileSuffix).not.toContain(".heic");
  });

  it("refuses a damaged JPEG (cut short, or garbage after the magic bytes)", async () => {
    const whole = await sharp({
      create: {
        width: 400,
        height: 300,
        channels: 3,
        background: "#000000",
        noise: { type: "gaussian", mean: 128, sigma: 40 },
      },
    })
      .jpeg()
      .toBuffer();
    expect((await rejection(whole.subarray(0, Math.floor(whole.length * 0.6)), "cut.jpg")).code).toBe("not-an-image");
    expect((await rejection(Buffer.concat([JPEG_MAGIC, Buffer.alloc(2000, 7)]), "junk.jpg")).code).toBe("not-an-image");
  });

  it("names the file by its last path part, without control characters", async () => {
    const r = await rejection(Buffer.from("hello"), "C:\\Users\\someone\\Desktop\\notes\u0007.jpg");
    expect(r.message).toContain("“notes.jpg”");
    expect(r.message).not.toContain("Desktop");
  });
});

// In-memory images, made with sharp; nothing is read from disk.
const RED = { r: 220, g: 20, b: 20 };
const BLUE = { r: 20, g: 20, b: 220 };

/** A plain picture of the given size and colour. */
function plain(width: number, height: number, background = RED) {
  return sharp({ create: { width, height, channels: 3, background } });
}

/** width × height JPEG: left half red, right half blue. */
function leftRedRightBlue(width: number, height: number) {
  return plain(width / 2, height, RED).extend({ right: width / 2, background: BLUE });
}

/** Insert an IPTC caption (APP13 "Photoshop 3.0" segment, 8BIM resource 0x0404) after a JPEG's SOI marker. */
function withIptcCaption(jpeg: Buffer, caption: string): Buffer {
  const text = Buffer.from(caption, "latin1");
  const dataset = Buffer.concat([Buffer.from([0x1c, 0x02, 0x78, text.length >> 8, text.length & 0xff]), text]);
  const resource = Buffer.concat([Buffer.from("8BIM"), Buffer.from([0x04, 0x04, 0, 0]), Buffer.alloc(4), dataset]);
  resource.writeUInt32BE(dataset.length, 8);
  const payload = Buffer.concat([Buffer.from("Photoshop 3.0\0", "latin1"), resource, Buffer.alloc(dataset.length % 2)]);
  const segment = Buffer.concat([Buffer.from([0xff, 0xed, 0, 0]), payload]);
  segment.writeUInt16BE(payload.length + 2, 2);
  return Buffer.concat([jpeg.subarray(0, 2), segment, jpeg.subarray(2)]);
}

/** A PNG whose header claims width × height but carries almost no pixel data (a decompression-bomb header). */
function pngHeaderClaiming(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, "latin1"), data]);
    const out = Buffer.alloc(body.length + 8);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc32(body), body.length + 4);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, deflate, no filter, no interlace
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

/** The RGB value at (x, y) of an encoded image. */
async function pixelAt(image: Buffer, x: number, y: number) {
  const { data, info } = await sharp(image).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (y * info.width + x) * info.channels;
  return { r: data[i], g: data[i + 1], b: data[i + 2] };
}
