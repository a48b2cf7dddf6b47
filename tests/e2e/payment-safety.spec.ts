// Two browser tabs of one buyer pay the same invoice at the same moment: one charge is made, the other tab
// is told why in words, and the processor holds exactly one successful charge for the invoice.
import { expect, test } from "@playwright/test";
import { DEMO, fillTestCard, signedInPage, soldToDealer } from "./helpers";

const DB = process.env.E2E_DATABASE_URL ?? "postgres://app@127.0.0.1:54329/getterline_e2e";
const PROCESSOR = `http://127.0.0.1:${process.env.STRIPE_FAKE_PORT ?? "12121"}`;

test("two tabs pay one invoice at once: exactly one succeeds and the other is told why", async ({ browser }) => {
  test.setTimeout(120_000);
  const consignor = await signedInPage(browser, "marrow-creek@consignor.getterline.test");
  const house = await signedInPage(browser, DEMO.admin);
  const tabOne = await signedInPage(browser, "northbank@dealer.getterline.test");
  const title = `Two-tab lot ${Date.now().toString(36)}`;
  const { invoiceId } = await soldToDealer(consignor, house, tabOne, {
    title,
    reserveCents: 3_000,
    maxCents: 6_000,
    databaseUrl: DB,
  });

  const tabTwo = await tabOne.context().newPage(); // the same buyer's second tab
  const errors: string[] = [];
  for (const tab of [tabOne, tabTwo])
    tab.on("console", (m) => {
      if (m.type() === "error") errors.push(m.text());
    });
  for (const tab of [tabOne, tabTwo]) {
    await tab.goto(`/invoices/${invoiceId}`);
    await fillTestCard(tab);
  }
  await Promise.all([tabOne, tabTwo].map((tab) => tab.getByRole("button", { name: "Pay now" }).click()));

  for (const tab of [tabOne, tabTwo])
    await expect(tab.getByTestId("invoice-state")).toHaveText("Paid, held by the house", { timeout: 15_000 });
  const said = await Promise.all([tabOne, tabTwo].map((tab) => tab.getByRole("status").first().textContent()));
  expect(said.filter((t) => /Payment received/.test(t ?? ""))).toHaveLength(1);
  expect(said.filter((t) => /already been paid|already in progress/.test(t ?? ""))).toHaveLength(1);

  const charges = (await (
    await fetch(`${PROCESSOR}/v1/charges?limit=100`, {
      headers: { authorization: `Bearer ${process.env.STRIPE_SECRET_KEY}` },
    })
  ).json()) as { data: { status: string; metadata: Record<string, string> }[] };
  expect(charges.data.filter((c) => c.metadata.invoice_id === invoiceId && c.status === "succeeded")).toHaveLength(1);
  // The refused tab's 409 answer is logged by the browser as a failed resource; nothing else may be.
  expect(errors.filter((e) => !/status of 409/.test(e))).toEqual([]);
});
