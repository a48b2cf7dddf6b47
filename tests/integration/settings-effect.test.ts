// House settings that take effect on claims: the receipt-confirmation days and the tester tolerance follow each
// claim's sale's frozen version; the extra-review threshold follows the version in force now.
// Check values: [SUG] our product rules (versions frozen per sale, DEVELOPERS.md); [CTP] testers differ by ±10–15 %.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { changeSettings, currentSettings } from "../../lib/services/house-settings";
import { decide } from "../../lib/services/disputes/decide";
import { openDispute } from "../../lib/services/disputes/open";
import { postMessage } from "../../lib/services/disputes/conversation";
import { recordReturn } from "../../lib/services/disputes/returns";
import { disputeSweep } from "../../lib/services/disputes/sweep";
import { takeCase, workspace } from "../../lib/services/disputes/mediation";
import { findDispute } from "../../lib/services/disputes/tables/disputes";
import { addItem, createLot } from "../../lib/services/lots";
import { submitLot } from "../../lib/services/lot-review";
import type { HouseSettings } from "../../lib/validation/house-settings";
import { db, Lot, type User } from "../../models";
import { startTestS3, type TestS3 } from "../setup/s3";
import { startTestStripe, type TestStripe } from "../setup/stripe";
import { itemInput, makeUser, viewerOf } from "../support/factories";
import { claim, deliveredLot, one } from "../support/claims";

let fake: TestStripe;
let s3: TestS3;
let admin: User;
let before: HouseSettings;
beforeAll(async () => {
  fake = await startTestStripe();
  s3 = await startTestS3();
  admin = await makeUser(["admin"]);
  before = (await currentSettings()).settings;
});
afterAll(async () => {
  // Leave the figures as they were for the files that run after this one.
  const now = (await currentSettings()).settings;
  if (JSON.stringify(now) !== JSON.stringify(before))
    await changeSettings(viewerOf(admin), { settings: before, reason: "Back to the figures before this test" });
  await fake.stop();
  await s3.stop();
});

/** A new current version with some claim figures changed. */
async function setClaims(change: Partial<HouseSettings["claims"]>) {
  const { settings } = await currentSettings();
  const next = { ...settings, claims: { ...settings.claims, ...change } };
  return (await changeSettings(viewerOf(admin), { settings: next, reason: `Claims test: ${JSON.stringify(change)}` }))
    .version;
}

/** A delivered lot under the current version, claimed (misattribution), decided refund-on-return and shipped back. */
async function returnShipped(seller: User | undefined, tracking: string) {
  const f = await deliveredLot(seller);
  const { id } = await openDispute(viewerOf(f.buyer), f.invoiceId, claim(f.items[0]!, { remedy: "return-whole-lot" }));
  await postMessage(viewerOf(f.consignor), id, { body: "Send them back, then.", stance: "accepts" });
  const m = viewerOf(await makeUser(["mediator"]));
  await takeCase(m, id);
  await decide(m, id, { outcome: "refund-on-return", reasons: "The consignor accepts; the whole lot goes back." });
  await recordReturn(viewerOf(f.buyer), id, { carrier: "Demo Parcel Co.", tracking });
  return { ...f, id, mediator: m };
}

const shippedDaysAgo = (id: string, days: number) =>
  db().query(`UPDATE disputes SET return_shipped_at = now() - make_interval(days => :days) WHERE id = :id`, {
    replacements: { id, days },
  });

describe("claim settings follow the claim's sale", () => {
  it("the sweep refunds an unconfirmed return after its own sale's receipt days; the weighing uses its sale's tolerance", async () => {
    const vLong = await setClaims({ receiptConfirmDays: 20, testerTolerancePct: 15 });
    const a = await returnShipped(undefined, "RT 500001");
    const vShort = await setClaims({ receiptConfirmDays: 3, testerTolerancePct: 10 });
    const b = await returnShipped(undefined, "RT 500002");
    const saleVersion = async (saleId: string) =>
      (await one<{ v: number }>(`SELECT settings_version AS v FROM sales WHERE id = :id`, { id: saleId })).v;
    expect(await saleVersion(a.saleId)).toBe(vLong);
    expect(await saleVersion(b.saleId)).toBe(vShort);

    // Both shipped back 5 days ago: past 3 days (sale B), within 20 (sale A) [SUG].
    await shippedDaysAgo(a.id, 5);
    await shippedDaysAgo(b.id, 5);
    await disputeSweep();
    expect((await findDispute(b.id))!.state).toBe("closed");
    expect((await findDispute(a.id))!.state).toBe("awaiting-return");
    expect((await one<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, { id: b.invoiceId })).state).toBe(
      "refunded",
    );
    // A newer version with a shorter wait does not reach sale A: it still waits its own 20 days.
    await setClaims({ receiptConfirmDays: 1 });
    await disputeSweep();
    expect((await findDispute(a.id))!.state).toBe("awaiting-return");
    await shippedDaysAgo(a.id, 21);
    await disputeSweep();
    expect((await findDispute(a.id))!.state).toBe("closed");

    // The weighing of each claim uses its own sale's tester tolerance, whatever the current version says [CTP].
    expect((await workspace(a.mediator, a.id)).testerTolerancePct).toBe(15);
    expect((await workspace(b.mediator, b.id)).testerTolerancePct).toBe(10);
  }, 120_000);

  it("extra review follows the threshold in force now [SUG]", async () => {
    const seller = await makeUser(["consignor"]);
    await returnShipped(seller, "RT 600001"); // one upheld misattribution claim against this consignor
    const submitNew = async (title: string) => {
      const lot = await createLot(viewerOf(seller), {
        title,
        provenance: "",
        shippingOrigin: "",
        testerKind: "untested",
        testerNotes: "",
      });
      await addItem(viewerOf(seller), lot.id, itemInput());
      await submitLot(viewerOf(seller), lot.id);
      return (await Lot.findByPk(lot.id))!.extraReview;
    };
    await setClaims({ extraReviewAfterUpheld: 3 });
    expect(await submitNew("One upheld claim, threshold three")).toBe(false);
    await setClaims({ extraReviewAfterUpheld: 1 });
    expect(await submitNew("One upheld claim, threshold one")).toBe(true);
  }, 120_000);
});
