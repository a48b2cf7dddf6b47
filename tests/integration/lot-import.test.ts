import { describe, expect, it } from "vitest";
import { POST as importRoute } from "../../app/api/lots/[id]/import/route";
import { createLot } from "../../lib/services/lots";
import { LotItem } from "../../models";
import { makeUser, request, sessionCookie, viewerOf } from "../support/factories";

const HEADER = "designation,qty,label,condition,measure,section_1,section_2,chart_new,short,vacuum_loss";

function csvOf(rows: string[]) {
  return [HEADER, ...rows].join("\n") + "\n";
}

describe("CSV import into a lot", () => {
  it("reports bad rows by line and saves nothing, then imports once and never twice", async () => {
    const owner = await makeUser(["consignor"]);
    const lot = await createLot(viewerOf(owner), {
      title: "Import test",
      provenance: "",
      shippingOrigin: "",
      testerKind: "mutual-conductance",
      testerNotes: "",
    });
    const cookie = await sessionCookie(owner);
    const send = (csv: string, mode: "preview" | "apply") =>
      importRoute(
        request(`/api/lots/${lot.id}/import?mode=${mode}&name=box.csv`, {
          method: "POST",
          body: csv,
          headers: { cookie, "content-type": "text/csv" },
        }),
        { params: Promise.resolve({ id: lot.id }) },
      );

    const good = Array.from(
      { length: 28 },
      (_, i) => `12AX7,1,Fairmont Home Radio,used,gm,${1500 + i * 5},${1490 + i * 5},1600,no,no`,
    );
    const broken = [
      ...good.slice(0, 10),
      "12AU7,1,Tri-County Parts,used,gm,abc,,2200,no,no",
      ...good.slice(10, 20),
      "6SN7GT,1,,mint,gm,2600,2600,2600,no,no",
      ...good.slice(20),
    ];
    const preview = await send(csvOf(broken), "preview");
    expect(preview.status).toBe(200);
    const p = (await preview.json()) as { errors: { line: number; message: string }[]; counts: { new: number } };
    expect(p.errors.map((e) => e.line).sort((a, b) => a - b)).toEqual([12, 23]); // header is line 1

    const refused = await send(csvOf(broken), "apply");
    expect(refused.status).toBe(400);
    expect(await LotItem.count({ where: { lotId: lot.id } })).toBe(0);

    const fixed = [
      ...good.slice(0, 10),
      "12AU7,1,Tri-County Parts,used,gm,2100,2150,2200,no,no",
      ...good.slice(10, 20),
      "6SN7GT,1,,nos,gm,2600,2600,2600,no,no",
      ...good.slice(20),
    ];
    const applied = await send(csvOf(fixed), "apply");
    expect(applied.status).toBe(200);
    expect(((await applied.json()) as { added: number }).added).toBe(30);
    expect(await LotItem.count({ where: { lotId: lot.id } })).toBe(30);

    const again = await send(csvOf(fixed), "apply");
    expect(((await again.json()) as { added: number }).added).toBe(0);
    expect(await LotItem.count({ where: { lotId: lot.id } })).toBe(30);
  });

  it("refuses a 100,000-row file with a clear message and writes nothing", async () => {
    const owner = await makeUser(["consignor"]);
    const lot = await createLot(viewerOf(owner), {
      title: "Huge",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    });
    const rows = Array.from({ length: 100_000 }, () => "6V6GT,1");
    const csv = ["designation,qty", ...rows].join("\n");
    const r = await importRoute(
      request(`/api/lots/${lot.id}/import?mode=preview`, {
        method: "POST",
        body: csv,
        headers: { cookie: await sessionCookie(owner), "content-type": "text/csv" },
      }),
      { params: Promise.resolve({ id: lot.id }) },
    );
    expect([200, 413]).toContain(r.status);
    const b = (await r.json()) as { errors?: { line: number; message: string }[]; error?: { message: string } };
    const text = b.error?.message ?? b.errors?.map((e) => e.message).join(" ") ?? "";
    expect(text).toMatch(/rows|large/i);
    expect(await LotItem.count({ where: { lotId: lot.id } })).toBe(0);
  });
});
