import { describe, expect, it } from "vitest";
import { GET as dateCode } from "../../app/api/valves/date-codes/[code]/route";
import { POST as grade } from "../../app/api/valves/grade/route";
import { POST as importRegistry } from "../../app/api/valves/makers/import/route";
import { GET as history } from "../../app/api/valves/types/[designation]/history/route";
import { GET as getType, PATCH as patchType } from "../../app/api/valves/types/[designation]/route";
import { makeUser, noParams, request, sessionCookie } from "../support/factories";

type Body = { error?: { code: string; message: string; details?: { candidates?: string[] } } } & Record<
  string,
  unknown
>;
const typeOf = (d: string) =>
  getType(request(`/api/valves/types/${encodeURIComponent(d)}`), { params: Promise.resolve({ designation: d }) });
const json = async (r: Response) => (await r.json()) as Body;

describe("GET /api/valves/types/:designation", () => {
  it("decodes what a consignor types and returns published figures [REG ✓: 12AX7 µ 100, Gm 1,600 µmho, Ip 1.2 mA]", async () => {
    const r = await typeOf("ecc 83");
    expect(r.status).toBe(200);
    const b = (await r.json()) as {
      decode: { normalised: string };
      reference: { designation: string; characteristics: { mu: number; gmMicromho: number; plateCurrentMa: number } };
    };
    expect(b.decode.normalised).toBe("ECC83");
    expect(b.reference.designation).toBe("12AX7");
    expect(b.reference.characteristics).toMatchObject({ mu: 100, gmMicromho: 1600, plateCurrentMa: 1.2 });
  });

  it("answers what is not a designation with 404 and the closest candidates", async () => {
    // A final number of 77 cannot occur on a US receiving type (1 to 12 elements brought out) [MEM].
    const r = await typeOf("12AX77");
    expect(r.status).toBe(404);
    const b = await json(r);
    expect(b.error!.code).toBe("not_found");
    expect(b.error!.details!.candidates).toContain("12AX7");
  });

  it("answers a designation that decodes by its scheme but has no figures with 200 and onFile false", async () => {
    // 12AX8 reads as a 12-class US number [LS53]; not on file, so the house may add it.
    const r = await typeOf("12AX8");
    expect(r.status).toBe(200);
    const b = (await json(r)) as unknown as {
      onFile: boolean;
      canAdd: boolean;
      reference: unknown;
      decode: { heater: { volts: number }; candidates: string[] };
    };
    expect(b).toMatchObject({ onFile: false, canAdd: true, reference: null });
    expect(b.decode.heater.volts).toBe(12.6);
    expect(b.decode.candidates).toContain("12AX7");
  });

  it("answers 5814 as on file (the unsuffixed 5814A) [MEM]", async () => {
    const r = await typeOf("5814");
    expect(r.status).toBe(200);
    expect(await json(r)).toMatchObject({ onFile: true, reference: { designation: "5814A", matchedBy: "stem" } });
  });

  it("answers bad input with 400, never 500: empty, 10 KB, control characters, odd unicode", async () => {
    for (const bad of ["", " ", "x".repeat(10_240), "12AX7\u0000", "\u202e7XA21"]) {
      const r = await typeOf(bad);
      expect([400, 404]).toContain(r.status);
      expect((await json(r)).error).toBeDefined();
    }
    expect((await typeOf("x".repeat(10_240))).status).toBe(400);
    // Full-width digits fold to the ordinary designation (NFKC).
    expect((await typeOf("１２ＡＸ７")).status).toBe(200);
  });
});

describe("GET /api/valves/date-codes/:code", () => {
  const read = (code: string, type?: string) =>
    dateCode(request(`/api/valves/date-codes/${encodeURIComponent(code)}${type ? `?type=${type}` : ""}`), {
      params: Promise.resolve({ code }),
    });

  it("reads 5943 as 1959 week 43 [EIA-476]", async () => {
    const b = (await (await read("5943")).json()) as { eia: { readings: { year: number; week: number }[] } };
    expect(b.eia.readings[0]).toMatchObject({ year: 1959, week: 43 });
  });

  it("lists every plausible decade for a single year digit on a 12AX7, never before 1947 [CTP; MEM introduction 1947]", async () => {
    const b = (await (await read("943", "12AX7")).json()) as { eia: { readings: { year: number }[] } };
    const years = b.eia.readings.map((x) => x.year).sort();
    expect(years).toContain(1949);
    expect(years).toContain(1959);
    expect(years).not.toContain(1939);
  });

  it("answers a 10 KB code with 400", async () => {
    expect((await read("9".repeat(10_240))).status).toBe(400);
  });
});

describe("POST /api/valves/grade", () => {
  const post = (body: unknown, raw?: string) =>
    grade(
      request(
        "/api/valves/grade",
        raw !== undefined ? { body: raw, headers: { "content-type": "application/json" } } : { json: body },
      ),
      noParams,
    );

  it("grades and matches [CTP bands]", async () => {
    const r = await post({
      chartNewValue: 1600,
      tolerancePct: 5,
      tubes: [
        { id: "a", sections: [1200] },
        { id: "b", sections: [1600] },
        { id: "c", sections: [1640] },
      ],
    });
    expect(r.status).toBe(200);
    const b = (await r.json()) as { grades: { id: string; grade: string }[]; pairs: { sets: { ids: string[] }[] } };
    expect(b.grades.find((g) => g.id === "a")!.grade).toBe("fair");
    expect(b.pairs.sets).toHaveLength(1);
  });

  it("answers wrong JSON types with 400 and field paths", async () => {
    const r = await post({ tubes: [{ id: 5, sections: "many" }], tolerancePct: "tight" });
    expect(r.status).toBe(400);
    const b = await json(r);
    expect(b.error!.code).toBe("validation_failed");
  });

  it("answers 100,000 readings with 413 and a body that is not JSON with 400", async () => {
    const tubes = Array.from({ length: 100_000 }, (_, i) => ({ id: `t${i}`, sections: [1500 + (i % 300)] }));
    const big = await post({ chartNewValue: 1600, tubes });
    expect(big.status).toBe(413);
    expect((await json(big)).error!.code).toBe("payload_too_large");
    expect((await post(undefined, '{"tubes": [')).status).toBe(400);
  });
});

describe("reference corrections and the maker registry", () => {
  it("lets the house correct a row with history, refuses a stale revision, and keeps others out", async () => {
    const admin = await makeUser(["admin"]);
    const dealer = await makeUser(["dealer"]);
    const edit = {
      expectedRevision: 1,
      reason: "Checked against the registered data sheet",
      source: "REG ✓",
      heaterVolts: 6.3,
      heaterAmps: 0.6,
      introducedYear: 1939,
      plateVolts: 250,
      gridVolts: -8,
      screenVolts: null,
      mu: 20,
      gmMicromho: 2600,
      plateCurrentMa: 9,
      rpOhms: 7700,
      note: "",
    };
    const call = (cookie: string, body: unknown) =>
      patchType(request("/api/valves/types/6SN7GT", { method: "PATCH", json: body, headers: { cookie } }), {
        params: Promise.resolve({ designation: "6SN7GT" }),
      });
    expect((await call(await sessionCookie(dealer), edit)).status).toBe(403);
    const ok = await call(await sessionCookie(admin), edit);
    expect(ok.status).toBe(200);
    expect((await call(await sessionCookie(admin), edit)).status).toBe(409);
    const h = await history(
      request("/api/valves/types/6SN7GT/history", { headers: { cookie: await sessionCookie(admin) } }),
      { params: Promise.resolve({ designation: "6SN7GT" }) },
    );
    const hb = (await h.json()) as { history: { revision: number; reason: string; changedBy: string }[] };
    expect(hb.history[0]).toMatchObject({ revision: 2, reason: edit.reason, changedBy: admin.displayName });
  });

  it("imports the registry CSV: bad rows refuse the file, the same file twice changes nothing", async () => {
    const admin = await makeUser(["admin"]);
    const cookie = await sessionCookie(admin);
    const send = (csv: string, mode: string) =>
      importRegistry(
        request(`/api/valves/makers/import?mode=${mode}`, {
          method: "POST",
          body: csv,
          headers: { cookie, "content-type": "text/csv" },
        }),
        noParams,
      );
    const bad = "code,maker_name,is_demo,notes\nX17,Aldergrove Electron Works,true,demo\nabc,,maybe,\n";
    const refused = await send(bad, "apply");
    expect(refused.status).toBe(400);
    const good =
      "code,maker_name,is_demo,notes\nX17,Aldergrove Electron Works,true,demo\nX31,Kestrel Valve Company,true,demo\n";
    const first = (await (await send(good, "apply")).json()) as { counts: Record<string, number> };
    expect(first.counts).toEqual({ new: 2, changed: 0, unchanged: 0 });
    const again = (await (await send(good, "apply")).json()) as { counts: Record<string, number> };
    expect(again.counts).toEqual({ new: 0, changed: 0, unchanged: 2 });
  });
});
