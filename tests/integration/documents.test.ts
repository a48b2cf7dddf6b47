// Printable documents: each PDF is parsed back to text and checked against the data it was made from,
// and each download route keeps its role rules (401 signed out, 403 a party without the right, 404 a stranger).
import { randomUUID } from "node:crypto";
import { PDFParse } from "pdf-parse";
import { QueryTypes } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { GET as invoicePdfRoute } from "../../app/api/invoices/[id]/pdf/route";
import { GET as packingSlipRoute } from "../../app/api/invoices/[id]/packing-slip/route";
import { GET as lotSheetRoute } from "../../app/api/lots/[id]/sheet/route";
import { GET as catalogueRoute } from "../../app/api/sales/[id]/catalogue/route";
import { formatCents } from "../../lib/money/cents";
import { placeMaxBid } from "../../lib/services/bidding";
import { changeSettings, currentSettings } from "../../lib/services/house-settings";
import { getInvoice } from "../../lib/services/invoices";
import { closeSaleLot } from "../../lib/services/lot-closing";
import { createLot, addItem } from "../../lib/services/lots";
import { createSale } from "../../lib/services/sales";
import { INITIAL_HOUSE_SETTINGS } from "../../lib/validation/house-settings";
import { db } from "../../models";
import { approvedLot, invoicedLot, itemInput, makeUser, request, sessionCookie, viewerOf } from "../support/factories";

type Handler = (req: import("next/server").NextRequest, ctx: { params: Promise<{ id: string }> }) => Promise<Response>;

async function get(handler: Handler, url: string, id: string, user?: import("../../models").User) {
  const headers: Record<string, string> = user ? { cookie: await sessionCookie(user) } : {};
  return handler(request(url, { headers }), { params: Promise.resolve({ id }) });
}

async function textOf(res: Response): Promise<string> {
  expect(res.status).toBe(200);
  expect(res.headers.get("content-type")).toBe("application/pdf");
  const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

const one = async <T extends object>(sql: string, id: string) =>
  (await db().query<T>(sql, { replacements: { id }, type: QueryTypes.SELECT }))[0]!;

// A lot of three lines: two 12AX7 graded against a chart value, a mercury-vapour rectifier, and a dead 6V6GT.
const items = [
  itemInput({
    designation: "12AX7",
    quantity: 2,
    readings: [
      { tubeNo: 1, measure: "gm", sections: [1650, 1620], chartNewValue: 1600 },
      { tubeNo: 2, measure: "gm", sections: [1100, 1120], chartNewValue: 1600 },
    ],
  }),
  itemInput({ designation: "866A", quantity: 1 }),
  itemInput({ designation: "6V6GT", quantity: 1, vacuumLoss: true }),
];

// The house's details as version 1 has them: an invented sender [SUG demo house, scenario.md].
const HOUSE = { name: "Getterline Exchange", street: "27 Anode Street", town: "Glowmere, GM4 7EX" };

// Leave the settings as version 1 had them for the test files that run after this one.
afterAll(async () => {
  const now = await currentSettings();
  if (JSON.stringify(now.settings) !== JSON.stringify(INITIAL_HOUSE_SETTINGS))
    await changeSettings(viewerOf(await makeUser(["admin"])), {
      settings: INITIAL_HOUSE_SETTINGS,
      reason: "Back to version 1 figures after the documents test",
    });
});

describe("printable documents", () => {
  it("prints the invoice with the row's own lines, total = hammer + premium + shipping + tax", async () => {
    const f = await invoicedLot([3_000, 2_500], items);
    const row = await one<{
      number: string;
      hammer_cents: number;
      premium_cents: number;
      shipping_cents: number;
      tax_cents: number;
      total_cents: number;
    }>(
      `SELECT number, hammer_cents, premium_cents, shipping_cents, tax_cents, total_cents FROM invoices WHERE id = :id`,
      f.invoiceId,
    );
    // Hammer: 2,500 + one increment ($2 from $20) = 2,700 [CTP proxy rule]; premium 10 % of it [SUG house rate].
    expect(row.hammer_cents).toBe(2_700);
    expect(row.premium_cents).toBe(270);
    expect(row.total_cents).toBe(row.hammer_cents + row.premium_cents + row.shipping_cents + row.tax_cents);

    const text = await textOf(await get(invoicePdfRoute, `/api/invoices/${f.invoiceId}/pdf`, f.invoiceId, f.buyer));
    expect(text).toContain(`Invoice ${row.number}`);
    expect(text).toMatch(new RegExp(`Hammer price\\s+${escape(formatCents(row.hammer_cents))}`));
    expect(text).toMatch(new RegExp(`Buyer's premium \\(10 % of the hammer\\)\\s+${escape(formatCents(270))}`));
    expect(text).toMatch(new RegExp(`Shipping\\s+${escape(formatCents(row.shipping_cents))}`));
    expect(text).toMatch(new RegExp(`Tax\\s+${escape(formatCents(row.tax_cents))}`));
    expect(text).toMatch(new RegExp(`Total due\\s+${escape(formatCents(row.total_cents))}`));
    expect(text).toContain("Page 1 of 1");

    // The house prints it too.
    expect((await get(invoicePdfRoute, "/x", f.invoiceId, f.admin)).status).toBe(200);
  }, 60_000);

  it("prints a packing slip with types and counts and cautions, and no price anywhere", async () => {
    const f = await invoicedLot([3_000, 2_500], items);
    const text = await textOf(
      await get(packingSlipRoute, `/api/invoices/${f.invoiceId}/packing-slip`, f.invoiceId, f.buyer),
    );
    expect(text).toMatch(/12AX7\s+Used\s+2/);
    expect(text).toMatch(/866A\s+Used\s+1/);
    expect(text).toMatch(/6V6GT\s+Used\s+1/);
    expect(text).toMatch(/Total\s+4/);
    expect(text).not.toMatch(/\$\s?\d/); // no money at all [SUG: a packing slip carries no prices]
    // 866A is a mercury-vapour rectifier [MEM]: its caution is printed, naming the type; glass always is.
    expect(text).toMatch(/Mercury \(866A\)/);
    expect(text).toContain("Glass envelope");
    expect(text).toContain("licensed practice");
  }, 60_000);

  it("prints the buyer's address as the invoice recorded it on the invoice and the packing slip", async () => {
    const f = await invoicedLot([3_000, 2_500], items);
    // The snapshot the invoice keeps (an invented address; country by ISO 3166-1 alpha-2 [ISO-3166]).
    const address = {
      name: "Wren Hollow Estate",
      line1: "14 Lantern Row",
      line2: "",
      city: "Marrowby",
      region: "",
      postalCode: "MB4 2QT",
      country: "GB",
    };
    await db().query(`UPDATE invoices SET buyer_address = :a::jsonb WHERE id = :id`, {
      replacements: { a: JSON.stringify(address), id: f.invoiceId },
    });
    const invoice = await textOf(await get(invoicePdfRoute, `/api/invoices/${f.invoiceId}/pdf`, f.invoiceId, f.buyer));
    expect(invoice).toMatch(/bill to[\s\S]*Wren Hollow Estate[\s\S]*14 Lantern Row[\s\S]*Marrowby, MB4 2QT/i);
    expect(invoice).toContain("United Kingdom");
    const slip = await textOf(
      await get(packingSlipRoute, `/api/invoices/${f.invoiceId}/packing-slip`, f.invoiceId, f.buyer),
    );
    expect(slip).toMatch(/ship to[\s\S]*Wren Hollow Estate[\s\S]*14 Lantern Row/i);
  });

  it("prints the house as the sender: its trading name, street and town on the invoice and the packing slip", async () => {
    const f = await invoicedLot([3_000, 2_500], items);
    const invoice = await textOf(await get(invoicePdfRoute, `/api/invoices/${f.invoiceId}/pdf`, f.invoiceId, f.buyer));
    // The caption, then the house's block (its trading name in the block's own case, not the header's capitals).
    expect(invoice).toMatch(/^From\b/im);
    expect(invoice).toContain(HOUSE.name);
    expect(invoice).toContain(HOUSE.street);
    expect(invoice).toContain(HOUSE.town);
    expect(invoice).toContain("paperwork@house.getterline.test"); // [SUG] where paperwork questions go
    const slip = await textOf(
      await get(packingSlipRoute, `/api/invoices/${f.invoiceId}/packing-slip`, f.invoiceId, f.buyer),
    );
    expect(slip).toMatch(/^From\b/im);
    expect(slip).toContain(HOUSE.town);
    // The web invoice shows the same block to its buyer.
    const web = await getInvoice(viewerOf(f.buyer), f.invoiceId);
    expect(web.addresses.house).toEqual({
      name: HOUSE.name,
      lines: [
        "Flashfield Works, Unit 4",
        HOUSE.street,
        HOUSE.town,
        "United Kingdom",
        "paperwork@house.getterline.test",
      ],
    });
  }, 60_000);

  it("keeps a sale's papers on the house address frozen when it was scheduled; later sales print the new one", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lot = await approvedLot(consignor, admin, 2_000, items);
    const sale = await createSale(viewerOf(admin), {
      title: "Frozen address sale",
      startsAt: new Date(Date.now() - 60_000).toISOString(),
      firstCloseAt: new Date(Date.now() + 3_600_000).toISOString(),
      gapSeconds: 30,
      softCloseSeconds: 60,
      lots: [{ lotId: lot.id, openingCents: 1_000 }],
    });
    // The house moves after the sale is scheduled (an invented town).
    const now = await currentSettings();
    const moved = structuredClone(now.settings);
    moved.house.address = { ...moved.house.address, line2: "8 Mica Lane", city: "Emberton", postalCode: "EM2 9QX" };
    await changeSettings(viewerOf(admin), { settings: moved, reason: "The house moves to Emberton" });

    // The lot sells and is invoiced after the move: its papers still carry the address of the sale's version.
    const sl = await one<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, sale.id);
    const buyer = await makeUser(["dealer"]);
    await placeMaxBid(viewerOf(buyer), sl.id, 3_000, `w-${sl.id}`);
    await placeMaxBid(viewerOf(await makeUser(["dealer"])), sl.id, 2_500, `u-${sl.id}`);
    await db().query(`UPDATE sale_lots SET closes_at = now() - interval '1 second' WHERE id = :id`, {
      replacements: { id: sl.id },
    });
    expect(await closeSaleLot(sl.id)).toBe("closed");
    const { id: invoiceId } = await one<{ id: string }>(`SELECT id FROM invoices WHERE sale_lot_id = :id`, sl.id);
    const frozen = await textOf(await get(invoicePdfRoute, `/api/invoices/${invoiceId}/pdf`, invoiceId, buyer));
    expect(frozen).toContain(HOUSE.town);
    expect(frozen).not.toContain("Emberton");
    const slip = await textOf(await get(packingSlipRoute, "/x", invoiceId, buyer));
    expect(slip).toContain(HOUSE.town);
    expect(slip).not.toContain("Emberton");
    expect((await getInvoice(viewerOf(buyer), invoiceId)).addresses.house?.lines).toContain(HOUSE.town);

    // A sale scheduled after the move prints the new address.
    const later = await invoicedLot([3_000, 2_500]);
    const text = await textOf(await get(invoicePdfRoute, "/x", later.invoiceId, later.buyer));
    expect(text).toMatch(/8 Mica Lane[\s\S]*Emberton, EM2 9QX/);
    expect(text).not.toContain(HOUSE.town);
  }, 60_000);

  it("keeps the invoice papers to the buyer, the house and the claim's mediator (401/403/404)", async () => {
    const f = await invoicedLot([3_000, 2_500]);
    const url = `/api/invoices/${f.invoiceId}/pdf`;
    expect((await get(invoicePdfRoute, url, f.invoiceId)).status).toBe(401);
    const signedOut = await (await get(packingSlipRoute, url, f.invoiceId)).json();
    expect(signedOut.error.code).toBe("unauthenticated");
    // The consignor reads the web invoice but gets none of the buyer's papers.
    expect((await get(invoicePdfRoute, url, f.invoiceId, f.consignor)).status).toBe(403);
    expect((await get(packingSlipRoute, url, f.invoiceId, f.consignor)).status).toBe(403);
    // The under-bidder is a stranger to this invoice: its existence does not leak.
    expect((await get(invoicePdfRoute, url, f.invoiceId, f.under)).status).toBe(404);
    expect((await get(invoicePdfRoute, url, "not-a-uuid", f.buyer)).status).toBe(404);
    expect((await get(invoicePdfRoute, url, randomUUID(), f.buyer)).status).toBe(404);

    const mediator = await makeUser(["mediator"]);
    expect((await get(invoicePdfRoute, url, f.invoiceId, mediator)).status).toBe(404);
    await db().query(
      `INSERT INTO disputes (id, number, invoice_id, lot_id, buyer_id, consignor_id, reason, remedy, state, answer_due_at, mediator_id, taken_at, created_at, updated_at)
       VALUES (:id, :number, :invoice, :lot, :buyer, :consignor, 'misattributed', 'partial-refund', 'with-mediator', now(), :mediator, now(), now(), now())`,
      {
        replacements: {
          id: randomUUID(),
          number: `C-T-${Date.now()}`,
          invoice: f.invoiceId,
          lot: f.lotId,
          buyer: f.buyer.id,
          consignor: f.consignor.id,
          mediator: mediator.id,
        },
      },
    );
    expect((await get(invoicePdfRoute, url, f.invoiceId, mediator)).status).toBe(200);
    expect((await get(packingSlipRoute, url, f.invoiceId, mediator)).status).toBe(403);
  }, 60_000);

  it("prints a lot sheet carrying every item's type, its grades, the white getter and the cautions", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lot = await approvedLot(consignor, admin, 2_000, items);
    // Public: a listed lot's sheet is for anyone, as its page is.
    const text = await textOf(await get(lotSheetRoute, `/api/lots/${lot.id}/sheet`, lot.id));
    for (const t of ["12AX7", "866A", "6V6GT"]) expect(text).toContain(t);
    // Gm 1650 / 1620 of 1600 new: >= 100 % strong; 1100 / 1120: 69-70 %, fair (60-79 %) [CTP grading bands].
    expect(text).toMatch(/12AX7 family\s+2\s+2\s+1\s+0\s+1\s+0\s+0/);
    expect(text).toMatch(/6V6GT\s+1\s+Used\s+Unconfirmed\s+-\s+0\s+WHITE/); // the dead tube, flagged on its line
    expect(text).toContain("1 tube(s) show a white getter");
    expect(text).toContain("Mercury (866A)");
    expect(text).not.toContain(consignor.displayName); // the public reads the evidence, not who consigned it
    expect(text).not.toMatch(/Reserve/i);

    // A draft is its consignor's and the house's only.
    const draft = await createLot(viewerOf(consignor), {
      title: "Draft lot",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    });
    await addItem(viewerOf(consignor), draft.id, itemInput());
    expect((await get(lotSheetRoute, "/x", draft.id)).status).toBe(404);
    expect((await get(lotSheetRoute, "/x", draft.id, await makeUser(["dealer"]))).status).toBe(404);
    expect((await get(lotSheetRoute, "/x", draft.id, consignor)).status).toBe(200);
    expect((await get(lotSheetRoute, "/x", draft.id, admin)).status).toBe(200);
  }, 60_000);

  it("prints a sale's catalogue listing every lot, with estimates and openers but no reserve or consignor", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lots = [];
    for (let i = 0; i < 3; i++)
      lots.push(await approvedLot(consignor, admin, 2_000 + i * 1_000, items.slice(i, i + 1)));
    const sale = await createSale(viewerOf(admin), {
      title: "Catalogue test sale",
      startsAt: new Date(Date.now() + 3_600_000).toISOString(),
      firstCloseAt: new Date(Date.now() + 7_200_000).toISOString(),
      gapSeconds: 60,
      softCloseSeconds: 120,
      lots: lots.map((l, i) => ({ lotId: l.id, openingCents: 1_000 + i * 500 })),
    });
    const text = await textOf(await get(catalogueRoute, `/api/sales/${sale.id}/catalogue`, sale.id));
    expect(text).toContain("Sale catalogue: Catalogue test sale");
    for (const l of lots) expect(text).toContain(l.title);
    expect(text).toMatch(/Lots\s+3/);
    expect(text).toContain("2 tubes: 2 x 12AX7");
    // Estimates as the house set them (reserve x1 to x2 in the factory) and the openers, never the reserve line.
    expect(text).toContain(`${formatCents(2_000)}-${formatCents(4_000)}`);
    expect(text).toContain(formatCents(1_500)); // the second lot opens at $15.00, a figure no estimate holds
    expect(text).not.toMatch(/Reserve/i);
    expect(text).not.toContain(consignor.displayName);
    expect((await get(catalogueRoute, "/x", randomUUID())).status).toBe(404);
  }, 60_000);
});

function escape(s: string) {
  return s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}
