import { expect, test } from "@playwright/test";
import pg from "pg";
import { DEMO, payWithTestCard, shipAndDeliver, signedInPage } from "./helpers";

const DB = process.env.E2E_DATABASE_URL ?? "postgres://app@127.0.0.1:54329/getterline_e2e";

const as = signedInPage;

test("a winning dealer pays, the house ships and delivers, the window passes, the consignor's statement matches the invoice", async ({ browser }) => {
  test.setTimeout(180_000);
  const consignor = await as(browser, "odette@consignor.getterline.test");
  const house = await as(browser, DEMO.admin);
  const dealer = await as(browser, DEMO.dealer);

  // An approved lot, offered in a sale that closes in 40 s (late-bid window 30 s).
  const title = `Escrow lot ${Date.now().toString(36)}`;
  const lot = ((await (await consignor.request.post("/api/lots", { data: { title, provenance: "", shippingOrigin: "", testerKind: "untested", testerNotes: "" } })).json()) as { lot: { id: string } }).lot;
  const item = { designation: "6SN7GT", quantity: 4, labelBrand: "Carrow Instruments", makerName: null, makerBasis: "unconfirmed", sourceCode: null, dateCode: null, features: {}, condition: "used", vacuumLoss: false, defects: [], hazards: [], readings: [], notes: "" };
  expect((await consignor.request.post(`/api/lots/${lot.id}/items`, { data: item })).status()).toBe(201);
  expect((await consignor.request.post(`/api/lots/${lot.id}/submit`)).status()).toBe(200);
  expect((await house.request.post(`/api/house/lots/${lot.id}/decision`, { data: { action: "approve", comment: "", estimateLowCents: 10_000, estimateHighCents: 20_000, reserveCents: 8_000, reserveAgreed: true } })).status()).toBe(200);
  const sale = ((await (await house.request.post("/api/sales", { data: { title: "Escrow sale", startsAt: new Date(Date.now() - 60_000).toISOString(), firstCloseAt: new Date(Date.now() + 40_000).toISOString(), gapSeconds: 30, softCloseSeconds: 30, lots: [{ lotId: lot.id, openingCents: 2_000 }] } })).json()) as { sale: { id: string } }).sale;
  const saleLotId = (((await (await house.request.get(`/api/sales/${sale.id}`)).json()) as { lots: { saleLotId: string }[] }).lots[0]!).saleLotId;

  // The dealer bids $150 (above the $80 reserve: price = reserve [CTP]) and wins when the lot closes.
  expect((await dealer.request.post(`/api/sale-lots/${saleLotId}/bids`, { data: { maxCents: 15_000, idempotencyKey: "escrow-e2e-1" } })).status()).toBe(200);
  await expect.poll(async () => ((await (await dealer.request.get("/api/invoices")).json()) as { invoices: { title: string }[] }).invoices.some((i) => i.title === title), { timeout: 75_000, intervals: [2_000] }).toBe(true);

  await dealer.goto("/invoices");
  await dealer.getByRole("row", { name: new RegExp(title) }).getByRole("link").click();
  const total = (await dealer.getByTestId("invoice-total").textContent())!;
  await payWithTestCard(dealer);
  const invoiceUrl = dealer.url();

  await shipAndDeliver(house, invoiceUrl, "DP000111222");

  // The clock moves past the inspection window; the house's sweeper releases escrow.
  const db = new pg.Client({ connectionString: DB });
  await db.connect();
  const invoiceId = invoiceUrl.split("/").pop()!;
  await db.query("UPDATE invoices SET inspection_ends_at = now() - interval '1 second' WHERE id = $1", [invoiceId]);
  const { rows } = await db.query("SELECT hammer_cents, commission_cents, total_cents FROM invoices WHERE id = $1", [invoiceId]);
  await db.end();
  await expect.poll(async () => { await house.reload(); return house.getByTestId("invoice-state").textContent(); }, { timeout: 40_000, intervals: [2_000] }).toBe("Released to the consignor");

  // The consignor's statement matches the invoice: hammer $80.00, commission 20 % = $16.00, payout $64.00 [SUG house tiers].
  const inv = rows[0] as { hammer_cents: number; commission_cents: number; total_cents: number };
  expect(inv.hammer_cents).toBe(8_000);
  expect(total).toBe(`$${(inv.total_cents / 100).toFixed(2)}`);
  const csv = await (await consignor.request.get(`/api/statements/${sale.id}?format=csv`)).text();
  const line = csv.split("\r\n").find((l) => l.includes(title))!;
  expect(line).toContain("80.00");
  expect(line).toContain("16.00");
  expect(line).toContain("64.00");
  expect(line).toContain("released");
  const pdf = await consignor.request.get(`/api/statements/${sale.id}?format=pdf`);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");
  expect((await pdf.body()).subarray(0, 4).toString()).toBe("%PDF");
});
