import { expect, test, type Browser, type Page } from "@playwright/test";
import sharp from "sharp";
import { DEMO, openAccount, signIn } from "./helpers";

const HEADER = "designation,qty,label,condition,measure,section_1,section_2,chart_new";
// Readings are invented demo data; 1,600 µmho is the 12AX7's registered Gm [REG ✓], used as the chart value.
const good = Array.from(
  { length: 28 },
  (_, i) => `12AX7,1,Fairmont Home Radio,used,gm,${1450 + i * 10},${1440 + i * 10},1600`,
);
const withTwoBad = [
  HEADER,
  ...good.slice(0, 10),
  "12AU7,1,Tri-County Parts,used,gm,abc,,2200",
  ...good.slice(10, 20),
  "6SN7GT,1,,mint,gm,2600,2500,2600",
  ...good.slice(20),
].join("\n");
const fixed = [
  HEADER,
  ...good.slice(0, 10),
  "12AU7,1,Tri-County Parts,used,gm,2100,2150,2200",
  ...good.slice(10, 20),
  "6SN7GT,1,,nos,gm,2600,2500,2600",
  ...good.slice(20),
].join("\n");

async function as(browser: Browser, email: string, password?: string): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page, email, password);
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  return page;
}

test("a consignor lists a box, the house asks for a change and approves, a dealer reads the summary", async ({
  browser,
}) => {
  test.setTimeout(240_000);
  // A new consignor opens an account.
  const consignor = await (await browser.newContext()).newPage();
  const email = `estate-${Date.now()}@example.test`;
  await openAccount(consignor, {
    role: "consignor",
    name: "Estate of Wren Hollis",
    email,
    password: "a-long-password",
  });

  await consignor.getByRole("link", { name: "Start a lot" }).click();
  await consignor.getByLabel("Title").fill("Workshop box: 32 small-signal valves");
  await consignor
    .getByLabel("Where the tubes came from, in your words")
    .fill("A retired technician's workshop shelves.");
  await consignor.getByLabel("How were they tested?").selectOption("mutual-conductance");
  await consignor.getByRole("button", { name: "Start the lot" }).click();
  await expect(consignor).toHaveURL(/\/consignor\/lots\/[0-9a-f-]{36}$/);
  const lotId = consignor.url().split("/").pop()!;

  // Two items by hand; an 866A (mercury-vapour rectifier) brings its handling caution onto the page.
  for (const [designation, qty] of [
    ["6sn7gt", "1"],
    ["866A", "1"],
  ] as const) {
    await consignor.getByRole("button", { name: "Add an item" }).click();
    await consignor.getByLabel("Designation as printed").fill(designation);
    await consignor.getByLabel("Quantity", { exact: true }).fill(qty);
    await consignor.getByLabel("Label as printed").fill("Carrow Instruments");
    await consignor.getByRole("button", { name: "Add item" }).click();
    await expect(consignor.getByRole("button", { name: "Add an item" })).toBeVisible();
  }
  await expect(consignor.getByText("2 lines · 2 tubes")).toBeVisible();
  await expect(consignor.getByRole("note").filter({ hasText: "866A" })).toContainText("Mercury");

  // Thirty from a CSV with two bad rows: reported by line, fixed, imported.
  await consignor
    .getByLabel("CSV file", { exact: true })
    .setInputFiles({ name: "box.csv", mimeType: "text/csv", buffer: Buffer.from(withTwoBad) });
  await consignor.getByRole("button", { name: "Check the file" }).click();
  const problems = consignor.getByRole("alert").filter({ hasText: "Fix these" });
  await expect(problems).toContainText("Line 12");
  await expect(problems).toContainText("Line 23");
  await expect(consignor.getByRole("button", { name: /^Import/ })).toBeDisabled();
  await consignor
    .getByLabel("CSV file", { exact: true })
    .setInputFiles({ name: "box-fixed.csv", mimeType: "text/csv", buffer: Buffer.from(fixed) });
  await consignor.getByRole("button", { name: "Check the file" }).click();
  await consignor.getByRole("button", { name: "Import 30 rows" }).click();
  await expect(consignor.getByText("Imported 30 rows")).toBeVisible();
  await expect(consignor.getByText("32 lines · 32 tubes")).toBeVisible();

  // A photo of the box.
  const png = await sharp({ create: { width: 400, height: 300, channels: 3, background: "#777" } })
    .png()
    .toBuffer();
  await consignor.getByLabel("Choose photos").setInputFiles({ name: "box.png", mimeType: "image/png", buffer: png });
  await expect(consignor.getByRole("img", { name: /Photo of the lot/ })).toBeVisible();

  await consignor.getByRole("button", { name: "Submit for review" }).click();
  await expect(consignor.getByText("With the house")).toBeVisible();

  // A dealer cannot see it before approval.
  const dealer = await as(browser, DEMO.dealer);
  const hidden = await dealer.goto(`/lots/${lotId}`);
  expect(hidden?.status()).toBe(404);

  // The house asks for a change.
  const house = await as(browser, DEMO.admin);
  await house.goto("/house/review");
  await house.getByRole("link", { name: "Workshop box: 32 small-signal valves" }).click();
  await expect(house.getByText("Tubes").first()).toBeVisible();
  await house.getByLabel("Ask the consignor for changes").check();
  await house
    .getByLabel("Comment to the consignor")
    .fill("Line 1 is a pair, not a single: please correct the quantity.");
  await house.getByRole("button", { name: "Send back for changes" }).click();
  await expect(house).toHaveURL(/\/house\/review$/);

  // The consignor makes it and resubmits.
  await consignor.reload();
  await expect(consignor.getByRole("main").getByRole("alert").filter({ hasText: "asked for changes" })).toContainText(
    "Line 1 is a pair",
  );
  const qty = consignor.getByLabel("Quantity of 6SN7GT, line 1");
  await qty.fill("2");
  await qty.blur();
  await expect(consignor.getByText("32 lines · 33 tubes")).toBeVisible();
  await consignor.getByRole("button", { name: "Resubmit for review" }).click();
  await expect(consignor.getByText("With the house")).toBeVisible();

  // The house approves with an estimate and the agreed reserve.
  await house.goto(`/house/lots/${lotId}`);
  await house.getByLabel("Approve for sale").check();
  await house.getByLabel("Low estimate ($)").fill("300");
  await house.getByLabel("High estimate ($)").fill("500");
  await house.getByLabel("Reserve ($), hidden from bidders").fill("200");
  await house.getByLabel("The consignor has agreed this reserve").check();
  await house.getByRole("button", { name: "Approve and lock the lot" }).click();
  await expect(house).toHaveURL(/\/house\/review$/);

  // The dealer reads the lot page, summary first; the reserve is not shown.
  await dealer.goto(`/lots/${lotId}`);
  await expect(dealer.getByRole("heading", { name: "Workshop box: 32 small-signal valves" })).toBeVisible();
  const summary = dealer.getByRole("region", { name: "Summary" });
  await expect(summary.locator("dt", { hasText: /^Tubes$/ }).locator("xpath=following-sibling::dd")).toHaveText("33");
  await expect(summary.getByRole("cell", { name: "12AX7 family" })).toBeVisible();
  await expect(dealer.getByText("$300.00–$500.00")).toBeVisible();
  await expect(dealer.getByText("reserve", { exact: false }).filter({ hasText: "$200" })).toHaveCount(0);
  await expect(dealer.getByRole("img", { name: /Photo of the lot/ })).toBeVisible();
});
