// The public catalogue and want lists against PostgreSQL: equivalence search, relations, paging, bad input,
// privacy of reserves, and want-list matching exactly once. Equivalences checked here are printed in the
// makers' cross-reference tables (ECC83 = 12AX7, EL84 = 6BQ5, ECC88 = 6DJ8, 6922 the special-quality 6DJ8)
// [from memory of those published cross-references; the same links are in lib/valves/equivalents.ts].
import { spawn } from "node:child_process";
import { QueryTypes } from "sequelize";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { addItem, createLot } from "../../lib/services/lots";
import { decideLot, submitLot } from "../../lib/services/lot-review";
import { searchCatalogue } from "../../lib/services/catalogue/search";
import { createWantList } from "../../lib/services/want-lists";
import { matchLotToWantLists, unsubscribeDigest, unsubscribeToken } from "../../lib/services/want-list-matching";
import { ApiError } from "../../lib/api/errors";
import { CatalogueQuerySchema } from "../../lib/validation/catalogue";
import { MAX_WANT_LISTS } from "../../lib/validation/want-lists";
import { db, type User } from "../../models";
import { itemInput, makeUser, noParams, request, viewerOf, waitForSubject } from "../support/factories";

let admin: User;
let consignor: User;
beforeAll(async () => {
  admin = await makeUser(["admin"]);
  consignor = await makeUser(["consignor"]);
});

const RUN = Date.now().toString(36);
const search = (q: Record<string, unknown>) => searchCatalogue(CatalogueQuerySchema.parse({ limit: 60, ...q }));

/** A lot listed through the real review path: draft, items, submitted, approved with an estimate and a reserve. */
async function listed(
  title: string,
  items: { designation: string; quantity: number; condition?: "used" | "new-old-stock" }[],
  reserveCents = 7_777,
) {
  const lot = await createLot(viewerOf(consignor), {
    title: `${title} ${RUN}`,
    provenance: "From a service bench",
    shippingOrigin: "",
    testerKind: "untested",
    testerNotes: "",
  });
  for (const i of items)
    await addItem(
      viewerOf(consignor),
      lot.id,
      itemInput({ designation: i.designation, quantity: i.quantity, condition: i.condition ?? "used" }),
    );
  await submitLot(viewerOf(consignor), lot.id);
  await decideLot(viewerOf(admin), lot.id, {
    action: "approve",
    comment: "",
    estimateLowCents: 4_000,
    estimateHighCents: 9_000,
    reserveCents,
    reserveAgreed: true,
  });
  return lot.id;
}

describe("search by type and equivalents", () => {
  let ecc88: string, sixdj8: string, sixbq5: string, mixed: string;
  beforeAll(async () => {
    ecc88 = await listed("Four ECC88 in sleeves", [{ designation: "ECC88", quantity: 4 }]);
    sixdj8 = await listed("Pair of 6DJ8", [{ designation: "6DJ8", quantity: 2 }]);
    sixbq5 = await listed("Output valves 6BQ5", [{ designation: "6BQ5", quantity: 4, condition: "new-old-stock" }]);
    mixed = await listed("Bench drawer", [
      { designation: "ECC83", quantity: 3 },
      { designation: "12AX7", quantity: 1 },
      { designation: "6V6GT", quantity: 2 },
    ]);
  }, 60_000);

  it("6922 finds both the ECC88 lot and the 6DJ8 lot, naming the item and how it relates", async () => {
    const r = await search({ q: "6922" });
    const byId = new Map(r.lots.map((l) => [l.id, l]));
    expect(byId.has(ecc88)).toBe(true);
    expect(byId.has(sixdj8)).toBe(true);
    expect(byId.get(ecc88)!.matches).toEqual([{ designation: "ECC88", relation: "near", quantity: 4 }]);
    expect(byId.get(sixdj8)!.matches).toEqual([{ designation: "6DJ8", relation: "near", quantity: 2 }]);
    expect(byId.has(sixbq5)).toBe(false);
  });

  it("EL84 finds the 6BQ5 lot as the same type under another name; typed forms normalise as at intake", async () => {
    for (const q of ["EL84", "el 84", "el-84"]) {
      const hit = (await search({ q })).lots.find((l) => l.id === sixbq5);
      expect(hit?.matches, q).toEqual([{ designation: "6BQ5", relation: "exact", quantity: 4 }]);
    }
  });

  it("ranks the searched type before its equivalents, and lists a lot's items best relation first", async () => {
    const r = await search({ q: "ecc 83" });
    const drawer = r.lots.find((l) => l.id === mixed)!;
    expect(drawer.matches.map((m) => [m.designation, m.relation])).toEqual([
      ["ECC83", "same"],
      ["12AX7", "exact"],
    ]);
    expect(r.term).toEqual({ designation: "ECC83", typed: "ecc 83" });
  });

  it("free text searches titles and provenance; filters narrow, and facets count the result", async () => {
    const words = await search({ q: `drawer ${RUN}` });
    expect(words.lots.map((l) => l.id)).toEqual([mixed]);
    const nos = await search({ q: "EL84", condition: ["new-old-stock"] });
    expect(nos.lots.map((l) => l.id)).toContain(sixbq5);
    expect((await search({ q: "EL84", condition: ["used"] })).lots.map((l) => l.id)).not.toContain(sixbq5);
    expect(nos.facets.condition["new-old-stock"]).toBeGreaterThanOrEqual(1);
    expect((await search({ q: "6922", status: ["sold"] })).lots.map((l) => l.id)).not.toContain(ecc88);
  });

  it("never shows a reserve, a maximum bid or the consignor to the public, signed in or not", async () => {
    const { GET } = await import("../../app/api/catalogue/route");
    const res = await GET(request(`http://localhost:3000/api/catalogue?q=6922`), noParams);
    expect(res.status).toBe(200);
    const text = await res.text();
    expect(text).toContain(ecc88);
    expect(text).not.toMatch(/reserve|7777|77\.77|maxCents|consignor/i);
  });
});

describe("paging and bad input", () => {
  it("keyset paging stays stable while lots are inserted between pages", async () => {
    const word = `pagingword${RUN}`;
    const first = [];
    for (let i = 0; i < 5; i++) first.push(await listed(`${word} lot ${i}`, [{ designation: "6SN7GT", quantity: 1 }]));
    const seen: string[] = [];
    let page = await search({ q: word, limit: 2 });
    seen.push(...page.lots.map((l) => l.id));
    await listed(`${word} late one`, [{ designation: "6SN7GT", quantity: 1 }]); // newer than everything paged so far
    await listed(`${word} late two`, [{ designation: "6SN7GT", quantity: 1 }]);
    while (page.nextCursor) {
      page = await search({ q: word, limit: 2, cursor: page.nextCursor });
      seen.push(...page.lots.map((l) => l.id));
    }
    expect(new Set(seen).size).toBe(seen.length); // nothing twice
    expect([...seen].sort()).toEqual([...first].sort()); // nothing skipped; later lots start before the first page
  }, 60_000);

  it("pages by relevance one lot at a time without repeating or skipping, closest relation first", async () => {
    await listed("Relevance pager A", [{ designation: "12AX7", quantity: 2 }]);
    await listed("Relevance pager B", [{ designation: "ECC83", quantity: 2 }]);
    await listed("Relevance pager C", [{ designation: "7025", quantity: 1 }]);
    const whole = (await search({ q: "ECC83" })).lots;
    const paged: typeof whole = [];
    let page = await search({ q: "ECC83", limit: 1 });
    paged.push(...page.lots);
    while (page.nextCursor) {
      page = await search({ q: "ECC83", limit: 1, cursor: page.nextCursor });
      paged.push(...page.lots);
    }
    expect(paged.map((l) => l.id)).toEqual(whole.map((l) => l.id));
    const best = paged.map((l) =>
      ["same", "exact", "premium", "near", "caveat", "sibling-heater", "different-base"].indexOf(
        l.matches[0]!.relation,
      ),
    );
    expect(best).toEqual([...best].sort((a, b) => a - b));
    expect(paged[0]!.matches[0]!.relation).toBe("same");
    expect(paged.some((l) => l.matches[0]!.relation === "premium")).toBe(true); // 7025, the low-noise 12AX7
  }, 60_000);

  it("refuses an unknown filter, a malformed cursor, a 10 KB search and control characters with 400 in our error shape", async () => {
    const { GET } = await import("../../app/api/catalogue/route");
    const cases = [
      "colour=red",
      "cursor=not-a-cursor!",
      `cursor=${Buffer.from(JSON.stringify({ s: "closing", k: [1], id: "00000000-0000-4000-8000-000000000000" })).toString("base64url")}`,
      `q=${"a".repeat(10_000)}`,
      "q=12AX7%00",
      "q=%E2%80%AEevil",
      "limit=500",
    ];
    for (const qs of cases) {
      const res = await GET(request(`http://localhost:3000/api/catalogue?${qs}`), noParams);
      expect(res.status, qs.slice(0, 40)).toBe(400);
      const body = (await res.json()) as { error: { code: string; message: string } };
      expect(["bad_request", "validation_failed"]).toContain(body.error.code);
    }
  });
});

describe("want lists", () => {
  it("match a newly listed lot exactly once, even when two instances run the match at once", async () => {
    const dealer = await makeUser(["dealer"]);
    const list = await createWantList(viewerOf(dealer), {
      name: "Small-signal twins",
      criteria: {
        designation: "6922",
        closeness: "near",
        minQuantity: 2,
        conditions: [],
        makerBases: [],
        noVacuumLoss: true,
        maxEstimateCents: 50_000,
      },
    });
    const tooFew = await makeUser(["dealer"]);
    await createWantList(viewerOf(tooFew), {
      name: "Quads only",
      criteria: {
        designation: "6922",
        closeness: "near",
        minQuantity: 8,
        conditions: [],
        makerBases: [],
        noVacuumLoss: false,
        maxEstimateCents: null,
      },
    });
    const lotId = await listed("Six ECC88 for matching", [{ designation: "ECC88", quantity: 6 }]); // approval itself asks for a match
    // Two more runs at once: this process and a second process (another app instance on the same database).
    const other = new Promise<number>((resolve, reject) => {
      const child = spawn(
        process.execPath,
        [
          "--import",
          "tsx",
          "-e",
          `import("./lib/services/want-list-matching").then((m) => (m.matchLotToWantLists ?? m.default.matchLotToWantLists)(${JSON.stringify(lotId)})).then(() => process.exit(0), (e) => { console.error(e); process.exit(1); })`,
        ],
        { env: process.env, stdio: "inherit" },
      );
      child.on("exit", (code) => (code === 0 ? resolve(0) : reject(new Error(`second instance exited ${code}`))));
    });
    await Promise.all([matchLotToWantLists(lotId), other]);
    await vi.waitFor(
      async () => {
        const hits = await db().query<{ want_list_id: string }>(
          `SELECT want_list_id FROM want_list_hits WHERE lot_id = :lotId`,
          { replacements: { lotId }, type: QueryTypes.SELECT },
        );
        expect(hits.map((h) => h.want_list_id)).toEqual([list.id]);
      },
      { timeout: 8_000, interval: 100 },
    );
    const notices = await db().query<{ text: string }>(`SELECT text FROM notices WHERE user_id = :u AND href = :href`, {
      replacements: { u: dealer.id, href: `/lots/${lotId}` },
      type: QueryTypes.SELECT,
    });
    expect(notices).toHaveLength(1);
    expect(notices[0]!.text).toMatch(/Small-signal twins/);
    const mail = await waitForSubject(dealer.email, /Want lists: 1 new lot/);
    expect(mail.text).toContain(`/lots/${lotId}`);
    expect(mail.text).toMatch(/\/want-lists\/unsubscribe\?u=/);
    const tooFewHits = await db().query(`SELECT 1 FROM want_list_hits WHERE dealer_id = :u`, {
      replacements: { u: tooFew.id },
      type: QueryTypes.SELECT,
    });
    expect(tooFewHits).toHaveLength(0);
  }, 60_000);

  it("the digest's stop link works without signing in and cannot be forged for someone else", async () => {
    const a = await makeUser(["dealer"]);
    const b = await makeUser(["dealer"]);
    const { POST } = await import("../../app/api/want-lists/unsubscribe/route");
    const forged = await POST(
      request("http://localhost:3000/api/want-lists/unsubscribe", { json: { u: b.id, t: unsubscribeToken(a.id) } }),
      noParams,
    );
    expect(forged.status).toBe(403);
    const altered = unsubscribeToken(b.id).replace(/^./, (c) => (c === "A" ? "B" : "A"));
    await expect(unsubscribeDigest(b.id, altered)).rejects.toBeInstanceOf(ApiError);
    const ok = await POST(
      request("http://localhost:3000/api/want-lists/unsubscribe", { json: { u: b.id, t: unsubscribeToken(b.id) } }),
      noParams,
    );
    expect(ok.status).toBe(200);
    const [row] = await db().query<{ digest_enabled: boolean }>(
      `SELECT digest_enabled FROM want_list_mail WHERE dealer_id = :u`,
      { replacements: { u: b.id }, type: QueryTypes.SELECT },
    );
    expect(row?.digest_enabled).toBe(false);
  });

  it("caps want lists per dealer and says so in words", async () => {
    const dealer = await makeUser(["dealer"]);
    const criteria = {
      designation: "12AX7",
      closeness: "exact" as const,
      minQuantity: 1,
      conditions: [],
      makerBases: [],
      noVacuumLoss: false,
      maxEstimateCents: null,
    };
    await db().query(
      `INSERT INTO want_lists (id, dealer_id, name, criteria, designations, paused, created_at, updated_at)
       SELECT gen_random_uuid(), :u, 'List ' || g, :c::jsonb, ARRAY['12AX7']::varchar[], false, now(), now() FROM generate_series(1, :n) g`,
      { replacements: { u: dealer.id, c: JSON.stringify(criteria), n: MAX_WANT_LISTS } },
    );
    const refused = await createWantList(viewerOf(dealer), { name: "One too many", criteria }).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(ApiError);
    expect((refused as ApiError).status).toBe(409);
    expect((refused as ApiError).message).toMatch(/100 want lists, the most one dealer may keep/);
  });
});
