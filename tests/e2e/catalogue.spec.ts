// The market front as a new dealer meets it: a visitor searches the public catalogue by an equivalent name,
// opens a lot, signs in from it and lands back on it, saves the search as a want list; the house then approves
// a matching lot and the dealer sees the notice and gets the e-mail, whose stop link works without signing in.
// EL84 and 6BQ5 are one type under European and US names [makers' cross-reference tables, from memory].
import { expect, test, type Page } from "@playwright/test";
import { DEMO, DEMO_PASSWORD, signedInPage } from "./helpers";

const INBOX = "http://127.0.0.1:2580/api/messages";
const DEALER = "northbank@dealer.getterline.test";

async function listLot(
  consignor: Page,
  house: Page,
  title: string,
  designation: string,
  quantity: number,
): Promise<string> {
  const lot = (
    (await (
      await consignor.request.post("/api/lots", {
        data: {
          title,
          provenance: "An invented box for the catalogue test",
          shippingOrigin: "Demo county",
          testerKind: "untested",
          testerNotes: "",
        },
      })
    ).json()) as { lot: { id: string } }
  ).lot;
  const item = {
    designation,
    quantity,
    labelBrand: "Tri-County Parts",
    makerName: null,
    makerBasis: "unconfirmed",
    sourceCode: null,
    dateCode: null,
    features: {},
    condition: "new-old-stock",
    vacuumLoss: false,
    defects: [],
    hazards: [],
    readings: [],
    notes: "",
  };
  expect((await consignor.request.post(`/api/lots/${lot.id}/items`, { data: item })).status()).toBe(201);
  expect((await consignor.request.post(`/api/lots/${lot.id}/submit`)).status()).toBe(200);
  expect(
    (
      await house.request.post(`/api/house/lots/${lot.id}/decision`, {
        data: {
          action: "approve",
          comment: "",
          estimateLowCents: 6_000,
          estimateHighCents: 9_000,
          reserveCents: 6_000,
          reserveAgreed: true,
        },
      })
    ).status(),
  ).toBe(200);
  return lot.id;
}

test("a visitor finds a lot by an equivalent, signs in from it, saves a want list, and hears of the next matching lot", async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const run = Date.now().toString(36);
  const consignor = await signedInPage(browser, "marrow-creek@consignor.getterline.test");
  const house = await signedInPage(browser, DEMO.admin);
  const firstLot = await listLot(consignor, house, `Output valves ${run}`, "6BQ5", 4);

  // A visitor, not signed in, searches by the European name and is told how the lot's 6BQ5s relate.
  const visitor = await (await browser.newContext()).newPage();
  const errors: string[] = [];
  visitor.on("console", (m) => {
    if (m.type() === "error") errors.push(m.text());
  });
  await visitor.goto("/");
  await visitor.getByLabel("Search the catalogue by type, equivalent or words").fill("el 84");
  await visitor.getByRole("button", { name: "Search" }).click();
  await expect(visitor).toHaveURL(/\/catalogue\?q=el\+84/);
  const card = visitor.getByTestId("catalogue-lot").filter({ hasText: `Output valves ${run}` });
  await expect(card.getByTestId("lot-matches")).toContainText("4 × 6BQ5");
  await expect(card.getByTestId("lot-matches")).toContainText("same type, other name");
  await expect(visitor.locator("body")).not.toContainText("reserve");

  // The lot's page is open to the visitor; signing in from it comes back to it.
  await card.getByRole("link", { name: `Output valves ${run}` }).click();
  await expect(visitor).toHaveURL(new RegExp(`/lots/${firstLot}$`));
  await expect(visitor.getByRole("heading", { level: 1 })).toHaveText(`Output valves ${run}`);
  await visitor.getByRole("main").getByRole("link", { name: "Sign in" }).click();
  await visitor.getByLabel("E-mail").fill(DEALER);
  await visitor.getByLabel("Password").fill(DEMO_PASSWORD);
  await visitor.getByRole("button", { name: "Sign in" }).click();
  await expect(visitor).toHaveURL(new RegExp(`/lots/${firstLot}$`));

  // Signed in as a dealer, the same search offers a want list.
  await visitor.goto("/catalogue?q=el84");
  const save = visitor.getByRole("form", { name: "Save as a want list" });
  await save.getByLabel("Name of the list").fill(`Output pairs ${run}`);
  await save.getByLabel("At least this many tubes").fill("2");
  await save.getByRole("button", { name: "Save as a want list" }).click();
  await expect(save.getByRole("status")).toContainText("Saved.");
  await visitor.goto("/dealer/want-lists");
  await expect(visitor.getByTestId("want-list").filter({ hasText: `Output pairs ${run}` })).toContainText("2+ × EL84");

  // The house approves a matching lot: the dealer's notice arrives, and the digest e-mail.
  const secondLot = await listLot(consignor, house, `Console amplifier pulls ${run}`, "EL84", 6);
  // The match is a background job: wait for the notice on the dealer's own API, then for the bell, whose
  // count is fetched after the page hydrates (reading it straight after a reload would race that fetch).
  await expect
    .poll(
      async () => {
        const res = await visitor.request.get("/api/notices");
        const { notices } = (await res.json()) as { notices: { text: string; read: boolean }[] };
        return notices.some((n) => !n.read && n.text.includes(`Console amplifier pulls ${run}`));
      },
      { timeout: 30_000, intervals: [500, 1_000] },
    )
    .toBe(true);
  await visitor.reload();
  await expect(visitor.getByRole("button", { name: /Notices/ })).toHaveText(/Notices\s*\d/);
  await visitor.getByRole("button", { name: /Notices/ }).click();
  await expect(
    visitor.getByText(new RegExp(`Want list match: "Console amplifier pulls ${run}": 6 tubes`)),
  ).toBeVisible();

  let mail: { subject: string; text: string } | undefined;
  await expect
    .poll(
      async () => {
        const mails = (await (await fetch(`${INBOX}?to=${encodeURIComponent(DEALER)}`)).json()) as {
          subject: string;
          text: string;
        }[];
        mail = mails.find((m) => m.subject.startsWith("Want lists:") && m.text.includes(secondLot));
        return Boolean(mail);
      },
      { timeout: 30_000, intervals: [1_000] },
    )
    .toBe(true);
  expect(mail!.text).not.toContain(firstLot); // listed before the want list existed

  // The stop link works in a browser that is not signed in.
  const stop = mail!.text.match(/https?:\/\/\S+\/want-lists\/unsubscribe\?u=[\w-]+&t=[\w-]+/)![0];
  const stranger = await (await browser.newContext()).newPage();
  await stranger.goto(stop.replace(/^https?:\/\/[^/]+/, ""));
  await stranger.getByRole("button", { name: "Stop want-list e-mails" }).click();
  await expect(stranger.getByRole("status")).toContainText("no more want-list e-mails");
  expect(errors).toEqual([]);
});

test("the catalogue works at phone width: search, filters behind one button, lot cards with pictures", async ({
  browser,
}) => {
  const phone = await (await browser.newContext({ viewport: { width: 390, height: 844 } })).newPage();
  await phone.goto("/catalogue");
  await expect(phone.getByRole("heading", { name: "Catalogue", level: 1 })).toBeVisible();
  await expect(phone.getByText("Filters", { exact: true })).toBeVisible();
  const overflow = await phone.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
  expect(overflow).toBeLessThanOrEqual(0);
});
