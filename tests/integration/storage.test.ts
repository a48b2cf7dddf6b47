// lib/storage/objects.ts against the local S3 fake: put, get, missing, delete, and a processed photo round trip.
import { createHash } from "node:crypto";
import { existsSync } from "node:fs";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { processPhoto } from "@/lib/photos/process";
import { photoObjectKeys } from "@/lib/storage/keys";
import { deleteObject, getObject, objectBucket, putObject } from "@/lib/storage/objects";
import { startTestS3, type TestS3 } from "../setup/s3";

const LOT = "0d3f7a2e-91b4-4c55-8e0a-6f2b1c9d4a10";
const PHOTO = "7c1e9b44-2a6d-4f08-b3c5-1d0e8f7a6b92";
const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");

let s3: TestS3;
beforeAll(async () => {
  s3 = await startTestS3();
});
afterAll(async () => {
  await s3?.stop();
  expect(existsSync(s3.dir)).toBe(false);
});

describe("object storage against the fake", () => {
  it("uses the bucket the test set", () => {
    expect(objectBucket()).toBe(s3.bucket);
    expect(s3.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
  });

  it("stores an object and gives back the same bytes and content type", async () => {
    const body = Buffer.from(Array.from({ length: 70_000 }, (_, i) => (i * 31) % 256));
    await putObject("tests/bytes.bin", body, "application/octet-stream");
    const got = await getObject("tests/bytes.bin");
    expect(got).not.toBeNull();
    expect(got!.contentType).toBe("application/octet-stream");
    expect(got!.contentLength).toBe(body.length);
    expect(sha(got!.body)).toBe(sha(body));
  });

  it("overwrites an object under the same key", async () => {
    await putObject("tests/over.txt", Buffer.from("first"), "text/plain");
    await putObject("tests/over.txt", Buffer.from("second"), "text/plain");
    expect((await getObject("tests/over.txt"))!.body.toString()).toBe("second");
  });

  it("answers null for a key that was never written", async () => {
    expect(await getObject("tests/never-written.jpg")).toBeNull();
  });

  it("deletes an object, and deleting it again is not an error", async () => {
    await putObject("tests/gone.txt", Buffer.from("soon gone"), "text/plain");
    expect(await getObject("tests/gone.txt")).not.toBeNull();
    await deleteObject("tests/gone.txt");
    expect(await getObject("tests/gone.txt")).toBeNull();
    await expect(deleteObject("tests/gone.txt")).resolves.toBeUndefined();
  });

  it("refuses a key that climbs out of its prefix before sending anything", async () => {
    await expect(putObject("photos/../escape.txt", Buffer.from("x"), "text/plain")).rejects.toThrow(
      /invalid object key/,
    );
  });

  it("keeps both renditions of a processed photo under the lot's keys", async () => {
    const upload = await sharp({ create: { width: 1200, height: 900, channels: 3, background: "#7a6a58" } })
      .jpeg()
      .withExif({ IFD3: { GPSLatitudeRef: "N", GPSLatitude: "10/1 20/1 30/1", GPSMapDatum: "WGS-84" } })
      .toBuffer();
    const photo = await processPhoto(upload, "shelf.jpg");
    const keys = photoObjectKeys(LOT, PHOTO);
    await putObject(keys.full, photo.full.buffer, photo.full.contentType);
    await putObject(keys.thumb, photo.thumb.buffer, photo.thumb.contentType);

    const full = await getObject(keys.full);
    const thumb = await getObject(keys.thumb);
    expect(full!.contentType).toBe("image/jpeg");
    expect(sha(full!.body)).toBe(sha(photo.full.buffer));
    expect(sha(thumb!.body)).toBe(sha(photo.thumb.buffer));
    const meta = await sharp(full!.body).metadata();
    expect([meta.width, meta.height, meta.exif]).toEqual([1200, 900, undefined]);
  });
});
