import { expect, type Browser, type Page } from "@playwright/test";
import pg from "pg";
import { BLANK_ITEM } from "../../lib/validation/lots";

/** Demo accounts seeded by seeders/20261201000100-demo-users.ts (README lists them). */
export const DEMO_PASSWORD = "valve-demo-2026";
export const DEMO = {
  admin: "priya@house.getterline.test",
  consignor: "voss-estate@consignor.getterline.test",
  dealer: "quill@dealer.getterline.test",
  mediator: "ines@mediator.getterline.test",
} as const;

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export async function expectHeading(page: Page, text: RegExp | string): Promise<void> {
  await expect(page.getByRole("heading", { level: 1 })).toContainText(text);
}

/** A new browser context signed in as this account, past the sign-in page. */
export async function signedInPage(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await signIn(page, email);
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  return page;
}

/** The mail catcher's messages to one address, newest first (the e2e services' port). */
export async function mailTo(to: string): Promise<{ subject: string; text: string }[]> {
  return (await (await fetch(`http://127.0.0.1:2580/api/messages?to=${encodeURIComponent(to)}`)).json()) as {
    subject: string;
    text: string;
  }[];
}

type NewAccount = { role: "dealer" | "consignor"; name: string; email: string; password: string };

/** The sign-up form filled and sent: it answers "check your e-mail" and signs nobody in. */
export async function submitSignUp(page: Page, a: NewAccount): Promise<void> {
  await page.goto("/sign-up");
  await page.getByLabel(a.role === "dealer" ? /Buy as a dealer/ : /Consign valves/).check();
  await page.getByLabel("Name or business name").fill(a.name);
  await page.getByLabel("E-mail").fill(a.email);
  await page.getByLabel("Password").fill(a.password);
  await page.getByRole("button", { name: "Open account" }).click();
  await expect(page.getByTestId("sign-up-sent")).toContainText("Check your e-mail");
}

/**
 * After one sign-up: the link e-mailed to the address, the confirm button, then sign-in; leaves the page on the
 * account's desk. (A second sign-up would replace the link, so this expects exactly one confirmation mail.)
 */
export async function confirmAndSignIn(page: Page, a: NewAccount): Promise<void> {
  let links: string[] = [];
  await expect
    .poll(async () => {
      links = (await mailTo(a.email))
        .filter((m) => m.subject.startsWith("Confirm your e-mail address"))
        .map((m) => m.text.match(/https?:\/\/\S+\/confirm-email\?token=[\w-]+/)?.[0] ?? "");
      return links.length;
    })
    .toBe(1);
  await page.goto(links[0]!.replace(/^https?:\/\/[^/]+/, ""));
  await page.getByRole("button", { name: "Confirm my address" }).click();
  await expect(page.getByRole("main").getByRole("status")).toContainText("Your address is confirmed");
  await signIn(page, a.email, a.password);
  await expect(page).toHaveURL(a.role === "dealer" ? /\/dealer$/ : /\/consignor$/);
}

/** A new account opened the way a person opens one: sign-up, the e-mailed link, sign-in. */
export async function openAccount(page: Page, a: NewAccount): Promise<void> {
  await submitSignUp(page, a);
  await confirmAndSignIn(page, a);
}

/** Fills the card form on an open invoice page with the fake's always-approved test card. */
export async function fillTestCard(page: Page, number = "4242 4242 4242 4242"): Promise<void> {
  await page.getByLabel("Card number").fill(number);
  await page.getByLabel("Expiry month").fill("12");
  await page.getByLabel("Expiry year").fill("2031");
  await page.getByLabel("Security code").fill("123");
}

/** The buyer pays the open invoice page with the fake's always-approved test card. */
export async function payWithTestCard(page: Page): Promise<void> {
  await fillTestCard(page);
  await page.getByRole("button", { name: "Pay now" }).click();
  await expect(page.getByTestId("invoice-state")).toHaveText("Paid, held by the house", { timeout: 15_000 });
}

/** The house records shipment and delivery on an invoice page; the inspection window opens. */
export async function shipAndDeliver(house: Page, invoiceUrl: string, tracking: string): Promise<void> {
  await house.goto(invoiceUrl);
  await house.getByLabel("Carrier").fill("Demo Parcel Co.");
  await house.getByLabel("Tracking number").fill(tracking);
  await house.getByRole("button", { name: "Mark shipped" }).click();
  await expect(house.getByTestId("invoice-state")).toHaveText("Shipped");
  await house.getByRole("button", { name: "Mark delivered" }).click();
  await expect(house.getByTestId("invoice-state")).toHaveText("Delivered, inspection open");
}

/**
 * The consignor lists one bundle of tubes, the house approves it and offers it in a one-lot sale, and the
 * dealer bids `maxCents`; the lot's close is then brought forward in the database (the clock moving on) and
 * the test waits for the dealer's invoice. Returns the sale and the invoice's id.
 */
export async function soldToDealer(
  consignor: Page,
  house: Page,
  dealer: Page,
  opts: { title: string; reserveCents: number; maxCents: number; databaseUrl: string },
) {
  const { title } = opts;
  const lot = (
    (await (
      await consignor.request.post("/api/lots", {
        data: { title, provenance: "", shippingOrigin: "", testerKind: "untested", testerNotes: "" },
      })
    ).json()) as { lot: { id: string } }
  ).lot;
  const item = {
    ...BLANK_ITEM,
    designation: "6SN7GT",
    quantity: 4,
    labelBrand: "Carrow Instruments",
  };
  expect((await consignor.request.post(`/api/lots/${lot.id}/items`, { data: item })).status()).toBe(201);
  expect((await consignor.request.post(`/api/lots/${lot.id}/submit`)).status()).toBe(200);
  expect(
    (
      await house.request.post(`/api/house/lots/${lot.id}/decision`, {
        data: {
          action: "approve",
          comment: "",
          estimateLowCents: 10_000,
          estimateHighCents: 20_000,
          reserveCents: opts.reserveCents,
          reserveAgreed: true,
        },
      })
    ).status(),
  ).toBe(200);
  const sale = (
    (await (
      await house.request.post("/api/sales", {
        data: {
          title: `Sale of ${title}`,
          startsAt: new Date(Date.now() - 60_000).toISOString(),
          firstCloseAt: new Date(Date.now() + 40_000).toISOString(),
          gapSeconds: 30,
          softCloseSeconds: 30,
          lots: [{ lotId: lot.id, openingCents: 2_000 }],
        },
      })
    ).json()) as { sale: { id: string } }
  ).sale;
  const saleLotId = (
    (await (await house.request.get(`/api/sales/${sale.id}`)).json()) as { lots: { saleLotId: string }[] }
  ).lots[0]!.saleLotId;
  expect(
    (
      await dealer.request.post(`/api/sale-lots/${saleLotId}/bids`, {
        data: { maxCents: opts.maxCents, idempotencyKey: `e2e-${saleLotId}` },
      })
    ).status(),
  ).toBe(200);
  const db = new pg.Client({ connectionString: opts.databaseUrl });
  await db.connect();
  await db.query("UPDATE sale_lots SET closes_at = now() WHERE id = $1", [saleLotId]);
  await db.end();
  let invoiceId = "";
  await expect
    .poll(
      async () => {
        const list = (
          (await (await dealer.request.get("/api/invoices")).json()) as { invoices: { id: string; title: string }[] }
        ).invoices;
        invoiceId = list.find((i) => i.title === title)?.id ?? "";
        return invoiceId;
      },
      { timeout: 40_000, intervals: [1_000] },
    )
    .not.toBe("");
  return { saleId: sale.id, saleLotId, invoiceId };
}
