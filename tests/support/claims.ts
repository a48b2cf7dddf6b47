// Shared set-up for the claim tests: a delivered lot with a paid invoice, a claim on it, and checks that the money
// settled. Figures: hammer $27.00 and the house's default fee schedule (lib/money/fees.ts) [SUG].
import { QueryTypes } from "sequelize";
import { expect } from "vitest";
import { ApiError } from "../../lib/api/errors";
import type { User } from "../../models";
import { placeMaxBid } from "../../lib/services/bidding";
import { markDelivered, markShipped } from "../../lib/services/escrow";
import { entriesFrom } from "../../lib/money/ledger";
import { balances, post, trialBalance } from "../../lib/services/ledger";
import { closeSaleLot } from "../../lib/services/lot-closing";
import { payInvoice } from "../../lib/services/payments";
import { reconcile } from "../../lib/services/reconcile";
import { createSale } from "../../lib/services/sales";
import type { OpenDisputeInput } from "../../lib/validation/disputes";
import { db } from "../../models";
import { approvedLot, itemInput, makeUser, untilClosingTimePassed, viewerOf } from "./factories";

export const one = async <T extends object>(sql: string, r: Record<string, unknown>) =>
  (await db().query<T>(sql, { replacements: r, type: QueryTypes.SELECT }))[0]!;
import { until } from "./wait";

export { until };
/** Nothing left in escrow or owed to the consignor; the house keeps what it should; the ledger balances and matches the processor. */
export async function expectSettled(
  invoiceId: string,
  kept: { premiumKeptCents: number; commissionKeptCents: number },
) {
  const led = await balances(invoiceId);
  expect(led["escrow-held"]).toBe(0);
  expect(led["consignor-payable"]).toBe(0);
  expect(led["house-revenue-premium"]).toBe(-kept.premiumKeptCents);
  expect(led["house-revenue-commission"]).toBe(-kept.commissionKeptCents);
  expect(await trialBalance()).toBe(0);
  expect((await reconcile()).differences).toEqual([]);
}
export const refused = async (p: Promise<unknown>) => {
  const e = await p.then(
    () => null,
    (x: unknown) => x,
  );
  expect(e).toBeInstanceOf(ApiError);
  return e as ApiError;
};

/** Three lines: four tubes attributed to a maker, two sold by label alone, and a matched quad. */
export const LINES = [
  itemInput({
    designation: "12AX7",
    quantity: 4,
    labelBrand: "Carrow Instruments",
    makerName: "Kestrel Valve Company",
    makerBasis: "construction-matched",
    features: { plateColour: "black", getterShape: "d-shape" },
  }),
  itemInput({ designation: "6SN7GT", quantity: 2, labelBrand: "Fairmont Home Radio" }),
  itemInput({
    designation: "EL84",
    quantity: 4,
    labelBrand: "Tri-County Parts",
    makerName: "Vireo Lamp & Valve",
    makerBasis: "construction-matched",
    soldAsSet: true,
  }),
];

/** A lot sold for a hammer of $27.00, paid, shipped and delivered (inspection window open). */
/**
 * `taxCents` adds sales tax to the invoice before payment, as a house that charges tax would have invoiced it (the
 * default fee schedule charges none), posted to the ledger so the books still balance.
 */
export async function deliveredLot(consignor?: User, opts: { taxCents?: number } = {}) {
  const admin = await makeUser(["admin"]);
  const seller = consignor ?? (await makeUser(["consignor"]));
  const lot = await approvedLot(seller, admin, 2_000, LINES);
  const sale = await createSale(viewerOf(admin), {
    title: "Claims test",
    startsAt: new Date(Date.now() - 60_000).toISOString(),
    firstCloseAt: new Date(Date.now() + 2_500).toISOString(),
    gapSeconds: 30,
    softCloseSeconds: 1,
    lots: [{ lotId: lot.id, openingCents: 1_000 }],
  });
  const sl = await one<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, { id: sale.id });
  const buyer = await makeUser(["dealer"]);
  const under = await makeUser(["dealer"]);
  await placeMaxBid(viewerOf(buyer), sl.id, 3_000, "c-1");
  await placeMaxBid(viewerOf(under), sl.id, 2_500, "c-2");
  await untilClosingTimePassed(sl.id);
  expect(await closeSaleLot(sl.id)).toBe("closed");
  const inv = await one<{ id: string }>(`SELECT id FROM invoices WHERE sale_lot_id = :id`, { id: sl.id });
  const tax = opts.taxCents ?? 0;
  if (tax > 0)
    await db().transaction(async (t) => {
      await db().query(`UPDATE invoices SET tax_cents = :tax, total_cents = total_cents + :tax WHERE id = :id`, {
        replacements: { tax, id: inv.id },
        transaction: t,
      });
      await post(
        t,
        "invoice-tax",
        inv.id,
        entriesFrom([
          ["buyer-receivable", tax],
          ["tax-payable", -tax],
        ]),
      );
    });
  await payInvoice(viewerOf(buyer), inv.id, {
    number: "4242424242424242",
    expMonth: 12,
    expYear: 2030,
    cvc: "123",
    attemptKey: `pay-${inv.id}`,
  });
  await until(
    () => one<{ state: string }>(`SELECT state FROM invoices WHERE id = :id`, { id: inv.id }),
    (i) => i.state === "paid-held",
  );
  await markShipped(inv.id, "Demo Parcel Co.", "DP55501");
  await markDelivered(inv.id);
  const items = await db().query<{ id: string; position: number }>(
    `SELECT id, position FROM lot_items WHERE lot_id = :id ORDER BY position`,
    { replacements: { id: lot.id }, type: QueryTypes.SELECT },
  );
  return {
    invoiceId: inv.id,
    buyer,
    consignor: seller,
    admin,
    saleId: sale.id,
    lotId: lot.id,
    items: items.map((i) => i.id),
  };
}

export const claim = (itemId: string, over: Partial<OpenDisputeInput> = {}): OpenDisputeInput => ({
  reason: "maker-misattributed",
  remedy: "refund-affected-items",
  statement: "Two of the four carry another maker's source code and square getters.",
  items: [
    {
      itemId,
      tubes: 2,
      sourceCode: "X46",
      dateCode: "6231",
      features: { getterShape: "square", plateSurface: "dimpled" },
      readings: [],
      designationSeen: null,
      tubesReceived: null,
      vacuumLoss: false,
      note: "",
    },
  ],
  ...over,
});
