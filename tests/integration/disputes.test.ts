import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { invoiceColumns } from "../../lib/services/invoice-rows";
import { ApiError } from "../../lib/api/errors";
import { addDisputePhoto, readDisputePhoto } from "../../lib/services/disputes/evidence";
import { decide } from "../../lib/services/disputes/decide";
import { getCase, mediationQueue, myCases } from "../../lib/services/disputes/cases";
import { openDispute } from "../../lib/services/disputes/open";
import { postMessage } from "../../lib/services/disputes/conversation";
import { takeCase, workspace } from "../../lib/services/disputes/mediation";
import { releaseDue } from "../../lib/services/escrow";
import { statementFor } from "../../lib/services/statements";
import { consignorRecord } from "../../lib/services/track-record";
import { db } from "../../models";
import { startTestS3, type TestS3 } from "../setup/s3";
import { startTestStripe, type TestStripe } from "../setup/stripe";
import { inbox, makeUser, request, sessionCookie, viewerOf } from "../support/factories";
import { releaseUndisputedShare } from "../../lib/services/disputes/early-release";
import { GET as queueRoute } from "../../app/api/mediation/queue/route";
import { GET as caseRoute } from "../../app/api/disputes/[id]/route";
import { POST as decisionRoute } from "../../app/api/disputes/[id]/decision/route";
import { POST as openRoute } from "../../app/api/invoices/[id]/dispute/route";
import sharp from "sharp";
import { stripe } from "../../lib/stripe/client";
import { consignorDesk } from "../../lib/services/consignor-desk";
import { getInvoice } from "../../lib/services/invoices";
import { claim, deliveredLot, expectSettled, one, refused } from "../support/claims";

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

describe("claims and mediation", () => {
  it("a misattribution claim from opening to a partial refund that agrees to the cent with the statement and the ledger", async () => {
    const f = await deliveredLot();
    const buyer = viewerOf(f.buyer);
    const consignor = viewerOf(f.consignor);

    // Line 2 was sold by its label alone: no maker claim to be wrong about [CTP: label ≠ maker].
    const labelOnly = await refused(openDispute(buyer, f.invoiceId, claim(f.items[1]!)));
    expect(labelOnly.status).toBe(400);
    expect(labelOnly.message).toMatch(/label .*alone/);

    const { id } = await openDispute(buyer, f.invoiceId, claim(f.items[0]!));
    expect((await openDispute(buyer, f.invoiceId, claim(f.items[0]!))).id).toBe(id); // a retry finds the open claim
    expect((await one<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, { id: f.invoiceId })).state).toBe(
      "disputed",
    );
    expect((await inbox(f.consignor.email)).some((m) => m.subject.includes("opened a claim"))).toBe(true);

    // Escrow stays held even after the window ends while the claim is open.
    await db().query(`UPDATE invoices SET inspection_ends_at = now() - interval '1 second' WHERE id = :id`, {
      replacements: { id: f.invoiceId },
    });
    expect(await releaseDue()).toBe(0);

    // Evidence: a photo, re-encoded and kept; it cannot be edited or deleted afterwards.
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: "#777" } })
      .jpeg()
      .toBuffer();
    const photo = await addDisputePhoto(
      buyer,
      id,
      { name: "getter.jpg", bytes: jpeg },
      { itemId: f.items[0]!, caption: "Square getter, code X46" },
    );
    expect((await readDisputePhoto(consignor, photo.id, "thumb")).contentType).toBe("image/jpeg");
    await expect(
      db().query(`UPDATE dispute_messages SET body = 'changed' WHERE dispute_id = :id`, { replacements: { id } }),
    ).rejects.toThrow(/cannot be changed/);
    await expect(
      db().query(`DELETE FROM dispute_evidence WHERE id = :id`, { replacements: { id: photo.id } }),
    ).rejects.toThrow(/cannot be changed/);

    // Nobody else reads the case: another dealer, another consignor; the queue is for mediators only.
    const stranger = viewerOf(await makeUser(["dealer"]));
    const otherConsignor = viewerOf(await makeUser(["consignor"]));
    expect((await refused(getCase(stranger, id))).status).toBe(404);
    expect((await refused(getCase(otherConsignor, id))).status).toBe(404);
    expect((await refused(readDisputePhoto(stranger, photo.id, "full"))).status).toBe(404);
    expect((await refused(mediationQueue(stranger))).status).toBe(403);
    expect(await myCases(stranger)).toEqual([]);
    expect((await myCases(consignor)).map((c) => c.id)).toEqual([id]);

    // Two mediators: the first takes it, the second is refused.
    const m1 = viewerOf(await makeUser(["mediator"]));
    const m2 = viewerOf(await makeUser(["mediator"]));
    expect((await mediationQueue(m1)).waiting.map((c) => c.id)).toContain(id);
    await takeCase(m1, id);
    expect((await refused(takeCase(m2, id))).status).toBe(409);
    // [SUG] The case's mediator reads its invoice, read-only; any other mediator still gets 404.
    expect(await getInvoice(m1, f.invoiceId)).toMatchObject({
      id: f.invoiceId,
      readOnly: true,
      isBuyer: false,
      isConsignor: false,
    });
    expect((await refused(getInvoice(m2, f.invoiceId))).status).toBe(404);
    // The consignor's desk shows the lot under its claim (not "approved"), netting the $27.00 hammer less 20 % commission
    // = $21.60 [SUG house tiers: 20 % of the first $500].
    expect((await consignorDesk(consignor)).lots.find((l) => l.id === f.lotId)).toMatchObject({
      stage: "claim",
      netCents: 2_160,
    });
    expect((await mediationQueue(m2)).waiting.map((c) => c.id)).not.toContain(id);

    // Before the consignor answers (and before the deadline) the mediator cannot decide.
    const lines = [
      { itemId: f.items[0]!, valueCents: 1_000 },
      { itemId: f.items[1]!, valueCents: 500 },
      { itemId: f.items[2]!, valueCents: 5_000, singleValueCents: 1_000 },
    ];
    const decision = {
      outcome: "partial-refund" as const,
      reasons: "Code X46 and the square getter point to another maker on two tubes.",
      lines,
      rulings: [{ itemId: f.items[0]!, upheld: true, tubes: 2, worthCents: 300 }],
    };
    expect((await refused(decide(m1, id, decision))).message).toMatch(/has until/);
    expect((await refused(postMessage(consignor, id, { body: "I bought them as they are." }))).status).toBe(400); // the answer needs a stance
    await postMessage(consignor, id, {
      body: "They came from the estate as listed; I matched them by construction.",
      stance: "contests",
    });
    await postMessage(m1, id, { body: "Thank you both; I am comparing the codes and construction." });
    const view = await getCase(buyer, id);
    expect(view.messages.map((m) => m.role)).toEqual(["buyer", "consignor", "mediator"]);
    expect(view.sale.commissionCents).toBeNull(); // the buyer does not see the consignor's commission

    const ws = await workspace(m1, id);
    expect(ws.weighings).toHaveLength(1);
    expect(ws.weighings[0]!.buyer.ranking.candidates).toBeDefined();
    expect(ws.summary.items).toBe(1);

    // The decision is taken once: the same mediator twice at once, and the other mediator, get 409.
    const [a, b] = await Promise.allSettled([decide(m1, id, decision), decide(m1, id, decision)]);
    expect([a.status, b.status].sort()).toEqual(["fulfilled", "rejected"]);
    const lost = (a.status === "rejected" ? a.reason : (b as PromiseRejectedResult).reason) as ApiError;
    expect(lost.status).toBe(409);
    expect((await refused(decide(m2, id, decision))).status).toBe(409);

    // Hand-worked from the partial-refund formula: V_lot = 4×$10 + 2×$5 + $50 set = $100;
    // W = 2 × ($10 − $3) = $14; hammer $27.00 × 14 % = $3.78; premium $2.70 × 14 % = $0.378 → $0.38;
    // commission $5.40 × 14 % = $0.756 → $0.76 (half-up). Buyer gets $4.16; consignor bears −$3.78 + $0.76 = −$3.02.
    const closed = await getCase(consignor, id);
    expect(closed.state).toBe("closed");
    expect(closed.outcome).toBe("partial-refund");
    expect(closed.decidedBy).toBe(m1.name);
    expect(closed.decision?.buyerRefundCents).toBe(416);
    expect(closed.decision?.consignorChangeCents).toBe(-302);
    const inv = await one<{
      state: string;
      hammer_refunded_cents: number;
      premium_refunded_cents: number;
      commission_returned_cents: number;
      payment_intent_id: string;
      transfer_id: string;
    }>(`SELECT ${invoiceColumns()} FROM invoices WHERE id = :id`, { id: f.invoiceId });
    expect(inv.state).toBe("released");
    expect([inv.hammer_refunded_cents, inv.premium_refunded_cents, inv.commission_returned_cents]).toEqual([
      378, 38, 76,
    ]);

    // The processor agrees: one refund of $4.16 on the payment, one transfer of what is left.
    const refunds = await stripe().refunds.list({ payment_intent: inv.payment_intent_id });
    expect(refunds.data.map((r) => r.amount)).toEqual([416]);
    const transfer = await stripe().transfers.retrieve(inv.transfer_id);
    expect(transfer.amount).toBe(2_700 - 540 - 302); // $18.58

    // The statement and the ledger agree with both.
    const st = await statementFor(consignor, f.saleId);
    expect(st.lines[0]!.refundsCents).toBe(302);
    expect(st.totals.payoutCents).toBe(transfer.amount);
    await expectSettled(f.invoiceId, { premiumKeptCents: 270 - 38, commissionKeptCents: 540 - 76 });

    const decisionMails = [...(await inbox(f.buyer.email)), ...(await inbox(f.consignor.email))].filter((m) =>
      m.subject.includes("Decision on"),
    );
    expect(decisionMails).toHaveLength(2);
    expect(decisionMails.every((m) => m.text.includes("Code X46 and the square getter"))).toBe(true);

    // The record dealers see on this consignor's next lots.
    const record = await consignorRecord(f.consignor.id);
    expect(record).toMatchObject({ tubesSold: 10, tubesDisputed: 2, tubesUpheld: 2, upheldMisattributionClaims: 1 });
  }, 90_000);

  it("refuses a claim after the inspection window with the date it closed", async () => {
    const f = await deliveredLot();
    await db().query(`UPDATE invoices SET inspection_ends_at = now() - interval '1 minute' WHERE id = :id`, {
      replacements: { id: f.invoiceId },
    });
    const e = await refused(openDispute(viewerOf(f.buyer), f.invoiceId, claim(f.items[0]!)));
    expect(e.status).toBe(409);
    expect(e.message).toMatch(/inspection window closed on \d{4}-\d{2}-\d{2}/);
    expect(await releaseDue()).toBeGreaterThanOrEqual(1); // and the sweeper pays the consignor as usual
  }, 60_000);

  it("routes: role checks on the server, one error shape, bad input refused with field messages", async () => {
    const f = await deliveredLot();
    const buyerCookie = await sessionCookie(f.buyer);
    const params = (id: string) => ({ params: Promise.resolve({ id }) });
    // Bad input: no reason, a statement too short, no items → 400 with fields; nothing opened.
    const bad = await openRoute(
      request(`/api/invoices/${f.invoiceId}/dispute`, {
        json: { statement: "bad", items: [] },
        headers: { cookie: buyerCookie },
      }),
      params(f.invoiceId),
    );
    expect(bad.status).toBe(400);
    const badBody = (await bad.json()) as { error: { code: string; fields: Record<string, string> } };
    expect(badBody.error.code).toBe("validation_failed");
    expect(Object.keys(badBody.error.fields)).toEqual(
      expect.arrayContaining(["reason", "remedy", "statement", "items"]),
    );
    expect((await one<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, { id: f.invoiceId })).state).toBe(
      "delivered",
    );
    // The consignor cannot open a claim on their own sale (dealers only), and a stranger dealer gets 404.
    expect(
      (
        await openRoute(
          request(`/api/invoices/${f.invoiceId}/dispute`, {
            json: claim(f.items[0]!),
            headers: { cookie: await sessionCookie(f.consignor) },
          }),
          params(f.invoiceId),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await openRoute(
          request(`/api/invoices/${f.invoiceId}/dispute`, {
            json: claim(f.items[0]!),
            headers: { cookie: await sessionCookie(await makeUser(["dealer"])) },
          }),
          params(f.invoiceId),
        )
      ).status,
    ).toBe(404);
    const opened = await openRoute(
      request(`/api/invoices/${f.invoiceId}/dispute`, { json: claim(f.items[0]!), headers: { cookie: buyerCookie } }),
      params(f.invoiceId),
    );
    expect(opened.status).toBe(201);
    const { dispute } = (await opened.json()) as { dispute: { id: string } };
    // Only mediators see the queue or decide; the house reads the case; a buyer cannot decide their own claim.
    expect(
      (await queueRoute(request("/api/mediation/queue", { headers: { cookie: buyerCookie } }), params("x"))).status,
    ).toBe(403);
    expect(
      (
        await queueRoute(
          request("/api/mediation/queue", { headers: { cookie: await sessionCookie(f.admin) } }),
          params("x"),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await caseRoute(
          request(`/api/disputes/${dispute.id}`, { headers: { cookie: await sessionCookie(f.admin) } }),
          params(dispute.id),
        )
      ).status,
    ).toBe(200);
    const decisionBody = { outcome: "dismissed", reasons: "The buyer's evidence does not show another maker's work." };
    expect(
      (
        await decisionRoute(
          request(`/api/disputes/${dispute.id}/decision`, { json: decisionBody, headers: { cookie: buyerCookie } }),
          params(dispute.id),
        )
      ).status,
    ).toBe(403);
    const m = await makeUser(["mediator"]);
    const notTaken = await decisionRoute(
      request(`/api/disputes/${dispute.id}/decision`, {
        json: decisionBody,
        headers: { cookie: await sessionCookie(m) },
      }),
      params(dispute.id),
    );
    expect(notTaken.status).toBe(409);
    expect(((await notTaken.json()) as { error: { message: string } }).error.message).toMatch(/Take the case/);
    const tooShort = await decisionRoute(
      request(`/api/disputes/${dispute.id}/decision`, {
        json: { outcome: "dismissed", reasons: "no" },
        headers: { cookie: await sessionCookie(m) },
      }),
      params(dispute.id),
    );
    expect(tooShort.status).toBe(400);
    expect(
      (await caseRoute(request(`/api/disputes/not-a-uuid`, { headers: { cookie: buyerCookie } }), params("not-a-uuid")))
        .status,
    ).toBe(404);
  }, 60_000);

  it("releases the undisputed share early, then settles the claimed share: payouts, refund and ledger agree to the cent", async () => {
    const f = await deliveredLot();
    const { id } = await openDispute(viewerOf(f.buyer), f.invoiceId, claim(f.items[0]!));
    const m = viewerOf(await makeUser(["mediator"]));
    await takeCase(m, id);
    const lines = [
      { itemId: f.items[0]!, valueCents: 1_000 },
      { itemId: f.items[1]!, valueCents: 500 },
      { itemId: f.items[2]!, valueCents: 5_000, singleValueCents: 1_000 },
    ];
    // Hand-worked [CTP/SUG]: the claim covers 2 × $10 of V_lot $100 = 20 % held; hammer $27.00 → $5.40 held, $21.60 released;
    // premium $2.70 → $0.54 / $2.16; commission $5.40 → $1.08 / $4.32; the consignor is paid $21.60 − $4.32 = $17.28 now.
    const r = await releaseUndisputedShare(m, id, { lines });
    expect(r.payoutCents).toBe(1_728);
    expect(r.held).toEqual({ hammerCents: 540, premiumCents: 54, commissionCents: 108 });
    expect(await releaseDue()).toBe(0);
    const early = await one<{ state: string; released_hammer_cents: number }>(
      `SELECT ${invoiceColumns()} FROM invoices WHERE id = :id`,
      {
        id: f.invoiceId,
      },
    );
    expect(early.state).toBe("disputed");
    expect(early.released_hammer_cents).toBe(2_160);
    expect((await statementFor(viewerOf(f.consignor), f.saleId)).totals.paidOutCents).toBe(1_728);
    const again = await refused(releaseUndisputedShare(m, id, { lines })); // a second click pays nothing twice, and says so
    expect(again.status).toBe(409);
    expect(again.details).toMatchObject({ state: expect.any(String), payoutCents: 1_728 });
    expect((await statementFor(viewerOf(f.consignor), f.saleId)).totals.paidOutCents).toBe(1_728);
    expect(
      (
        await refused(
          releaseUndisputedShare(m, id, { lines: lines.map((l) => ({ ...l, valueCents: l.valueCents + 1 })) }),
        )
      ).status,
    ).toBe(409);

    await postMessage(viewerOf(f.consignor), id, {
      body: "We accept that two were mislabelled by the maker's carton.",
      stance: "accepts-in-part",
    });
    expect(
      (
        await refused(
          decide(m, id, {
            outcome: "refund-on-return",
            reasons: "Return the lot for a refund of everything paid for it.",
          }),
        )
      ).status,
    ).toBe(409);
    const other = [{ ...lines[0]!, valueCents: 2_000 }, lines[1]!, lines[2]!];
    expect(
      (
        await refused(
          decide(m, id, {
            outcome: "partial-refund",
            reasons: "Two tubes are another maker's work.",
            lines: other,
            rulings: [{ itemId: f.items[0]!, upheld: true, tubes: 2, worthCents: 300 }],
          }),
        )
      ).status,
    ).toBe(400);
    await decide(m, id, {
      outcome: "partial-refund",
      reasons: "Two tubes are another maker's work; each is worth $3 as such.",
      lines,
      rulings: [{ itemId: f.items[0]!, upheld: true, tubes: 2, worthCents: 300 }],
    });
    // Refund as in the first test ($4.16); what is left, $1.62 − $0.32 = $1.30, goes to the consignor: $17.28 + $1.30 = $18.58 in all.
    const inv = await one<{ state: string; payment_intent_id: string; transfer_id: string }>(
      `SELECT ${invoiceColumns()} FROM invoices WHERE id = :id`,
      { id: f.invoiceId },
    );
    expect(inv.state).toBe("released");
    expect((await stripe().refunds.list({ payment_intent: inv.payment_intent_id })).data.map((x) => x.amount)).toEqual([
      416,
    ]);
    expect((await stripe().transfers.retrieve(inv.transfer_id)).amount).toBe(130);
    const st = await statementFor(viewerOf(f.consignor), f.saleId);
    expect(st.totals.payoutCents).toBe(1_858);
    expect(st.totals.paidOutCents).toBe(1_858);
    await expectSettled(f.invoiceId, { premiumKeptCents: 270 - 38, commissionKeptCents: 540 - 76 });
  }, 60_000);
});
