// The house desk's counts move with the queues they stand for.
import { QueryTypes } from "sequelize";
import { describe, expect, it } from "vitest";
import { createLot, addItem } from "../../lib/services/lots";
import { submitLot } from "../../lib/services/lot-review";
import { houseDesk } from "../../lib/services/house-desk";
import { db } from "../../models";
import { invoicedLot, itemInput, makeUser, viewerOf } from "../support/factories";

describe("house desk", () => {
  it("counts a submitted lot as waiting for review and an unpaid invoice past its due date as overdue", async () => {
    const before = await houseDesk();
    const consignor = await makeUser(["consignor"]);
    const lot = await createLot(viewerOf(consignor), {
      title: "Desk count lot",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    });
    await addItem(viewerOf(consignor), lot.id, itemInput());
    await submitLot(viewerOf(consignor), lot.id);

    const f = await invoicedLot();
    // Due in 7 days [SUG house setting]; move it into the past to make it overdue.
    await db().query(`UPDATE invoices SET due_at = now() - interval '1 day' WHERE id = :id`, {
      replacements: { id: f.invoiceId },
      type: QueryTypes.UPDATE,
    });
    const after = await houseDesk(500);
    expect(after.review.count).toBe(before.review.count + 1);
    expect(after.overdue.count).toBe(before.overdue.count + 1);
    const row = after.overdue.oldest.find((o) => o.id === f.invoiceId);
    expect(row).toBeDefined();
    expect(after.overdue.totalCents - before.overdue.totalCents).toBe(row!.totalCents);
    // Its sale closed with its one lot sold: it is neither live nor upcoming.
    expect([...after.sales.live, ...after.sales.upcoming].some((s) => s.id === f.saleId)).toBe(false);
  }, 60_000);
});
