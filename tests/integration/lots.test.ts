import { describe, expect, it } from "vitest";
import { ApiError } from "../../lib/api/errors";
import { decideLot, amendLot, submitLot } from "../../lib/services/lot-review";
import { addItem, createLot, getLot, listLots, updateItem } from "../../lib/services/lots";
import { ReviewDecisionSchema } from "../../lib/validation/lots";
import { itemInput, makeUser, viewerOf, waitForMail } from "../support/factories";

const code = async (p: Promise<unknown>) => {
  try {
    await p;
    return "ok";
  } catch (e) {
    return e instanceof ApiError ? e.code : String(e);
  }
};
const details = {
  title: "Attic box of mixed receiving tubes",
  provenance: "From the attic",
  shippingOrigin: "Harlan County",
  testerKind: "mutual-conductance" as const,
  testerNotes: "",
};

describe("consignment intake: access rules and the review trail", () => {
  it("walks draft → review → changes → review → approved, and keeps everyone in their lane", async () => {
    const consignorUser = await makeUser(["consignor"]);
    const consignor = viewerOf(consignorUser);
    const other = viewerOf(await makeUser(["consignor"]));
    const dealer = viewerOf(await makeUser(["dealer"]));
    const admin = viewerOf(await makeUser(["admin"]));

    const lot = await createLot(consignor, details);
    const known = await addItem(consignor, lot.id, itemInput({ designation: "ecc 83", quantity: 4 }));
    expect(known).toMatchObject({ designation: "ECC83", designationKnown: true });
    // 6ZZ99 is not a designation (no US type has 99 elements) [MEM]: flagged for review, not refused.
    const odd = await addItem(consignor, lot.id, itemInput({ designation: "6ZZ99" }));
    expect(odd.designationKnown).toBe(false);

    // Nobody else sees or edits a draft.
    expect(await code(getLot(dealer, lot.id))).toBe("not_found");
    expect(await code(getLot(other, lot.id))).toBe("not_found");
    expect(await code(addItem(other, lot.id, itemInput()))).toBe("not_found");

    await submitLot(consignor, lot.id);
    expect(await code(addItem(consignor, lot.id, itemInput()))).toBe("conflict"); // in review: locked for the consignor
    expect((await listLots(admin, "review")).map((l) => l.id)).toContain(lot.id);

    await decideLot(admin, lot.id, { action: "request-changes", comment: "Please add the date codes you can read." });
    const mail = await waitForMail(consignorUser.email);
    expect(mail.text).toContain("Please add the date codes");

    await updateItem(consignor, lot.id, known.id, itemInput({ designation: "ECC83", quantity: 4, dateCode: "5943" }));
    await submitLot(consignor, lot.id);
    // The shared schema refuses a high estimate below the low one, and a reserve above the low estimate [CTP: reserve ≤ low estimate].
    expect(
      ReviewDecisionSchema.safeParse({
        action: "approve",
        comment: "",
        estimateLowCents: 20_000,
        estimateHighCents: 10_000,
        reserveCents: 5_000,
        reserveAgreed: true,
      }).success,
    ).toBe(false);
    expect(
      ReviewDecisionSchema.safeParse({
        action: "approve",
        comment: "",
        estimateLowCents: 20_000,
        estimateHighCents: 30_000,
        reserveCents: 25_000,
        reserveAgreed: true,
      }).success,
    ).toBe(false);
    expect(
      ReviewDecisionSchema.safeParse({
        action: "approve",
        comment: "",
        estimateLowCents: 20_000,
        estimateHighCents: 30_000,
        reserveCents: 15_000,
        reserveAgreed: false,
      }).success,
    ).toBe(false);
    const approved = await decideLot(admin, lot.id, {
      action: "approve",
      comment: "",
      estimateLowCents: 20_000,
      estimateHighCents: 35_000,
      reserveCents: 15_000,
      reserveAgreed: true,
    });
    expect(approved.state).toBe("approved");
    // Same decision again: nothing changes, no error.
    expect(
      (
        await decideLot(admin, lot.id, {
          action: "approve",
          comment: "",
          estimateLowCents: 20_000,
          estimateHighCents: 35_000,
          reserveCents: 15_000,
          reserveAgreed: true,
        })
      ).state,
    ).toBe("approved");

    // Approved: locked for the consignor, visible to dealers without the reserve.
    expect(await code(updateItem(consignor, lot.id, known.id, itemInput()))).toBe("conflict");
    const seen = await getLot(dealer, lot.id);
    expect(seen.lot.reserveCents).toBeUndefined();
    expect(seen.lot.estimateLowCents).toBe(20_000);
    expect((await getLot(consignor, lot.id)).lot.reserveCents).toBe(15_000);

    // A correction after approval is a dated amendment on the trail.
    await amendLot(admin, lot.id, {
      itemId: known.id,
      description: "One tube found with a white getter on re-inspection",
      vacuumLoss: true,
    });
    const after = await getLot(dealer, lot.id);
    const amended = after.events.find((e) => e.kind === "amended")!;
    expect(amended.comment).toMatch(/white getter/);
    expect(amended.details).toMatchObject({ before: { vacuumLoss: false }, after: { vacuumLoss: true } });
    expect(after.items.find((i) => i.id === known.id)!.vacuumLoss).toBe(true);
    expect(after.events.map((e) => e.kind)).toEqual([
      "created",
      "submitted",
      "changes-requested",
      "submitted",
      "approved",
      "amended",
    ]);
  });

  it("refuses to submit an empty lot", async () => {
    const c = viewerOf(await makeUser(["consignor"]));
    const lot = await createLot(c, details);
    expect(await code(submitLot(c, lot.id))).toBe("conflict");
  });
});
