import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { ApiError } from "../../lib/api/errors";
import { DEFAULT_COMMISSION_TIERS, sellersCommissionCents } from "../../lib/money/fees";
import { placeMaxBid } from "../../lib/services/bidding";
import { markDelivered, markShipped, releaseDue } from "../../lib/services/escrow";
import { balances, trialBalance } from "../../lib/services/ledger";
import { closeSaleLot } from "../../lib/services/lot-closing";
import { payInvoice } from "../../lib/services/payments";
import { comparableSales } from "../../lib/services/lot-summary";
import { reconcile } from "../../lib/services/reconcile";
import { createSale } from "../../lib/services/sales";
import { statementCsv, statementFor } from "../../lib/services/statements";
import { db } from "../../models";
import { startTestStripe, type TestStripe } from "../setup/stripe";
import { approvedLot, inbox, makeUser, untilClosingTimePassed, viewerOf } from "../support/factories";
import { until } from "../support/wait";
import { invoiceColumns } from "../../lib/services/invoice-rows";

let fake: TestStripe;
const logged: string[] = [];
beforeAll(async () => {
  fake = await startTestStripe();
  for (const k of ["log", "warn", "error", "info"] as const) {
    const orig = console[k];
    vi.spyOn(console, k).mockImplementation((...a: unknown[]) => {
      logged.push(a.map(String).join(" "));
      orig(...(a as []));
    });
  }
});
afterAll(async () => {
  vi.restoreAllMocks();
  await fake.stop();
});

const invoice = async (id: string) =>
  (
    await db().query<{
      state: string;
      total_cents: number;
      hammer_cents: number;
      premium_cents: number;
      shipping_cents: number;
      commission_cents: number;
      processor_fee_cents: number | null;
      last_payment_error: string | null;
      payment_intent_id: string | null;
    }>(`SELECT ${invoiceColumns()} FROM invoices WHERE id = :id`, { replacements: { id }, type: QueryTypes.SELECT })
  )[0]!;

async function soldLot(hammerMaxes: [number, number]) {
  const admin = await makeUser(["admin"]);
  const consignor = await makeUser(["consignor"]);
  const lot = await approvedLot(consignor, admin, 2_000);
  const sale = await createSale(viewerOf(admin), {
    title: "Escrow test",
    startsAt: new Date(Date.now() - 60_000).toISOString(),
    firstCloseAt: new Date(Date.now() + 2_500).toISOString(),
    gapSeconds: 30,
    softCloseSeconds: 1,
    lots: [{ lotId: lot.id, openingCents: 1_000 }],
  });
  const [sl] = await db().query<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, {
    replacements: { id: sale.id },
    type: QueryTypes.SELECT,
  });
  const buyer = await makeUser(["dealer"]);
  const under = await makeUser(["dealer"]);
  await placeMaxBid(viewerOf(buyer), sl!.id, hammerMaxes[0], "e-1");
  await placeMaxBid(viewerOf(under), sl!.id, hammerMaxes[1], "e-2");
  await untilClosingTimePassed(sl!.id);
  expect(await closeSaleLot(sl!.id)).toBe("closed");
  const [inv] = await db().query<{ id: string }>(`SELECT id FROM invoices WHERE sale_lot_id = :id`, {
    replacements: { id: sl!.id },
    type: QueryTypes.SELECT,
  });
  return { invoiceId: inv!.id, buyer, consignor, saleId: sale.id };
}

describe("escrow through the Stripe SDK against the local fake", () => {
  it("walks invoice → declined → paid and held → shipped → delivered → released, balanced at every step", async () => {
    const { invoiceId, buyer, consignor, saleId } = await soldLot([3_000, 2_500]);
    const i0 = await invoice(invoiceId);
    // Hammer: 2,500 + one increment ($2 from $20, house 1-2-5 ladder) = 2,700 [CTP proxy rule].
    expect(i0.hammer_cents).toBe(2_700);
    expect(i0.premium_cents).toBe(270); // 10 % buyer's premium, the house rate [SUG]
    expect(i0.commission_cents).toBe(sellersCommissionCents(2_700, DEFAULT_COMMISSION_TIERS)); // 20 % under $500 [SUG tiers]
    expect(i0.commission_cents).toBe(540);
    expect(i0.total_cents).toBe(i0.hammer_cents + i0.premium_cents + i0.shipping_cents);
    expect(await trialBalance()).toBe(0);

    const card = { expMonth: 12, expYear: 2030, cvc: "123" };
    const declined = await payInvoice(viewerOf(buyer), invoiceId, {
      ...card,
      number: "4000000000000002",
      attemptKey: "attempt-decline",
    }).catch((e) => e);
    expect(declined).toBeInstanceOf(ApiError);
    expect((declined as ApiError).code).toBe("conflict");
    expect((await invoice(invoiceId)).state).toBe("awaiting-payment");

    const ok = await payInvoice(viewerOf(buyer), invoiceId, {
      ...card,
      number: "4242 4242 4242 4242",
      attemptKey: "attempt-good",
    });
    expect(ok.status).toBe("succeeded");
    const paid = await until(
      () => invoice(invoiceId),
      (i) => i.state === "paid-held",
    );
    expect(paid.state).toBe("paid-held");
    expect(paid.processor_fee_cents).toBeGreaterThan(0);
    expect(await trialBalance()).toBe(0);

    // The same event delivered three more times changes nothing.
    const entries = async () =>
      Number(
        (
          await db().query<{ n: string }>(`SELECT COUNT(*) AS n FROM ledger_entries WHERE invoice_id = :id`, {
            replacements: { id: invoiceId },
            type: QueryTypes.SELECT,
          })
        )[0]!.n,
      );
    const before = await entries();
    const evt = fake.received.at(-1)!;
    const handled = () => fake.received.filter((id) => id === evt).length;
    for (let k = 0; k < 3; k++) {
      // The signal: our webhook route has answered this redelivery (the test receiver logs each 2xx).
      const seen = handled();
      await fetch(`${fake.url}/_fake/events/${evt}/redeliver`, { method: "POST" });
      await until(handled, (n) => n > seen);
    }
    expect(await entries()).toBe(before);
    expect((await invoice(invoiceId)).state).toBe("paid-held");

    await markShipped(invoiceId, "Demo Parcel Co.", "DP123456789");
    await markDelivered(invoiceId);
    expect(await releaseDue()).toBe(0); // the inspection window is still open
    await db().query(`UPDATE invoices SET inspection_ends_at = now() - interval '1 second' WHERE id = :id`, {
      replacements: { id: invoiceId },
    }); // the clock moves past the window
    expect(await releaseDue()).toBe(1);
    expect((await invoice(invoiceId)).state).toBe("released");
    expect(await releaseDue()).toBe(0);

    const b = await balances(invoiceId);
    expect(b["escrow-held"]).toBe(0);
    expect(b["consignor-payable"]).toBe(0);
    expect(b["house-revenue-premium"]).toBe(-270);
    expect(b["house-revenue-commission"]).toBe(-540);
    expect(await trialBalance()).toBe(0);

    const mail = (await inbox(consignor.email)).find((m) => m.subject.includes("settlement statement"));
    expect(mail?.attachments?.map((a) => a.contentType).sort()).toEqual(["application/pdf", "text/csv"]);
    const st = await statementFor(viewerOf(consignor), saleId);
    expect(st.totals.payoutCents).toBe(2_700 - 540);
    expect(st.totals.paidOutCents).toBe(2_160);
    expect(statementCsv(st)).toContain("21.60");

    const rec = await reconcile();
    expect(rec.differences).toEqual([]);

    // The sold lot (one 12AX7, used) is now a comparable for estimates at its hammer per tube [SUG, lib/lots/comparables].
    expect(
      (await comparableSales()).some(
        (c) => c.typeFamily === "12AX7" && c.condition === "used" && c.pricePerTubeCents === 2_700,
      ),
    ).toBe(true);
  }, 60_000);

  it("a card that asks for authentication is paid once the buyer authenticates", async () => {
    const { invoiceId, buyer } = await soldLot([4_000, 3_000]);
    const r = await payInvoice(viewerOf(buyer), invoiceId, {
      number: "4000002500003155",
      expMonth: 1,
      expYear: 2031,
      cvc: "999",
      attemptKey: "attempt-3ds",
    });
    expect(r.status).toBe("requires_action");
    const pi = (await invoice(invoiceId)).payment_intent_id!;
    const auth = await fetch(`${fake.url}/_fake/payment_intents/${pi}/authenticate`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ outcome: "succeed" }),
    });
    expect(auth.ok).toBe(true);
    expect(
      (
        await until(
          () => invoice(invoiceId),
          (i) => i.state === "paid-held",
        )
      ).state,
    ).toBe("paid-held");
  }, 30_000);

  it("keeps card numbers and the secret key out of our database and logs", async () => {
    const cols = await db().query<{ table_name: string; column_name: string }>(
      `SELECT table_name, column_name FROM information_schema.columns WHERE table_schema = 'public' AND data_type IN ('text', 'character varying', 'jsonb', 'json')`,
      { type: QueryTypes.SELECT },
    );
    for (const needle of ["4242424242424242", "4000002500003155", "4000000000000002", process.env.STRIPE_SECRET_KEY!]) {
      for (const c of cols) {
        const [hit] = await db().query<{ n: number }>(
          `SELECT 1 AS n FROM "${c.table_name}" WHERE "${c.column_name}"::text LIKE :needle LIMIT 1`,
          { replacements: { needle: `%${needle}%` }, type: QueryTypes.SELECT },
        );
        expect(hit, `${needle.slice(0, 6)}… found in ${c.table_name}.${c.column_name}`).toBeUndefined();
      }
      expect(logged.some((l) => l.includes(needle))).toBe(false);
    }
  });
});

describe("unpaid invoices", () => {
  it("reminds twice, then the house cancels and offers the lot to the under-bidder at their last bid", async () => {
    const { sendReminders } = await import("../../lib/services/invoices");
    const { cancelUnpaid } = await import("../../lib/services/second-chance");
    const { invoiceId } = await soldLot([3_000, 2_500]);
    await expect(cancelUnpaid(invoiceId, true)).rejects.toThrow(/not yet past its due date/);
    await db().query(`UPDATE invoices SET due_at = now() - interval '1 minute' WHERE id = :id`, {
      replacements: { id: invoiceId },
    });
    expect(await sendReminders()).toBeGreaterThanOrEqual(1); // due soon
    expect(await sendReminders()).toBeGreaterThanOrEqual(1); // overdue
    const [{ reminders_sent }] = (await db().query<{ reminders_sent: number }>(
      `SELECT reminders_sent FROM invoices WHERE id = :id`,
      { replacements: { id: invoiceId }, type: QueryTypes.SELECT },
    )) as [{ reminders_sent: number }];
    expect(reminders_sent).toBe(2);
    const r = await cancelUnpaid(invoiceId, true);
    expect(r.newInvoiceId).toBeTruthy();
    expect((await invoice(invoiceId)).state).toBe("cancelled");
    const offer = await invoice(r.newInvoiceId!);
    expect(offer.state).toBe("awaiting-payment");
    // Both are written by the same issuing code; only the offer is flagged, each with its own number.
    const flags = await db().query<{ id: string; second_chance: boolean; number: string }>(
      `SELECT id, second_chance, number FROM invoices WHERE id IN (:ids)`,
      { replacements: { ids: [invoiceId, r.newInvoiceId] }, type: QueryTypes.SELECT },
    );
    const byId = new Map(flags.map((f) => [f.id, f]));
    expect(byId.get(invoiceId)!.second_chance).toBe(false);
    expect(byId.get(r.newInvoiceId!)!.second_chance).toBe(true);
    expect(byId.get(r.newInvoiceId!)!.number).toMatch(/^GL-\d{4}-\d+$/);
    expect(byId.get(r.newInvoiceId!)!.number).not.toBe(byId.get(invoiceId)!.number);
    expect(offer.hammer_cents).toBe(2_500); // the under-bidder's own maximum [brief §8 practice: offer at their last bid]
    expect(await trialBalance()).toBe(0);
    const b = await balances(invoiceId);
    expect(b["buyer-receivable"]).toBe(0); // the cancelled invoice's posting is reversed
  }, 30_000);
});

describe("the webhook route", () => {
  it("refuses a bad signature with 400 in the error shape and logs it", async () => {
    const { POST } = await import("../../app/api/webhooks/stripe/route");
    const { NextRequest } = await import("next/server");
    const body = JSON.stringify({
      id: "evt_forged",
      type: "payment_intent.succeeded",
      data: { object: { metadata: { invoice_id: "x" } } },
    });
    const r = await POST(
      new NextRequest("http://localhost:3000/api/webhooks/stripe", {
        method: "POST",
        body,
        headers: { "stripe-signature": "t=1,v1=deadbeef" },
      }),
    );
    expect(r.status).toBe(400);
    expect(((await r.json()) as { error: { code: string } }).error.code).toBe("bad_request");
    expect(logged.some((l) => l.includes("[webhook] refused: bad signature"))).toBe(true);
  });
});
