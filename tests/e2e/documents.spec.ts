import { expect, test } from "@playwright/test";
import { DEMO, signedInPage } from "./helpers";

test("the public folder answers: favicon, robots rules and the web manifest with their content types", async ({
  request,
}) => {
  const ico = await request.get("/favicon.ico");
  expect(ico.status()).toBe(200);
  expect(ico.headers()["content-type"]).toBe("image/x-icon");
  // An ICO file starts with reserved 0 and type 1 (icon) [MEM: the ICO header].
  expect([...(await ico.body()).subarray(0, 4)]).toEqual([0, 0, 1, 0]);

  const robots = await request.get("/robots.txt");
  expect(robots.status()).toBe(200);
  expect(robots.headers()["content-type"]).toMatch(/^text\/plain/);
  const rules = await robots.text();
  for (const path of ["/api/", "/house", "/dealer", "/consignor", "/mediation", "/invoices"])
    expect(rules).toContain(`Disallow: ${path}`);
  expect(rules).toContain("Allow: /catalogue");
  expect(rules).toContain("Allow: /lots/");

  const manifest = await request.get("/manifest.webmanifest");
  expect(manifest.status()).toBe(200);
  expect(manifest.headers()["content-type"]).toMatch(/^application\/manifest\+json/);
  const m = await manifest.json();
  expect(m.name).toBe("Getterline");
  for (const icon of m.icons as { src: string; sizes: string }[]) {
    const r = await request.get(icon.src);
    expect(r.status(), icon.src).toBe(200);
    expect(r.headers()["content-type"]).toBe("image/png");
  }
  expect((await request.get("/apple-icon.png")).headers()["content-type"]).toBe("image/png");
});

test("a listed lot's page offers its lot sheet to anyone, as a PDF", async ({ page }) => {
  await page.goto("/catalogue");
  await page.getByTestId("catalogue-lot").first().getByRole("link").first().click();
  await page.waitForURL(/\/lots\/[0-9a-f-]{36}$/);
  const link = page.getByRole("link", { name: "Lot sheet (PDF)" });
  await expect(link).toBeVisible();
  const r = await page.request.get((await link.getAttribute("href"))!);
  expect(r.status()).toBe(200);
  expect(r.headers()["content-type"]).toBe("application/pdf");
  expect((await r.body()).subarray(0, 5).toString()).toBe("%PDF-");
});

test("the house desk counts its queues and each count opens its queue", async ({ browser }) => {
  const page = await signedInPage(browser, DEMO.admin);
  await page.goto("/house");
  await expect(page.getByRole("heading", { name: "Now" })).toBeVisible();
  for (const id of ["desk-review", "desk-sales", "desk-overdue", "desk-claims", "desk-reconciliation"])
    await expect(page.getByTestId(id)).toBeVisible();
  await page.getByTestId("desk-review").click();
  await expect(page).toHaveURL(/\/house\/review$/);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Review queue");
});
