import { expect, test } from "@playwright/test";
import { DEMO, expectHeading, signedInPage } from "./helpers";

// KT61 follows neither the US nor the European numbering scheme [LS53, PE], so until the house
// lists it, a lot carrying it asks dealers to check the type. The figures the house enters here are
// left empty on purpose: no data sheet is named, so no figure is invented.
test("the house adds a type, and a consignor's lot stops flagging it", async ({ browser }) => {
  test.setTimeout(120_000);
  const consignor = await signedInPage(browser, DEMO.consignor);
  await consignor.goto("/consignor");
  await consignor.getByRole("link", { name: "Start a lot" }).click();
  await consignor.getByLabel("Title").fill("Drawer of output valves");
  await consignor.getByLabel("Where the tubes came from, in your words").fill("The bottom drawer of the attic bench.");
  await consignor.getByLabel("How were they tested?").selectOption("mutual-conductance");
  await consignor.getByRole("button", { name: "Start the lot" }).click();
  await expect(consignor).toHaveURL(/\/consignor\/lots\/[0-9a-f-]{36}$/);

  await consignor.getByRole("button", { name: "Add an item" }).click();
  await consignor.getByLabel("Designation as printed").fill("KT61");
  await consignor.getByLabel("Quantity", { exact: true }).fill("2");
  await consignor.getByRole("button", { name: "Add item" }).click();
  await expect(consignor.getByRole("button", { name: "Add an item" })).toBeVisible();
  const line = consignor.getByRole("row").filter({ hasText: "KT61" }).filter({ hasNotText: "lines ·" });
  await expect(line).toContainText("check type");

  // The reference page answers "not a designation" and offers close listed types.
  const house = await signedInPage(browser, DEMO.admin);
  await house.goto("/reference?q=KT61");
  await expect(house.getByRole("main").getByRole("status")).toBeVisible();

  // The house adds the type.
  await house.goto("/house/reference/new?d=KT61");
  await expectHeading(house, "Add a type");
  await expect(house.getByLabel("Designation")).toHaveValue("KT61");
  await house.getByLabel("Kind").selectOption("beam-tetrode");
  await house.getByLabel("Base").selectOption("octal");
  await house.getByLabel("Source tag").fill("MEM");
  await house.getByLabel("Why add it").fill("Turns up in estate boxes; figures to follow from a data sheet");
  await house.getByRole("button", { name: "Add type" }).click();
  await expect(house).toHaveURL(/\/house\/reference\/KT61$/);
  await expectHeading(house, "KT61");
  await expect(house.getByText("Not yet checked against a data sheet.")).toBeVisible();

  // The consignor's lot no longer asks for a check, without the item being touched.
  await consignor.reload();
  await expect(consignor.getByRole("row").filter({ hasText: "KT61" }).filter({ hasNotText: "lines ·" })).toBeVisible();
  await expect(
    consignor.getByRole("row").filter({ hasText: "KT61" }).filter({ hasNotText: "lines ·" }),
  ).not.toContainText("check type");

  // And the public reference page now has it on file, with its source.
  await house.goto("/reference?q=KT61");
  await expect(house.getByRole("heading", { name: "KT61", exact: true })).toBeVisible();
  await expect(house.getByText("from memory (verify)").first()).toBeVisible();
});
