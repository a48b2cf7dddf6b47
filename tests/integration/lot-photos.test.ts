import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as upload } from "../../app/api/lots/[id]/photos/route";
import { GET as readPhotoRoute } from "../../app/api/photos/[id]/route";
import { createLot, addItem } from "../../lib/services/lots";
import { submitLot, decideLot } from "../../lib/services/lot-review";
import { LotPhoto } from "../../models";
import { startTestS3, type TestS3 } from "../setup/s3";
import { itemInput, makeUser, request, sessionCookie, viewerOf } from "../support/factories";
import { NextRequest } from "next/server";

let s3: TestS3;
beforeAll(async () => {
  s3 = await startTestS3("getterline-photos-test");
});
afterAll(async () => {
  await s3.stop();
});

function multipart(url: string, cookie: string, file: Blob, name: string): NextRequest {
  const form = new FormData();
  form.append("file", file, name);
  form.append("caption", "Box as received");
  return new NextRequest(new URL(url, "http://localhost:3000"), {
    method: "POST",
    body: form,
    headers: { cookie, host: "localhost:3000" },
  });
}

const jpegWithGps = () =>
  sharp({ create: { width: 640, height: 480, channels: 3, background: "#888" } })
    .withExif({ IFD0: { Make: "Demo Camera" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1" } })
    .jpeg()
    .toBuffer();

describe("lot photos", () => {
  it("stores a re-encoded photo without metadata, serves it to the owner only until approval, and de-duplicates retries", async () => {
    const owner = await makeUser(["consignor"]);
    const dealer = await makeUser(["dealer"]);
    const admin = await makeUser(["admin"]);
    const lot = await createLot(viewerOf(owner), {
      title: "Photo test lot",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    });
    const ownerCookie = await sessionCookie(owner);
    const original = await jpegWithGps();
    expect((await sharp(original).metadata()).exif).toBeDefined();

    const res = await upload(
      multipart(
        `/api/lots/${lot.id}/photos`,
        ownerCookie,
        new Blob([new Uint8Array(original)], { type: "image/jpeg" }),
        "box.jpg",
      ),
      { params: Promise.resolve({ id: lot.id }) },
    );
    expect(res.status).toBe(201);
    const { photo } = (await res.json()) as { photo: { id: string } };

    const again = await upload(
      multipart(
        `/api/lots/${lot.id}/photos`,
        ownerCookie,
        new Blob([new Uint8Array(original)], { type: "image/jpeg" }),
        "box-again.jpg",
      ),
      { params: Promise.resolve({ id: lot.id }) },
    );
    expect(((await again.json()) as { photo: { id: string } }).photo.id).toBe(photo.id);
    expect(await LotPhoto.count({ where: { lotId: lot.id } })).toBe(1);

    const get = (cookie: string) =>
      readPhotoRoute(request(`/api/photos/${photo.id}?size=full`, { headers: { cookie } }), {
        params: Promise.resolve({ id: photo.id }),
      });
    const mine = await get(ownerCookie);
    expect(mine.status).toBe(200);
    const served = Buffer.from(await mine.arrayBuffer());
    const meta = await sharp(served).metadata();
    expect(meta.format).toBe("jpeg");
    expect(meta.exif).toBeUndefined();
    expect(served.includes(Buffer.from("Demo Camera"))).toBe(false);

    expect((await get(await sessionCookie(dealer))).status).toBe(404); // not approved yet

    await addItem(viewerOf(owner), lot.id, itemInput());
    await submitLot(viewerOf(owner), lot.id);
    await decideLot(viewerOf(admin), lot.id, {
      action: "approve",
      comment: "",
      estimateLowCents: 1000,
      estimateHighCents: 2000,
      reserveCents: 500,
      reserveAgreed: true,
    });
    expect((await get(await sessionCookie(dealer))).status).toBe(200);
  });

  it("refuses an HTML file renamed .jpg and a 50 MB upload, saving nothing", async () => {
    const owner = await makeUser(["consignor"]);
    const lot = await createLot(viewerOf(owner), {
      title: "Refusals",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    });
    const cookie = await sessionCookie(owner);
    const html = new Blob(["<!doctype html><html><body><script>alert(1)</script></body></html>"], {
      type: "image/jpeg",
    });
    const r1 = await upload(multipart(`/api/lots/${lot.id}/photos`, cookie, html, "tube.jpg"), {
      params: Promise.resolve({ id: lot.id }),
    });
    expect(r1.status).toBe(415);
    expect(((await r1.json()) as { error: { message: string } }).error.message).toMatch(/tube\.jpg/);

    const big = new Blob([new Uint8Array(50 * 1024 * 1024)], { type: "image/jpeg" });
    const r2 = await upload(multipart(`/api/lots/${lot.id}/photos`, cookie, big, "huge.jpg"), {
      params: Promise.resolve({ id: lot.id }),
    });
    expect(r2.status).toBe(413);
    expect(await LotPhoto.count({ where: { lotId: lot.id } })).toBe(0);
  });

  it("keeps another consignor out of a lot's photos", async () => {
    const owner = await makeUser(["consignor"]);
    const other = await makeUser(["consignor"]);
    const lot = await createLot(viewerOf(owner), {
      title: "Mine",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    });
    const img = await sharp({ create: { width: 50, height: 50, channels: 3, background: "#333" } })
      .png()
      .toBuffer();
    const r = await upload(
      multipart(`/api/lots/${lot.id}/photos`, await sessionCookie(other), new Blob([new Uint8Array(img)]), "x.png"),
      { params: Promise.resolve({ id: lot.id }) },
    );
    expect(r.status).toBe(404);
  });
});
