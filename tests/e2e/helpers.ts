import { expect, type Browser, type Page } from "@playwright/test";

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

/** The buyer pays the open invoice page with the fake's always-approved test card. */
export async function payWithTestCard(page: Page): Promise<void> {
  await page.getByLabel("Card number").fill("4242 4242 4242 4242");
  await page.getByLabel("Expiry month").fill("12");
  await page.getByLabel("Expiry year").fill("2031");
  await page.getByLabel("Security code").fill("123");
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
