import { expect, test } from "@playwright/test";

test("a designation typed loosely is decoded with its published figures and equivalents", async ({ page }) => {
  await page.goto("/reference");
  await page.getByLabel("Designation", { exact: true }).fill("ecc 83");
  await page.getByRole("button", { name: "Look up" }).click();
  await expect(page.getByRole("heading", { name: "ECC83" })).toBeVisible();
  // [REG ✓] 12AX7/ECC83 at 250 V, −2 V: µ 100, Gm 1,600 µmho, Ip 1.2 mA
  await expect(page.getByText("Gm 1,600 µmho")).toBeVisible();
  await expect(page.getByRole("link", { name: "12AX7", exact: true })).toBeVisible();
  await expect(page.getByRole("row", { name: /5751.*Substitute with caveats/ })).toBeVisible();
});

test("a designation with no figures on file decodes by its scheme and offers the closest known ones", async ({
  page,
}) => {
  await page.goto("/reference?q=12AX8");
  // [LS53] 12 = 12.6 V heater class; no figures on file for 12AX8
  await expect(page.getByRole("heading", { name: "12AX8", exact: true })).toBeVisible();
  await expect(page.getByTestId("no-figures")).toContainText("Decoded by its scheme; no figures on file.");
  await page.getByTestId("no-figures").getByRole("link", { name: "12AX7", exact: true }).click();
  await expect(page.getByRole("heading", { name: "12AX7", exact: true })).toBeVisible();
});

test("what is not a designation answers with the closest known ones", async ({ page }) => {
  // [MEM] a US final number counts 1 to 12 elements; 77 cannot occur
  await page.goto("/reference?q=12AX77");
  await expect(page.getByRole("main").getByRole("status")).toContainText("does not occur");
  await page.getByRole("link", { name: "12AX7", exact: true }).click();
  await expect(page.getByRole("heading", { name: "12AX7", exact: true })).toBeVisible();
});

test("the reference page lists every source tag with its publication", async ({ page }) => {
  await page.goto("/reference");
  const sources = page.getByRole("region", { name: "Sources" });
  await expect(sources).toContainText("Radio Valve Data");
  await expect(sources).toContainText("EIA-476");
});

test("a single-digit-year code on a 12AX7 lists every decade since the type's introduction, none before", async ({
  page,
}) => {
  await page.goto("/reference");
  await page.getByLabel("Code off the glass").fill("943");
  await page.getByLabel("On type (optional)").fill("12AX7");
  await page.getByRole("button", { name: "Read the code" }).click();
  // [CTP] YWW ambiguity; 12AX7 introduced 1947 [MEM, secondary histories]
  const readings = page.getByRole("listitem").filter({ hasText: "week 43" });
  await expect(readings.filter({ hasText: "1949" })).toHaveCount(1);
  await expect(readings.filter({ hasText: "1959" })).toHaveCount(1);
  await expect(readings.filter({ hasText: "1939" })).toHaveCount(0);
});
