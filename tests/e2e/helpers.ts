import { expect, type Page } from "@playwright/test";

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
