import { expect, test, type Browser, type Page } from "@playwright/test";
import { DEMO, DEMO_PASSWORD, signIn } from "./helpers";

async function as(browser: Browser, email: string, viewport?: { width: number; height: number }): Promise<Page> {
  const page = await (await browser.newContext(viewport ? { viewport } : {})).newPage();
  await signIn(page, email);
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  return page;
}

test("two dealers bid live; the panel never contradicts itself; after the close the loser reads the outcome; phone board, sign-in return and the consignor's net", async ({
  browser,
}) => {
  test.setTimeout(200_000);
  const errors: string[] = [];
  const house = await as(browser, DEMO.admin);
  const { lots } = (await (await house.request.get("/api/lots?scope=approved")).json()) as {
    lots: { id: string; title: string }[];
  };
  const lot = lots.find((l) => l.title.startsWith("Attic box"))!;
  const firstClose = new Date(Date.now() + 30_000); // the bids below fall inside its 30 s late-bid window
  const created = await house.request.post("/api/sales", {
    data: {
      title: "Live test sale",
      startsAt: new Date(Date.now() - 60_000).toISOString(),
      firstCloseAt: firstClose.toISOString(),
      gapSeconds: 30,
      softCloseSeconds: 30,
      lots: [{ lotId: lot.id, openingCents: 10_000 }],
    },
  });
  expect(created.status()).toBe(201);
  const { sale } = (await created.json()) as { sale: { id: string } };
  const { lots: saleLots } = (await (await house.request.get(`/api/sales/${sale.id}`)).json()) as {
    lots: { saleLotId: string }[];
  };
  const saleLotId = saleLots[0]!.saleLotId;
  const url = `/sales/${sale.id}/lots/${saleLotId}`;

  // A signed-out visitor following a link to the lot signs in and lands back on the lot.
  const visitor = await (await browser.newContext()).newPage();
  await visitor.goto(url);
  await expect(visitor).toHaveURL(/\/sign-in\?callbackUrl=/);
  await visitor.getByLabel("E-mail").fill(DEMO.dealer);
  await visitor.getByLabel("Password").fill(DEMO_PASSWORD);
  await visitor.getByRole("button", { name: "Sign in" }).click();
  await visitor.waitForURL((u) => u.pathname === url);
  const a = visitor; // Quill & Cathode
  const b = await as(browser, "bellweather@dealer.getterline.test");
  for (const p of [a, b]) {
    p.on("console", (m) => {
      if (m.type() === "error") errors.push(m.text());
    });
    p.on("pageerror", (e) => errors.push(e.message));
    await p.goto(url);
    await expect(p.getByTestId("live-link")).toHaveAttribute("data-connected", "true");
    await expect(p.getByTestId("standing")).toHaveAttribute("data-standing", "not-bid");
  }
  const closeBefore = await b.getByTestId("live-left").locator("xpath=..").locator("time").getAttribute("datetime");

  // A bids; B sees it within a second. Ceiling $700 reaches the $500 reserve, so the price is the reserve [CTP].
  await a.getByLabel("Your ceiling ($)").fill("700");
  await a.getByRole("button", { name: "Bid", exact: true }).click();
  await expect(a.getByTestId("standing")).toHaveAttribute("data-standing", "leading");
  await expect(a.getByTestId("standing")).toContainText("You hold this lot");
  await expect(b.getByTestId("live-price")).toHaveText("$500.00", { timeout: 1_000 });
  await expect(b.getByText(/A late bid moved the close/)).toBeVisible();
  expect(
    Date.parse((await b.getByTestId("live-left").locator("xpath=..").locator("time").getAttribute("datetime"))!),
  ).toBeGreaterThan(Date.parse(closeBefore!));

  // B passes A: price = A's ceiling + one step at that level ($50 from $500) = $750 [CTP proxy rule, 1-2-5 ladder].
  await b.getByLabel("Your ceiling ($)").fill("800");
  await b.getByRole("button", { name: "Bid", exact: true }).click();
  await expect(a.getByTestId("live-price")).toHaveText("$750.00", { timeout: 1_000 });
  // A's panel now says one thing only: another dealer is ahead (the earlier "you hold" is gone).
  await expect(a.getByTestId("standing")).toHaveAttribute("data-standing", "outbid");
  await expect(a.getByTestId("standing")).not.toContainText("You hold");
  await expect(a.getByText(/Another dealer is ahead on/).first()).toBeVisible({ timeout: 5_000 });
  await expect(b.getByTestId("standing")).toHaveAttribute("data-standing", "leading");

  // The leader raising their own ceiling is private [SUG]: B is told, the price and the public trail do not change.
  const trailBefore = await a.getByTestId("bid-trail").locator("li").count();
  await b.getByLabel("Your ceiling ($)").fill("900");
  await b.getByRole("button", { name: "Bid", exact: true }).click();
  await expect(b.getByTestId("standing")).toContainText("Your ceiling raised");
  await expect(b.getByTestId("live-bids")).toHaveText("2");
  await a.reload();
  await expect(a.getByTestId("bid-trail").locator("li")).toHaveCount(trailBefore);
  await expect(a.getByTestId("live-price")).toHaveText("$750.00");

  // At phone width the sale board shows each lot's time left on screen.
  const phone = await as(browser, DEMO.dealer, { width: 390, height: 844 });
  await phone.goto(`/sales/${sale.id}`);
  await expect(phone.getByTestId(`left-${saleLotId}`)).toBeInViewport();
  await expect(phone.getByTestId(`left-${saleLotId}`)).toHaveText(/\d+ s|\d+ min/);
  await expect(phone.getByRole("button", { name: "Menu" })).toBeVisible();

  // After the close: the loser reads the outcome, with no bid form and no countdown.
  await expect(a.getByTestId("standing")).toHaveAttribute("data-standing", "lost", { timeout: 90_000 });
  await expect(a.getByTestId("standing")).toContainText("Closed: not yours");
  await expect(a.getByTestId("standing")).toContainText("$750.00");
  await expect(a.getByLabel("Your ceiling ($)")).toHaveCount(0);
  await expect(a.getByTestId("live-left")).toHaveText("Sold for $750.00");
  await expect(a.getByText("Another dealer is ahead", { exact: true })).toHaveCount(0);
  await expect(b.getByTestId("standing")).toHaveAttribute("data-standing", "won");
  expect(errors.filter((e) => /hydrat|#418|#423/i.test(e))).toEqual([]);

  // The consignor sees the sold lot's net: $750.00 hammer − marginal commission (20 % of $500 + 15 % of $250 = $137.50) = $612.50 [SUG house tiers].
  const consignor = await as(browser, DEMO.consignor);
  await expect
    .poll(
      async () => {
        await consignor.goto("/consignor");
        return consignor.getByTestId(`net-${lot.id}`).textContent();
      },
      { timeout: 30_000, intervals: [1_000] },
    )
    .toBe("$612.50");
  await expect(consignor.locator("table").getByTestId(`stage-${lot.id}`)).toHaveText("Sold, buyer paying");
});
