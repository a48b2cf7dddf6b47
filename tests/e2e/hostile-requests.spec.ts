import { expect, test, type Page } from "@playwright/test";
import { DEMO, signIn } from "./helpers";

/** Console errors and CSP violations a page reports while the test drives it. */
function watchConsole(page: Page): string[] {
  const problems: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error" || /Content Security Policy/i.test(m.text())) problems.push(m.text());
  });
  page.on("pageerror", (e) => problems.push(e.message));
  return problems;
}

test("pages carry a nonce-based CSP and still hydrate, with no CSP errors, signed out and signed in [SUG]", async ({
  page,
}) => {
  const problems = watchConsole(page);
  const res = await page.goto("/");
  const csp = res!.headers()["content-security-policy"] ?? "";
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(csp).toContain("frame-ancestors 'none'");
  expect(res!.headers()["permissions-policy"]).toContain("camera=()");
  // A second request gets a different nonce.
  const again = await page.request.get("/");
  expect(again.headers()["content-security-policy"]).not.toBe(csp);
  // Hydration: the sign-in form works only once React has hydrated it.
  await signIn(page, DEMO.dealer);
  await expect(page).toHaveURL(/\/dealer$/);
  await page.goto("/catalogue");
  await page.goto("/sales");
  const live = page.getByRole("link").filter({ hasText: /./ }).first();
  await expect(live).toBeVisible();
  await page.setViewportSize({ width: 1366, height: 900 });
  await page.screenshot({ path: "test-results/csp-dealer-1366.png" });
  await page.setViewportSize({ width: 390, height: 844 });
  await page.screenshot({ path: "test-results/csp-dealer-390.png" });
  expect(problems).toEqual([]);
});

test("hostile requests get 400 or 405 in the error shape, not a framework page [RFC-3986]", async ({ request }) => {
  for (const path of ["/api/sales/%zz", "/lots/%E0%A4%A"]) {
    const r = await request.get(path);
    expect(r.status()).toBe(400);
    expect(await r.json()).toEqual({ error: { code: "bad_request", message: expect.any(String) } });
    expect(r.headers()["permissions-policy"]).toBeTruthy();
  }
  for (const init of [
    { headers: { "content-type": "application/json" }, data: '{"email":"x@example.test"}' },
    { headers: { "content-type": "multipart/form-data; boundary=zz" }, data: "--zz\r\nbroken" },
    {},
  ]) {
    const r = await request.post("/api/auth/callback/credentials", init);
    expect(r.status()).toBe(400);
    expect((await r.json()).error.code).toBe("bad_request");
  }
});

// Against the production build: Next's compression layer sends the headers itself, and the guard still adds the body.
test("an unsupported method on an API route answers 405 in the error shape", async ({ request }) => {
  const r405 = await request.delete("/api/health");
  expect(r405.status()).toBe(405);
  expect(r405.headers()["content-type"]).toContain("application/json");
  expect(await r405.json()).toEqual({ error: { code: "method_not_allowed", message: "DELETE is not supported here" } });
});

test("a signed-in answer is private, no-store; a copied session stops working after sign-out [SUG]", async ({
  page,
  browser,
}) => {
  await signIn(page, DEMO.dealer);
  await expect(page).toHaveURL(/\/dealer$/);
  const signedIn = await page.request.get("/api/notices");
  expect(signedIn.status()).toBe(200);
  expect(signedIn.headers()["cache-control"]).toBe("private, no-store");
  const copied = (await page.context().cookies()).find((c) => c.name === "next-auth.session-token")!;
  // The copy, in another browser context, works while the owner is signed in…
  const other = await browser.newContext();
  await other.addCookies([copied]);
  expect((await other.request.get("/api/notices")).status()).toBe(200);
  // …and stops once the owner signs out.
  await page.getByRole("button", { name: "Sign out" }).filter({ visible: true }).click();
  await expect(page).toHaveURL(/\/$/);
  await expect.poll(async () => (await other.request.get("/api/notices")).status()).toBe(401);
  await other.close();
});

test("sign-up with an address that has an account says to check the mail, at phone and desk widths [SUG]", async ({
  page,
}) => {
  await page.goto("/sign-up");
  await page.getByLabel(/Buy as a dealer/).check();
  await page.getByLabel("Name or business name").fill("Second Try Traders");
  await page.getByLabel("E-mail").fill(DEMO.dealer);
  await page.getByLabel("Password").fill("not-their-password");
  await page.getByRole("button", { name: "Open account" }).click();
  await expect(page.getByRole("main").getByText(/Check your e-mail/)).toBeVisible();
  await expect(page).toHaveURL(/\/sign-up$/);
  await page.setViewportSize({ width: 1366, height: 900 });
  await page.screenshot({ path: "test-results/sign-up-known-1366.png", fullPage: true });
  await page.setViewportSize({ width: 390, height: 844 });
  await page.screenshot({ path: "test-results/sign-up-known-390.png", fullPage: true });
});
