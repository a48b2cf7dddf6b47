// Object storage settings and object keys: defaults reach the local fake; keys cannot escape their prefix.
import { describe, expect, it } from "vitest";
import { storageConfig } from "@/lib/storage/config";
import { assertObjectKey, lotPhotoPrefix, photoObjectKey, photoObjectKeys } from "@/lib/storage/keys";

const LOT = "5b0c6a52-3d0e-4c1f-9a51-0b8f3e2d7c41";
const PHOTO = "e2a4f1d0-7b6c-4e8a-8f3d-2c1b0a9d8e7f";

describe("storageConfig", () => {
  it("defaults to the local fake: loopback endpoint, path style, its fixed keys", () => {
    expect(storageConfig({})).toEqual({
      endpoint: "http://127.0.0.1:4569",
      region: "us-east-1",
      bucket: "getterline-evidence",
      forcePathStyle: true,
      credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
    });
  });

  it("uses the provider's endpoint and default credential chain when both are set empty", () => {
    const c = storageConfig({
      S3_ENDPOINT: "",
      S3_ACCESS_KEY_ID: "",
      S3_SECRET_ACCESS_KEY: "",
      S3_BUCKET: "evidence.example",
      S3_REGION: "eu-west-1",
    });
    expect(c).toMatchObject({
      endpoint: undefined,
      forcePathStyle: false,
      credentials: undefined,
      bucket: "evidence.example",
      region: "eu-west-1",
    });
  });

  it("refuses a bad bucket name, a non-http endpoint and half a key pair, naming each", () => {
    expect(() => storageConfig({ S3_BUCKET: "Evidence_Bucket" })).toThrow(/S3_BUCKET/);
    expect(() => storageConfig({ S3_ENDPOINT: "ftp://127.0.0.1:21" })).toThrow(/S3_ENDPOINT/);
    expect(() => storageConfig({ S3_ACCESS_KEY_ID: "", S3_SECRET_ACCESS_KEY: "x" })).toThrow(/S3_SECRET_ACCESS_KEY/);
  });
});

describe("object keys", () => {
  it("puts both renditions of a photo under the lot's prefix", () => {
    expect(photoObjectKeys(LOT, PHOTO)).toEqual({
      full: `photos/${LOT}/${PHOTO}/full.jpg`,
      thumb: `photos/${LOT}/${PHOTO}/thumb.jpg`,
    });
    expect(photoObjectKey(LOT, PHOTO, "full").startsWith(lotPhotoPrefix(LOT))).toBe(true);
  });

  it("refuses ids that could climb or split the path", () => {
    for (const bad of ["..", "../etc", "a/b", "", "a b", "-lead"]) {
      expect(() => photoObjectKey(bad, PHOTO, "full"), bad).toThrow(/lot id/);
      expect(() => photoObjectKey(LOT, bad, "thumb"), bad).toThrow(/photo id/);
    }
  });

  it("checks raw keys: no empty, absolute, dot or overlong paths", () => {
    expect(assertObjectKey("photos/a/b/full.jpg")).toBe("photos/a/b/full.jpg");
    for (const bad of ["", "/photos/a", "photos/../secrets", "photos//a", "photos/./a", "x".repeat(1025)]) {
      expect(() => assertObjectKey(bad), bad.slice(0, 20)).toThrow();
    }
  });
});
