// Check values: column sizes from our migrations [SUG]; 2,147,483,647 is PostgreSQL's INTEGER maximum (its manual,
// "Numeric Types", from memory).
import { describe, expect, it } from "vitest";
import { POST as decide } from "../../app/api/house/lots/[id]/decision/route";
import { POST as addItem } from "../../app/api/lots/[id]/items/route";
import { POST as addShelfTube } from "../../app/api/shelf/route";
import { POST as addType } from "../../app/api/valves/types/route";
import { itemInput, makeUser, noParams, request, sessionCookie, viewerOf } from "../support/factories";

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

async function draftLot() {
  const consignor = await makeUser(["consignor"]);
  const { createLot } = await import("../../lib/services/lots");
  const lot = await createLot(viewerOf(consignor), {
    title: `Bounds lot ${Date.now()}`,
    provenance: "",
    shippingOrigin: "",
    testerKind: "untested",
    testerNotes: "",
  });
  return { consignor, lot };
}

async function expect400(res: Response, field: string) {
  expect(res.status).toBe(400);
  const body = (await res.json()) as ErrorBody;
  expect(body.error.code).toBe("validation_failed");
  expect(Object.keys(body.error.fields ?? {})).toContain(field);
  return body;
}

describe("inputs are bounded by their columns: 400 naming the field, never a 500", () => {
  it("refuses an item label of 150 characters (label_brand holds 120) and a source code of 27 (source_code holds 16)", async () => {
    const { consignor, lot } = await draftLot();
    const cookie = await sessionCookie(consignor);
    const params = { params: Promise.resolve({ id: lot.id }) };
    const send = (over: Parameters<typeof itemInput>[0]) =>
      addItem(request(`/api/lots/${lot.id}/items`, { json: itemInput(over), headers: { cookie } }), params);
    const label = await expect400(await send({ labelBrand: "L".repeat(150) }), "labelBrand");
    expect(label.error.fields!.labelBrand).toMatch(/120/);
    const code = await expect400(await send({ sourceCode: "1".repeat(27) }), "sourceCode");
    expect(code.error.fields!.sourceCode).toMatch(/16/);
    expect((await send({ labelBrand: "L".repeat(120), sourceCode: "1".repeat(16) })).status).toBe(201);
  });

  it("refuses a house approval of 3,000,000,000 cents (beyond INTEGER) with 400", async () => {
    const { consignor, lot } = await draftLot();
    const admin = await makeUser(["admin"]);
    const { addItem: add } = await import("../../lib/services/lots");
    const { submitLot } = await import("../../lib/services/lot-review");
    await add(viewerOf(consignor), lot.id, itemInput());
    await submitLot(viewerOf(consignor), lot.id);
    const cookie = await sessionCookie(admin);
    const params = { params: Promise.resolve({ id: lot.id }) };
    const approve = (low: number, high: number) =>
      decide(
        request(`/api/house/lots/${lot.id}/decision`, {
          json: {
            action: "approve",
            comment: "",
            estimateLowCents: low,
            estimateHighCents: high,
            reserveCents: low,
            reserveAgreed: true,
          },
          headers: { cookie },
        }),
        params,
      );
    await expect400(await approve(5_000, 3e9), "estimateHighCents");
    await expect400(await approve(3e9, 3e9), "estimateLowCents");
    expect((await approve(5_000, 2_147_483_647)).status).toBeLessThan(300);
  });

  it("refuses a shelf designation longer than shelf_tubes.designation (32)", async () => {
    const dealer = await makeUser(["dealer"]);
    const res = await addShelfTube(
      request("/api/shelf", {
        json: {
          designation: "6".repeat(33),
          labelBrand: "",
          sourceCode: null,
          dateCode: null,
          features: {},
          notes: "",
          clientKey: null,
        },
        headers: { cookie: await sessionCookie(dealer) },
      }),
      noParams,
    );
    await expect400(res, "designation");
  });

  it("refuses a reference designation longer than valve_types.designation (32)", async () => {
    const admin = await makeUser(["admin"]);
    const res = await addType(
      request("/api/valves/types", {
        json: {
          designation: "12AX7" + "A".repeat(30),
          aliases: "",
          kind: "triode",
          base: "noval",
          coldCathode: false,
          heaterVolts: null,
          heaterAmps: null,
          source: "MEM",
          note: "",
          reason: "a test of the column bound",
        },
        headers: { cookie: await sessionCookie(admin) },
      }),
      noParams,
    );
    await expect400(res, "designation");
  });
});
