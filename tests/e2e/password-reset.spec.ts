import { expect, test } from "@playwright/test";
import { DEMO, expectHeading, signIn } from "./helpers";

const INBOX = "http://127.0.0.1:2580/api/messages";

test("a forgotten password is reset through the e-mailed link", async ({ page, request }) => {
  const who = DEMO.mediator.replace("ines", "tomas");
  await page.goto("/forgot-password");
  await page.getByLabel("E-mail").fill(who);
  await page.getByRole("button", { name: "Send reset link" }).click();
  await expect(page.getByRole("main").getByRole("status")).toContainText("reset link is on its way");

  let link = "";
  await expect
    .poll(async () => {
      const mails = (await (await request.get(`${INBOX}?to=${encodeURIComponent(who)}`)).json()) as { text: string }[];
      link = mails[0]?.text.match(/https?:\/\/\S+token=[\w-]+/)?.[0] ?? "";
      return link;
    })
    .not.toBe("");

  await page.goto(link);
  await page.getByLabel("New password").fill("tomas-new-password");
  await page.getByLabel("The same again").fill("tomas-new-password");
  await page.getByRole("button", { name: "Set password" }).click();
  await expect(page.getByRole("main").getByRole("status")).toContainText("Your password is set");

  await signIn(page, who, "tomas-new-password");
  await expect(page).toHaveURL(/\/mediation$/);
  await expectHeading(page, /Mediation/);
});
