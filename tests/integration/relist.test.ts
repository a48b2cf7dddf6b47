import { QueryTypes } from "sequelize";
import { describe, expect, it, vi } from "vitest";
import { ApiError } from "../../lib/api/errors";
import { consignorDesk } from "../../lib/services/consignor-desk";
import { closeSaleLot } from "../../lib/services/lot-closing";
import { askToRelist } from "../../lib/services/relist";
import { createSale, getSale } from "../../lib/services/sales";
import { db } from "../../models";
import { approvedLot, makeUser, viewerOf } from "../support/factories";

// [SUG] Our rule: a lot that closed without a sale may be offered again in a later sale; one open or sold at a time.
describe("offering an unsold lot again", () => {
  it("the consignor asks once, the house is told once, and the lot goes into a later sale", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lot = await approvedLot(consignor, admin, 2_000);
    const first = await createSale(viewerOf(admin), {
      title: "First try",
      startsAt: new Date(Date.now() - 60_000).toISOString(),
      firstCloseAt: new Date(Date.now() + 1_500).toISOString(),
      gapSeconds: 30,
      softCloseSeconds: 30,
      lots: [{ lotId: lot.id, openingCents: 1_000 }],
    });
    const saleLotId = (await getSale(first.id)).lots[0]!.saleLotId;

    // While it is open it can be neither offered again nor asked about.
    await expect(
      createSale(viewerOf(admin), {
        title: "Too soon",
        startsAt: new Date().toISOString(),
        firstCloseAt: new Date(Date.now() + 600_000).toISOString(),
        gapSeconds: 30,
        softCloseSeconds: 30,
        lots: [{ lotId: lot.id, openingCents: 1_000 }],
      }),
    ).rejects.toBeInstanceOf(ApiError);
    await expect(askToRelist(viewerOf(consignor), lot.id)).rejects.toMatchObject({ code: "conflict" });

    await vi.waitFor(async () => expect(await closeSaleLot(saleLotId)).toMatch(/closed|already-closed/), {
      timeout: 8_000,
      interval: 250,
    });
    expect((await consignorDesk(viewerOf(consignor))).lots.find((l) => l.id === lot.id)?.stage).toBe("unsold");

    // Asked twice (a double click): the house account gets one notice.
    expect((await askToRelist(viewerOf(consignor), lot.id)).notified).toBeGreaterThan(0);
    expect((await askToRelist(viewerOf(consignor), lot.id)).notified).toBe(0);
    const notices = await db().query<{ n: string }>(
      `SELECT COUNT(*) AS n FROM notices WHERE user_id = :u AND href = '/house/sales/new'`,
      { replacements: { u: admin.id }, type: QueryTypes.SELECT },
    );
    expect(Number(notices[0]!.n)).toBe(1);
    // Nobody else may ask about it.
    await expect(askToRelist(viewerOf(await makeUser(["consignor"])), lot.id)).rejects.toMatchObject({
      code: "not_found",
    });

    // The house offers it again; the desk follows the new sale.
    const again = await createSale(viewerOf(admin), {
      title: "Second try",
      startsAt: new Date(Date.now() - 60_000).toISOString(),
      firstCloseAt: new Date(Date.now() + 600_000).toISOString(),
      gapSeconds: 30,
      softCloseSeconds: 30,
      lots: [{ lotId: lot.id, openingCents: 1_000 }],
    });
    const row = (await consignorDesk(viewerOf(consignor))).lots.filter((l) => l.id === lot.id);
    expect(row).toHaveLength(1);
    expect(row[0]).toMatchObject({ stage: "in-sale", sale: { id: again.id } });
  });
});
