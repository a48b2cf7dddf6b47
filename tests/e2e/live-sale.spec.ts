import { expect, test, type Browser, type Page } from "@playwright/test";
import { DEMO, signIn } from "./helpers";

async function as(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await signIn(page, email);
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  return page;
}

test("two dealers bid live: each sees the other within a second, the outbid one is told, a late bid extends the close for both", async ({ browser }) => {
  test.setTimeout(120_000);
  const house = await as(browser, DEMO.admin);
  const { lots } = (await (await house.request.get("/api/lots?scope=approved")).json()) as { lots: { id: string; title: string }[] };
  const lot = lots.find((l) => l.title.startsWith("Attic box"))!;
  const firstClose = new Date(Date.now() + 50_000); // inside the 60 s late-bid window from the start
  const created = await house.request.post("/api/sales", {
    data: { title: "Live test sale", startsAt: new Date(Date.now() - 60_000).toISOString(), firstCloseAt: firstClose.toISOString(), gapSeconds: 30, softCloseSeconds: 60, lots: [{ lotId: lot.id, openingCents: 10_000 }] },
  });
  expect(created.status()).toBe(201);
  const { sale } = (await created.json()) as { sale: { id: string } };
  const { lots: saleLots } = (await (await house.request.get(`/api/sales/${sale.id}`)).json()) as { lots: { saleLotId: string }[] };
  const url = `/sales/${sale.id}/lots/${saleLots[0]!.saleLotId}`;

  const a = await as(browser, DEMO.dealer); // Quill & Cathode
  const b = await as(browser, "bellweather@dealer.getterline.test");
  for (const p of [a, b]) {
    await p.goto(url);
    await expect(p.getByTestId("live-link")).toHaveAttribute("data-connected", "true");
  }
  const closeBefore = await b.locator("time").first().getAttribute("datetime");

  // A bids; B sees it within a second. Max $700 reaches the $500 reserve, so the price is the reserve [CTP].
  await a.getByLabel("Your maximum ($)").fill("700");
  await a.getByRole("button", { name: "Place bid" }).click();
  await expect(a.getByRole("main").getByRole("status").or(a.getByRole("main").getByRole("alert")).first()).toContainText("you lead");
  await expect(b.getByTestId("live-price")).toHaveText("$500.00", { timeout: 1_000 });
  // The bid came inside the final minute window: the close moved, for both.
  await expect(b.getByText(/A late bid extended the close/)).toBeVisible();
  expect(Date.parse((await b.locator("time").first().getAttribute("datetime"))!)).toBeGreaterThan(Date.parse(closeBefore!));

  // B outbids: price = A's max + one increment at that level ($50 from $500) = $750 [CTP proxy rule, 1-2-5 ladder].
  await b.getByLabel("Your maximum ($)").fill("800");
  await b.getByRole("button", { name: "Place bid" }).click();
  await expect(a.getByTestId("live-price")).toHaveText("$750.00", { timeout: 1_000 });
  await expect(a.getByText(/You were outbid/).first()).toBeVisible({ timeout: 5_000 });
  await expect(a.getByTestId("standing")).toContainText("outbid");
  await expect(b.getByTestId("standing")).toContainText("You lead");
});
