import { expect, test } from "@playwright/test";
import pg from "pg";
import { DEMO, payWithTestCard, shipAndDeliver, signedInPage, soldToDealer } from "./helpers";

const DB = process.env.E2E_DATABASE_URL ?? "postgres://app@127.0.0.1:54329/getterline_e2e";

const as = signedInPage;

test("a winning dealer pays, the house ships and delivers, the window passes, the consignor's statement matches the invoice", async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const consignor = await as(browser, "odette@consignor.getterline.test");
  const house = await as(browser, DEMO.admin);
  const dealer = await as(browser, DEMO.dealer);

  // An approved lot offered in a sale; the dealer bids $150 (above the $80 reserve: price = reserve [CTP]) and wins.
  const title = `Escrow lot ${Date.now().toString(36)}`;
  const { saleId } = await soldToDealer(consignor, house, dealer, {
    title,
    reserveCents: 8_000,
    maxCents: 15_000,
    databaseUrl: DB,
  });

  await dealer.goto("/invoices");
  await dealer
    .getByRole("row", { name: new RegExp(title) })
    .getByRole("link")
    .click();
  const total = (await dealer.getByTestId("invoice-total").textContent())!;
  await payWithTestCard(dealer);
  const invoiceUrl = dealer.url();

  await shipAndDeliver(house, invoiceUrl, "DP000111222");

  // The clock moves past the inspection window; the house's sweeper releases escrow.
  const db = new pg.Client({ connectionString: DB });
  await db.connect();
  const invoiceId = invoiceUrl.split("/").pop()!;
  await db.query("UPDATE invoices SET inspection_ends_at = now() - interval '1 second' WHERE id = $1", [invoiceId]);
  const { rows } = await db.query("SELECT hammer_cents, commission_cents, total_cents FROM invoices WHERE id = $1", [
    invoiceId,
  ]);
  await db.end();
  await expect
    .poll(
      async () => {
        await house.reload();
        return house.getByTestId("invoice-state").textContent();
      },
      { timeout: 40_000, intervals: [2_000] },
    )
    .toBe("Released to the consignor");

  // The consignor's statement matches the invoice: hammer $80.00, commission 20 % = $16.00, payout $64.00 [SUG house tiers].
  const inv = rows[0] as { hammer_cents: number; commission_cents: number; total_cents: number };
  expect(inv.hammer_cents).toBe(8_000);
  expect(total).toBe(`$${(inv.total_cents / 100).toFixed(2)}`);
  const csv = await (await consignor.request.get(`/api/statements/${saleId}?format=csv`)).text();
  const line = csv.split("\r\n").find((l) => l.includes(title))!;
  expect(line).toContain("80.00");
  expect(line).toContain("16.00");
  expect(line).toContain("64.00");
  expect(line).toContain("released");
  const pdf = await consignor.request.get(`/api/statements/${saleId}?format=pdf`);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");
  expect((await pdf.body()).subarray(0, 4).toString()).toBe("%PDF");
});
