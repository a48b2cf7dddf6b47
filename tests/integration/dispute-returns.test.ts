import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { invoiceColumns } from "../../lib/services/invoice-rows";
import { ApiError } from "../../lib/api/errors";
import { confirmReturnReceived, recordReturn, refundReturnedLot } from "../../lib/services/disputes/returns";
import { findDispute } from "../../lib/services/disputes/tables/disputes";
import { ReturnShipmentSchema } from "../../lib/validation/disputes";
import { decide } from "../../lib/services/disputes/decide";
import { getCase } from "../../lib/services/disputes/cases";
import { openDispute } from "../../lib/services/disputes/open";
import { postMessage } from "../../lib/services/disputes/conversation";
import { takeCase } from "../../lib/services/disputes/mediation";
import { balances, trialBalance } from "../../lib/services/ledger";
import { createLot, addItem } from "../../lib/services/lots";
import { submitLot } from "../../lib/services/lot-review";
import { reconcile } from "../../lib/services/reconcile";
import { statementFor } from "../../lib/services/statements";
import { consignorRecord } from "../../lib/services/track-record";
import { db, Lot } from "../../models";
import { startTestS3, type TestS3 } from "../setup/s3";
import { startTestStripe, type TestStripe } from "../setup/stripe";
import { itemInput, makeUser, viewerOf } from "../support/factories";
import { disputeSweep } from "../../lib/services/disputes/sweep";
import { stripe } from "../../lib/stripe/client";
import { claim, deliveredLot, one, refused } from "../support/claims";

let fake: TestStripe;
let s3: TestS3;
beforeAll(async () => {
  fake = await startTestStripe();
  s3 = await startTestS3();
});
afterAll(async () => {
  await fake.stop();
  await s3.stop();
});

describe("claims settled by a return", () => {
  it("a refund on return pays the buyer the hammer, premium, shipping and tax once the consignor confirms receipt; two upheld misattributions send the next lot to extra review", async () => {
    const seller = await makeUser(["consignor"]);
    for (let round = 0; round < 2; round++) {
      const f = await deliveredLot(seller);
      const { id } = await openDispute(
        viewerOf(f.buyer),
        f.invoiceId,
        claim(f.items[0]!, { remedy: "return-whole-lot" }),
      );
      await postMessage(viewerOf(f.consignor), id, { body: "Send them back, then.", stance: "accepts" });
      const m = viewerOf(await makeUser(["mediator"]));
      await takeCase(m, id);
      await decide(m, id, {
        outcome: "refund-on-return",
        reasons: "The consignor accepts the claim; the whole lot goes back for a refund.",
      });
      expect((await getCase(viewerOf(f.buyer), id)).state).toBe("awaiting-return");
      expect((await refused(confirmReturnReceived(viewerOf(f.consignor), id))).status).toBe(409); // nothing shipped yet
      await recordReturn(viewerOf(f.buyer), id, { carrier: "Demo Parcel Co.", tracking: "RT 000111" });
      // Two clicks at once: one pays the refund; the other answers 409 with the case as it stands, never a 500.
      const clicks = await Promise.allSettled([
        confirmReturnReceived(viewerOf(f.consignor), id),
        confirmReturnReceived(viewerOf(f.consignor), id),
      ]);
      expect(clicks.filter((c) => c.status === "fulfilled")).toHaveLength(1);
      const second = (clicks.find((c) => c.status === "rejected") as PromiseRejectedResult).reason as ApiError;
      expect(second).toBeInstanceOf(ApiError);
      expect(second.status).toBe(409);
      expect(second.details?.returnReceivedAt).toEqual(expect.any(String));
      expect((await refused(confirmReturnReceived(viewerOf(f.consignor), id))).details?.state).toBe("closed");
      const inv = await one<{
        state: string;
        payment_intent_id: string;
        hammer_cents: number;
        premium_cents: number;
        shipping_cents: number;
        tax_cents: number;
      }>(
        `SELECT state, payment_intent_id, hammer_cents, premium_cents, shipping_cents, tax_cents FROM invoices WHERE id = :id`,
        { id: f.invoiceId },
      );
      expect(inv.state).toBe("refunded");
      const refunds = await stripe().refunds.list({ payment_intent: inv.payment_intent_id });
      // The whole lot came back: its shipping and tax come back with it [SUG].
      expect(refunds.data.map((r) => r.amount)).toEqual([
        inv.hammer_cents + inv.premium_cents + inv.shipping_cents + inv.tax_cents,
      ]);
      expect((await statementFor(viewerOf(f.consignor), f.saleId)).totals.payoutCents).toBe(0);
      const led = await balances(f.invoiceId);
      expect(led["escrow-held"]).toBe(0);
      expect(led["house-revenue-commission"]).toBe(0);
    }
    expect(await trialBalance()).toBe(0);
    // House setting: two upheld misattribution claims [SUG] → the next lot is reviewed more closely.
    const lot = await createLot(viewerOf(seller), {
      title: "After two upheld claims",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    });
    await addItem(viewerOf(seller), lot.id, itemInput());
    await submitLot(viewerOf(seller), lot.id);
    expect((await Lot.findByPk(lot.id))!.extraReview).toBe(true);
  }, 120_000);

  it("deadlines: past the answer deadline the mediator decides on the buyer's evidence; a dismissal releases escrow; an unconfirmed return is refunded, an unsent one released", async () => {
    // No answer by the deadline: decide on the buyer's evidence alone (dismissed here).
    const a = await deliveredLot();
    const c1 = await openDispute(viewerOf(a.buyer), a.invoiceId, claim(a.items[0]!));
    const m = viewerOf(await makeUser(["mediator"]));
    await takeCase(m, c1.id);
    await db().query(`UPDATE disputes SET answer_due_at = now() - interval '1 second' WHERE id = :id`, {
      replacements: { id: c1.id },
    });
    expect((await getCase(m, c1.id)).deadlinePassed).toBe(true);
    await decide(m, c1.id, {
      outcome: "dismissed",
      reasons: "The code the buyer read is registered to the listed maker's brand owner; not misdescribed.",
    });
    const inv1 = await one<{ state: string; hammer_cents: number; commission_cents: number; transfer_id: string }>(
      `SELECT ${invoiceColumns()} FROM invoices WHERE id = :id`,
      { id: a.invoiceId },
    );
    expect(inv1.state).toBe("released");
    expect((await stripe().transfers.retrieve(inv1.transfer_id)).amount).toBe(
      inv1.hammer_cents - inv1.commission_cents,
    );
    expect(await consignorRecord(a.consignor.id)).toMatchObject({ tubesDisputed: 2, tubesUpheld: 0 });

    // Refund on return: shipped back, the consignor never confirms; after the house's days the buyer is refunded anyway.
    const b = await deliveredLot();
    const c2 = await openDispute(viewerOf(b.buyer), b.invoiceId, claim(b.items[0]!, { remedy: "return-whole-lot" }));
    await takeCase(m, c2.id);
    await db().query(`UPDATE disputes SET answer_due_at = now() - interval '1 second' WHERE id = :id`, {
      replacements: { id: c2.id },
    });
    await decide(m, c2.id, {
      outcome: "refund-on-return",
      reasons: "No answer from the consignor; the evidence supports a return of the whole lot.",
    });
    await recordReturn(viewerOf(b.buyer), c2.id, { carrier: "Demo Parcel Co.", tracking: "RT 222333" });
    expect(await disputeSweep()).toBe(0); // not yet due
    await db().query(`UPDATE disputes SET return_shipped_at = now() - interval '11 days' WHERE id = :id`, {
      replacements: { id: c2.id },
    });
    expect(await disputeSweep()).toBeGreaterThanOrEqual(1);
    expect((await one<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, { id: b.invoiceId })).state).toBe(
      "refunded",
    );
    expect((await getCase(m, c2.id)).decision?.closingNote).toMatch(/not confirmed in time/);

    // Refund on return, never sent back by the deadline: the consignor is paid.
    const c = await deliveredLot();
    const c3 = await openDispute(viewerOf(c.buyer), c.invoiceId, claim(c.items[0]!, { remedy: "return-whole-lot" }));
    await postMessage(viewerOf(c.consignor), c3.id, { body: "Return them if you must.", stance: "accepts" });
    await takeCase(m, c3.id);
    await decide(m, c3.id, {
      outcome: "refund-on-return",
      reasons: "The consignor accepts a return of the whole lot for a refund.",
    });
    await db().query(`UPDATE disputes SET return_due_at = now() - interval '1 second' WHERE id = :id`, {
      replacements: { id: c3.id },
    });
    expect(await disputeSweep()).toBeGreaterThanOrEqual(1);
    expect((await one<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, { id: c.invoiceId })).state).toBe(
      "released",
    );
    expect((await getCase(m, c3.id)).state).toBe("closed");
    expect(await trialBalance()).toBe(0);
    expect((await reconcile()).differences).toEqual([]);
  }, 120_000);

  it("an upheld misdescription returned with postage repays hammer, premium, shipping, tax and postage to the cent; a retry repays nothing more; the statement shows the processor's fee as the ledger recorded it", async () => {
    // Tax of $1.23 on the invoice, as a house that charges tax would have invoiced it; return postage $18.40 with
    // its receipt, under the $150.00 cap [SUG].
    const f = await deliveredLot(undefined, { taxCents: 123 });
    const { id } = await openDispute(
      viewerOf(f.buyer),
      f.invoiceId,
      claim(f.items[0]!, { remedy: "return-whole-lot" }),
    );
    await postMessage(viewerOf(f.consignor), id, { body: "They were sold as we received them.", stance: "contests" });
    const m = viewerOf(await makeUser(["mediator"]));
    await takeCase(m, id);
    await decide(m, id, {
      outcome: "refund-on-return",
      reasons: "The source codes and construction are another maker's: the attribution is upheld; the lot goes back.",
    });
    const over = ReturnShipmentSchema.safeParse({
      carrier: "Demo Parcel Co.",
      tracking: "RT 4040",
      postageCents: 15_001,
    });
    expect(over.success).toBe(false); // above the cap: refused at the boundary
    const ship = { carrier: "Demo Parcel Co.", tracking: "RT 4041", postageCents: 1_840, postageReceipt: "PR-5521" };
    await recordReturn(viewerOf(f.buyer), id, ship);
    await recordReturn(viewerOf(f.buyer), id, ship); // a retry records nothing new
    expect((await getCase(viewerOf(f.consignor), id)).returnPostageCents).toBe(1_840);
    await confirmReturnReceived(viewerOf(f.consignor), id);

    const inv = await one<{
      payment_intent_id: string;
      hammer_cents: number;
      premium_cents: number;
      shipping_cents: number;
      tax_cents: number;
      commission_cents: number;
      processor_fee_cents: number;
    }>(
      `SELECT payment_intent_id, hammer_cents, premium_cents, shipping_cents, tax_cents, commission_cents, processor_fee_cents
         FROM invoices WHERE id = :id`,
      { id: f.invoiceId },
    );
    expect(inv.shipping_cents).toBeGreaterThan(0);
    expect(inv.tax_cents).toBe(123);
    const card = inv.hammer_cents + inv.premium_cents + inv.shipping_cents + inv.tax_cents;
    const repaid = async () => {
      const refunds = await stripe().refunds.list({ payment_intent: inv.payment_intent_id });
      const row = await one<{ postage_transfer_id: string | null }>(
        `SELECT postage_transfer_id FROM disputes WHERE id = :id`,
        { id },
      );
      const transfer = row.postage_transfer_id ? await stripe().transfers.retrieve(row.postage_transfer_id) : null;
      return { refunds: refunds.data.map((r) => r.amount), postage: transfer?.amount ?? 0 };
    };
    expect(await repaid()).toEqual({ refunds: [card], postage: 1_840 });
    expect((await getCase(viewerOf(f.buyer), id)).decision?.buyerRefundCents).toBe(card + 1_840);

    // A retry (the sweep resuming, a second run after a crash) moves no more money and posts nothing twice.
    const postings = async () =>
      (await one<{ n: string }>(`SELECT COUNT(*) AS n FROM ledger_entries WHERE invoice_id = :id`, { id: f.invoiceId }))
        .n;
    const before = await postings();
    const row = await findDispute(id);
    await refundReturnedLot({ ...row!, state: "awaiting-return" }, "a retry");
    expect(await repaid()).toEqual({ refunds: [card], postage: 1_840 });
    expect(await postings()).toBe(before);

    // The books: escrow, shipping and tax owed onward all cleared; the consignor owes the postage [SUG].
    const led = await balances(f.invoiceId);
    expect(led["escrow-held"]).toBe(0);
    expect(led["shipping-payable"]).toBe(0);
    expect(led["tax-payable"]).toBe(0);
    expect(led["consignor-payable"]).toBe(1_840);
    expect(led.cash).toBe(-inv.processor_fee_cents - 1_840); // all the buyer paid went back; the processor kept its fee
    expect(await trialBalance()).toBe(0);
    expect((await reconcile()).differences).toEqual([]);

    // The statement shows the processor's fee as the ledger recorded it, and the processor's own figure agrees.
    const charge = (
      await stripe().paymentIntents.retrieve(inv.payment_intent_id, {
        expand: ["latest_charge.balance_transaction"],
      })
    ).latest_charge as { balance_transaction: { fee: number } };
    expect(charge.balance_transaction.fee).toBeGreaterThan(0);
    expect(led["processor-fees"]).toBe(charge.balance_transaction.fee);
    const st = await statementFor(viewerOf(f.consignor), f.saleId);
    expect(st.lines[0]!.processorFeesCents).toBe(led["processor-fees"]);
    expect(st.totals.processorFeesCents).toBe(led["processor-fees"]);
    // Hammer refunded less commission given back, plus the postage: the consignor owes $18.40.
    expect(st.lines[0]!.refundsCents).toBe(inv.hammer_cents - inv.commission_cents + 1_840);
    expect(st.totals.payoutCents).toBe(-1_840);
  }, 120_000);
});
