import AxeBuilder from "@axe-core/playwright";
import { expect, test } from "@playwright/test";
import { confirmAndSignIn, DEMO, expectHeading, signIn, submitSignUp } from "./helpers";

test.describe("sign-in lands each role on its home", () => {
  const cases = [
    { who: DEMO.admin, path: "/house", heading: /House desk/ },
    { who: DEMO.consignor, path: "/consignor", heading: /My consignments/ },
    { who: DEMO.dealer, path: "/dealer", heading: /Dealer desk/ },
    { who: DEMO.mediator, path: "/mediation", heading: /Mediation/ },
  ];
  for (const c of cases) {
    test(`${c.who} → ${c.path}`, async ({ page }) => {
      await signIn(page, c.who);
      await expect(page).toHaveURL(new RegExp(`${c.path}$`));
      await expectHeading(page, c.heading);
      await expect(page.getByRole("contentinfo").getByRole("link", { name: /Safety cautions/ })).toBeVisible();
    });
  }
});

test("a wrong password shows a clear message and stays on the form", async ({ page }) => {
  await signIn(page, DEMO.dealer, "not-the-password");
  await expect(page.getByRole("main").getByRole("alert")).toContainText("do not match an account");
  await expect(page).toHaveURL(/\/sign-in/);
});

test("a new dealer signs up, is kept out until the e-mailed link is followed, then lands on the dealer desk [OWASP-AUTH]", async ({
  page,
}) => {
  const account = {
    role: "dealer",
    name: "Tinplate Valve Exchange",
    email: `tinplate-${Date.now()}@example.test`,
    password: "a-long-password",
  } as const;
  await submitSignUp(page, account);
  await expect(page).toHaveURL(/\/sign-up$/);
  // Before the link: the right password is told to confirm the address first, and nothing opens.
  await signIn(page, account.email, account.password);
  await expect(page.getByRole("main").getByRole("alert")).toContainText("Confirm your e-mail address first");
  await expect(page).toHaveURL(/\/sign-in/);
  // Then the link, the confirm button, sign-in and the desk.
  await confirmAndSignIn(page, account);
  await expectHeading(page, /Dealer desk · Tinplate Valve Exchange/);
});

test("a dealer is kept out of the house's pages and API", async ({ page }) => {
  await signIn(page, DEMO.dealer);
  await expect(page).toHaveURL(/\/dealer$/);
  await page.goto("/house/users");
  await expect(page).toHaveURL(/\/forbidden$/);
  const res = await page.request.get("/api/admin/users");
  expect(res.status()).toBe(403);
  expect(await res.json()).toEqual({ error: { code: "forbidden", message: expect.any(String) } });
});

test("the house grants the mediator role from the accounts table", async ({ page }) => {
  await signIn(page, DEMO.admin);
  await expect(page).toHaveURL(/\/house$/);
  await page.goto("/house/users");
  await page.getByLabel("Find").fill("Northbank");
  const box = page.getByRole("checkbox", { name: "Mediator role for Northbank Valve Traders" });
  await box.check();
  await expect(page.getByRole("main").getByRole("status")).toContainText("Roles saved for Northbank Valve Traders");
  await expect(box).toBeChecked();
});

test("the cautions page is reachable from every page's footer and passes an accessibility scan", async ({ page }) => {
  await page.goto("/");
  await page
    .getByRole("contentinfo")
    .getByRole("link", { name: /Safety cautions/ })
    .click();
  await expectHeading(page, "Safety cautions");
  await expect(page.getByRole("heading", { name: "Beryllium-oxide ceramics" })).toBeVisible();
  const scan = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa"]).analyze();
  expect(scan.violations.map((v) => v.id)).toEqual([]);
});

test("the tenth rapid sign-in attempt on one account is refused with 429", async ({ page }) => {
  // An address of its own: failures count per address whether or not an account holds it, and a demo dealer
  // locked out here would fail the other specs that sign in as them.
  const who = "throttle-probe@dealer.getterline.test";
  const attempt = async () => {
    const { csrfToken } = (await (await page.request.get("/api/auth/csrf")).json()) as { csrfToken: string };
    return page.request.post("/api/auth/callback/credentials", {
      form: { email: who, password: "wrong-password", csrfToken, json: "true" },
      headers: { origin: new URL(page.url() === "about:blank" ? "http://localhost:3100" : page.url()).origin },
    });
  };
  for (let i = 1; i <= 9; i++) expect((await attempt()).status()).not.toBe(429);
  const tenth = await attempt();
  expect(tenth.status()).toBe(429);
  const body = (await tenth.json()) as { error: { code: string; message: string } };
  expect(body.error.code).toBe("rate_limited");
  expect(tenth.headers()["retry-after"]).toBeTruthy();

  // The form says so in words, even with the right password.
  await signIn(page, who);
  await expect(page.getByRole("main").getByRole("alert")).toContainText("Too many failed sign-in attempts");
});
