// House settings versions frozen per sale, the settings and address routes, zone shipping and destination tax.
// Check values: [SUG] our product rules; [CTP] proxy bidding; [ISO-3166] country codes; worked examples beside each.
import { QueryTypes } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { GET as getSettings, PUT as putSettings } from "../../app/api/house/settings/route";
import { GET as getAddress, PUT as putAddress } from "../../app/api/account/address/route";
import { invoiceAddresses } from "../../lib/services/addresses";
import { placeMaxBid } from "../../lib/services/bidding";
import { changeSettings, currentSettings } from "../../lib/services/house-settings";
import { closeSaleLot } from "../../lib/services/lot-closing";
import { createSale } from "../../lib/services/sales";
import { INITIAL_HOUSE_SETTINGS, type HouseSettings } from "../../lib/validation/house-settings";
import { up as addHouseDetails } from "../../migrations/20261203002300-house-details";
import { db } from "../../models";
import { approvedLot, makeUser, noParams, request, sessionCookie, viewerOf } from "../support/factories";

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

const one = async <T extends object>(sql: string, id: string) =>
  (await db().query<T>(sql, { replacements: { id }, type: QueryTypes.SELECT }))[0]!;

/** A one-lot sale, open now, closing well ahead (the test closes it by moving its time, never by waiting). */
async function scheduledSale(admin: Awaited<ReturnType<typeof makeUser>>) {
  const consignor = await makeUser(["consignor"]);
  const lot = await approvedLot(consignor, admin, 2_000);
  const sale = await createSale(viewerOf(admin), {
    title: "Settings test",
    startsAt: new Date(Date.now() - 60_000).toISOString(),
    firstCloseAt: new Date(Date.now() + 3_600_000).toISOString(),
    gapSeconds: 30,
    softCloseSeconds: 60,
    lots: [{ lotId: lot.id, openingCents: 1_000 }],
  });
  const sl = await one<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, sale.id);
  return { saleId: sale.id, saleLotId: sl.id, consignor };
}

/** Two dealers bid 30.00 and 25.00; the lot is closed and invoiced. */
async function bidAndClose(saleLotId: string, buyer = undefined as Awaited<ReturnType<typeof makeUser>> | undefined) {
  const winner = buyer ?? (await makeUser(["dealer"]));
  const under = await makeUser(["dealer"]);
  await placeMaxBid(viewerOf(winner), saleLotId, 3_000, `w-${saleLotId}`);
  await placeMaxBid(viewerOf(under), saleLotId, 2_500, `u-${saleLotId}`);
  await db().query(`UPDATE sale_lots SET closes_at = now() - interval '1 second' WHERE id = :id`, {
    replacements: { id: saleLotId },
  });
  expect(await closeSaleLot(saleLotId)).toBe("closed");
  return one<{
    id: string;
    hammer_cents: number;
    premium_bp: number;
    premium_cents: number;
    shipping_cents: number;
    shipping_zone: string;
    tax_bp: number;
    tax_cents: number;
    total_cents: number;
    settings_version: number;
    due_days: number;
  }>(
    `SELECT *, round(extract(epoch FROM due_at - created_at) / 86400)::int AS due_days FROM invoices WHERE sale_lot_id = :id`,
    saleLotId,
  );
}

// Leave the settings as version 1 had them for the test files that run after this one.
afterAll(async () => {
  const admin = await makeUser(["admin"]);
  const now = await currentSettings();
  if (JSON.stringify(now.settings) !== JSON.stringify(INITIAL_HOUSE_SETTINGS))
    await changeSettings(viewerOf(admin), { settings: INITIAL_HOUSE_SETTINGS, reason: "Back to version 1 figures" });
});

describe("GET/PUT /api/house/settings", () => {
  it("answers anonymous 401 and every other role 403 [SUG]", async () => {
    expect((await getSettings(request("/api/house/settings"), noParams)).status).toBe(401);
    for (const role of ["dealer", "consignor", "mediator"] as const) {
      const cookie = await sessionCookie(await makeUser([role]));
      const r = await getSettings(request("/api/house/settings", { headers: { cookie } }), noParams);
      expect(r.status).toBe(403);
      const put = await putSettings(
        request("/api/house/settings", {
          method: "PUT",
          json: { settings: INITIAL_HOUSE_SETTINGS, reason: "sneaky" },
          headers: { cookie },
        }),
        noParams,
      );
      expect(put.status).toBe(403);
    }
  });

  it("answers a negative premium and overlapping tiers with 400 and per-field messages [SUG]", async () => {
    const cookie = await sessionCookie(await makeUser(["admin"]));
    const settings = structuredClone(INITIAL_HOUSE_SETTINGS) as HouseSettings;
    settings.buyersPremiumBp = -500;
    settings.commissionTiers = [
      { upToCents: 50_000, rateBp: 2_000 },
      { upToCents: 50_000, rateBp: 1_500 }, // same ceiling: overlaps the tier before
      { upToCents: null, rateBp: 1_000 },
    ];
    const r = await putSettings(
      request("/api/house/settings", { method: "PUT", json: { settings, reason: "" }, headers: { cookie } }),
      noParams,
    );
    expect(r.status).toBe(400);
    const body = (await r.json()) as ErrorBody;
    expect(body.error.code).toBe("validation_failed");
    expect(body.error.fields).toMatchObject({
      "settings.buyersPremiumBp": "Buyer's premium cannot be negative",
      "settings.commissionTiers.1.upToCents": "Tiers must ascend without overlapping the tier before",
      reason: "Say why the settings change (at least 5 characters)",
    });
  });
});

describe("the house's own details in the settings", () => {
  it("gives a version stored without them the first details, and leaves a version that has them alone [SUG]", async () => {
    // Two versions far above any the run reaches, taken out again at the end so they never become current.
    const { house: _house, ...older } = structuredClone(INITIAL_HOUSE_SETTINGS);
    const newer = structuredClone(INITIAL_HOUSE_SETTINGS);
    newer.house.address.city = "Emberton";
    const put = (version: number, settings: unknown) =>
      db().query(
        `INSERT INTO house_settings_versions (version, settings, reason) VALUES (:v, CAST(:s AS jsonb), 'test')`,
        {
          replacements: { v: version, s: JSON.stringify(settings) },
        },
      );
    await put(900_001, older);
    await put(900_002, newer);
    try {
      await addHouseDetails({ context: db().getQueryInterface() });
      const rows = await db().query<{ version: number; house: { tradingName: string; address: { city: string } } }>(
        `SELECT version, settings->'house' AS house FROM house_settings_versions WHERE version > 900000 ORDER BY version`,
        { type: QueryTypes.SELECT },
      );
      expect(rows.map((r) => [r.house.tradingName, r.house.address.city])).toEqual([
        ["Getterline Exchange", "Glowmere"], // [SUG] the invented first details
        ["Getterline Exchange", "Emberton"],
      ]);
    } finally {
      await db().query(`DELETE FROM house_settings_versions WHERE version > 900000`);
    }
  });

  it("answers a bad country and an over-long trading name with 400 and per-field messages [ISO-3166]", async () => {
    const cookie = await sessionCookie(await makeUser(["admin"]));
    const settings = structuredClone(INITIAL_HOUSE_SETTINGS) as HouseSettings;
    settings.house.address.country = "ZZ"; // unassigned [ISO-3166]
    settings.house.tradingName = "G".repeat(101); // [SUG] 100 at most
    const r = await putSettings(
      request("/api/house/settings", {
        method: "PUT",
        json: { settings, reason: "Move the house" },
        headers: { cookie },
      }),
      noParams,
    );
    expect(r.status).toBe(400);
    expect(((await r.json()) as ErrorBody).error.fields).toEqual({
      "settings.house.address.country": "Choose a country from the list",
      "settings.house.tradingName": "Trading name: at most 100 characters",
    });
  });
});

describe("a settings change applies to sales scheduled after it, never to one already scheduled or live", () => {
  it("keeps the old premium, ladder and payment terms on a live sale and uses the new ones on a later sale", async () => {
    const admin = await makeUser(["admin"]);
    const cookie = await sessionCookie(admin);
    const live = await scheduledSale(admin); // scheduled (and open for bids) before the change
    const before = await currentSettings();

    const changed = structuredClone(before.settings) as HouseSettings;
    changed.buyersPremiumBp = 1_500; // 15 %
    changed.incrementLadder = [{ fromCents: 0, incrementCents: 500 }]; // $5 at every price
    changed.payment.dueDays = 10;
    const put = await putSettings(
      request("/api/house/settings", {
        method: "PUT",
        json: { settings: changed, reason: "Premium to 15 % for the spring sales", baseVersion: before.version },
        headers: { cookie },
      }),
      noParams,
    );
    expect(put.status).toBe(200);
    const saved = (await put.json()) as { version: { version: number; changedBy: string; changes: string[] } };
    expect(saved.version.version).toBe(before.version + 1);
    expect(saved.version.changedBy).toBe(admin.displayName);
    expect(saved.version.changes).toContain("Buyer's premium (bp): 1000 → 1500");
    // A stale form (old base version) is refused rather than silently overwriting.
    const stale = await putSettings(
      request("/api/house/settings", {
        method: "PUT",
        json: { settings: INITIAL_HOUSE_SETTINGS, reason: "Stale form", baseVersion: before.version },
        headers: { cookie },
      }),
      noParams,
    );
    expect(stale.status).toBe(409);
    const history = (await (
      await getSettings(request("/api/house/settings", { headers: { cookie } }), noParams)
    ).json()) as {
      version: number;
      history: { version: number; reason: string }[];
    };
    expect(history.version).toBe(before.version + 1);
    expect(history.history[0]!.reason).toBe("Premium to 15 % for the spring sales");

    const later = await scheduledSale(admin);
    const versions = await db().query<{ id: string; settings_version: number }>(
      `SELECT id, settings_version FROM sales WHERE id IN (:a, :b)`,
      { replacements: { a: live.saleId, b: later.saleId }, type: QueryTypes.SELECT },
    );
    expect(Object.fromEntries(versions.map((v) => [v.id, v.settings_version]))).toEqual({
      [live.saleId]: before.version,
      [later.saleId]: before.version + 1,
    });

    // Bids on the live sale arrive after the change: its own ladder still applies.
    const old = await bidAndClose(live.saleLotId);
    // [CTP] proxy: 25.00 + one increment; old 1-2-5 ladder gives $2 at $25 → $27.00; premium 10 % [SUG] = $2.70.
    expect(old).toMatchObject({ hammer_cents: 2_700, premium_bp: 1_000, premium_cents: 270, due_days: 7 });
    expect(old.settings_version).toBe(before.version);
    const fresh = await bidAndClose(later.saleLotId);
    // New flat $5 ladder: 25.00 + 5.00 = 30.00 (the winner's ceiling); premium 15 % = $4.50; due in 10 days.
    expect(fresh).toMatchObject({ hammer_cents: 3_000, premium_bp: 1_500, premium_cents: 450, due_days: 10 });
    expect(fresh.settings_version).toBe(before.version + 1);
  });
});

describe("addresses, zone shipping and destination tax", () => {
  it("validates the address route (403 for a mediator, 400 per field) and keeps one address per person", async () => {
    const mediator = await sessionCookie(await makeUser(["mediator"]));
    expect(
      (await getAddress(request("/api/account/address", { headers: { cookie: mediator } }), noParams)).status,
    ).toBe(403);
    const cookie = await sessionCookie(await makeUser(["dealer"]));
    const bad = await putAddress(
      request("/api/account/address", {
        method: "PUT",
        json: { name: "A", line1: "", line2: "", city: "X", region: "", postalCode: "<>", country: "ZZ" },
        headers: { cookie },
      }),
      noParams,
    );
    expect(bad.status).toBe(400);
    const fields = ((await bad.json()) as ErrorBody).error.fields!;
    expect(Object.keys(fields).sort()).toEqual(["country", "line1", "name", "postalCode"]); // [ISO-3166] ZZ unassigned
  });

  it("prices shipping by zone from the consignor to the buyer and taxes by the buyer's region [SUG]", async () => {
    const admin = await makeUser(["admin"]);
    const now = await currentSettings();
    const s = structuredClone(now.settings) as HouseSettings;
    s.buyersPremiumBp = 1_000;
    s.incrementLadder = INITIAL_HOUSE_SETTINGS.incrementLadder;
    s.shipping.groups = [{ name: "Northern neighbours", zone: "near", countries: ["US", "CA", "MX"] }];
    s.tax.rules = [
      { country: "CA", region: "Ontario", rateBp: 1_300, taxHammer: true, taxPremium: true, taxShipping: false },
    ];
    await changeSettings(viewerOf(admin), { settings: s, reason: "Zones and Ontario tax for the test" });

    const sale = await scheduledSale(admin);
    const buyer = await makeUser(["dealer"]);
    const addr = async (u: Awaited<ReturnType<typeof makeUser>>, a: Record<string, string>) =>
      putAddress(
        request("/api/account/address", { method: "PUT", json: a, headers: { cookie: await sessionCookie(u) } }),
        noParams,
      );
    const home = {
      name: "Wren Socket",
      line1: "12 Plate St",
      line2: "",
      city: "Dayton",
      region: "Ohio",
      postalCode: "45402",
      country: "US",
    };
    const away = {
      name: "Ada Bench",
      line1: "4 Filament Row",
      line2: "Unit 2",
      city: "Kingston",
      region: "Ontario",
      postalCode: "K7L 3N6",
      country: "CA",
    };
    expect((await addr(sale.consignor, home)).status).toBe(200);
    expect((await addr(buyer, away)).status).toBe(200);
    expect((await addr(buyer, away)).status).toBe(200); // the same address twice: still one row
    expect(await one<{ n: string }>(`SELECT count(*) AS n FROM addresses WHERE user_id = :id`, buyer.id)).toEqual({
      n: "1",
    });

    const inv = await bidAndClose(sale.saleLotId, buyer);
    // Hammer $27.00, premium 10 % $2.70; 1 tube × 60 g → 500 g band, zone near $19 + $3 handling = $22.00 [SUG table];
    // Ontario 13 % on hammer + premium = 13 % × $29.70 = $3.861 → $3.86 (half-up, once per invoice).
    expect(inv).toMatchObject({
      hammer_cents: 2_700,
      premium_cents: 270,
      shipping_zone: "near",
      shipping_cents: 2_200,
    });
    expect(inv).toMatchObject({ tax_bp: 1_300, tax_cents: 386, total_cents: 2_700 + 270 + 2_200 + 386 });

    // The invoice keeps the address it was issued with, even after the buyer moves.
    await addr(buyer, { ...away, line1: "9 Getter Lane" });
    expect(await invoiceAddresses(inv.id)).toEqual({
      buyer: { name: "Ada Bench", lines: ["4 Filament Row", "Unit 2", "Kingston, Ontario, K7L 3N6", "Canada"] },
      origin: { name: "Wren Socket", lines: ["12 Plate St", "Dayton, Ohio, 45402", "United States of America"] },
    });
  });
});
