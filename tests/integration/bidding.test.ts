import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { replayBids, type ProxyState } from "../../lib/auction/proxy";
import { startQueue, stopQueue } from "../../lib/jobs/queue";
import { placeMaxBid } from "../../lib/services/bidding";
import { closeSaleLot, startClosingWorker } from "../../lib/services/lot-closing";
import { createSale } from "../../lib/services/sales";
import { db, User } from "../../models";
import { approvedLot, makeUser, untilClosingTimePassed, viewerOf, waitForSubject } from "../support/factories";
import { until } from "../support/wait";

async function saleWith(closeInMs: number, reserveCents = 5_000, softCloseSeconds = 120) {
  const admin = await makeUser(["admin"]);
  const consignor = await makeUser(["consignor"]);
  const lot = await approvedLot(consignor, admin, reserveCents);
  const now = Date.now();
  const sale = await createSale(viewerOf(admin), {
    title: "Test sale",
    startsAt: new Date(now - 60_000).toISOString(),
    firstCloseAt: new Date(now + closeInMs).toISOString(),
    gapSeconds: 30,
    softCloseSeconds,
    lots: [{ lotId: lot.id, openingCents: 1_000 }],
  });
  const [sl] = await db().query<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, {
    replacements: { id: sale.id },
    type: QueryTypes.SELECT,
  });
  return { saleLotId: sl!.id, consignor, admin };
}

describe("bidding under load (real PostgreSQL, row lock per lot)", () => {
  it("20 dealers × 50 bids at once end where the pure rules put them, with no gaps and no duplicates", async () => {
    const { saleLotId } = await saleWith(3_600_000, 5_000);
    const dealers = await Promise.all(Array.from({ length: 20 }, () => makeUser(["dealer"])));
    let accepted = 0;
    const keys: string[] = [];
    await Promise.all(
      dealers.map(async (d, di) => {
        for (let i = 0; i < 50; i++) {
          const key = `d${di}-b${i}`;
          keys.push(key);
          const max = 1_000 + (di * 50 + i) * 137 + ((di * 7919 + i * 104729) % 3000); // spread, overlapping maxima
          const r = await placeMaxBid(viewerOf(d), saleLotId, max, key);
          if (r.accepted) accepted++;
          if (i % 10 === 0) {
            // A client retry with the same key: the same answer, nothing new stored.
            const again = await placeMaxBid(viewerOf(d), saleLotId, max, key);
            if (r.accepted) expect(again).toMatchObject({ accepted: true, seq: r.seq, replayed: true });
          }
        }
      }),
    );
    const bids = await db().query<{
      seq: number;
      bidder_id: string;
      max_cents: number;
      placed_at: Date;
      idempotency_key: string;
    }>(
      `SELECT seq, bidder_id, max_cents, placed_at, idempotency_key FROM bids WHERE sale_lot_id = :saleLotId ORDER BY seq`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT },
    );
    expect(bids.length).toBe(accepted);
    expect(bids.map((b) => b.seq)).toEqual(Array.from({ length: bids.length }, (_, i) => i + 1)); // no gaps
    expect(new Set(bids.map((b) => `${b.bidder_id}:${b.idempotency_key}`)).size).toBe(bids.length); // no duplicates
    const [row] = await db().query<{ state: ProxyState; price_cents: number; leader_id: string; seq: number }>(
      `SELECT state, price_cents, leader_id, seq FROM sale_lots WHERE id = :saleLotId`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT },
    );
    const replayed = replayBids(
      row!.state.terms,
      bids.map((b) => ({
        bidderId: b.bidder_id,
        maxCents: b.max_cents,
        placedAtMs: b.placed_at.getTime(),
        seq: b.seq,
      })),
    );
    expect(row!.price_cents).toBe(replayed.priceCents);
    expect(row!.leader_id).toBe(replayed.leader!.bidderId);
    expect(row!.seq).toBe(bids.length);
  }, 120_000);

  it("gives 30 first-time bidders arriving at once 30 different paddle numbers", async () => {
    const { saleLotId } = await saleWith(3_600_000);
    const [{ sale_id: saleId }] = (await db().query<{ sale_id: string }>(
      `SELECT sale_id FROM sale_lots WHERE id = :saleLotId`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT },
    )) as [{ sale_id: string }];
    const { paddleFor } = await import("../../lib/services/paddles");
    const dealers = await Promise.all(Array.from({ length: 30 }, () => makeUser(["dealer"])));
    const numbers = await Promise.all(dealers.map((d) => paddleFor(saleId, d.id)));
    expect(new Set(numbers).size).toBe(30);
    expect(Math.min(...numbers)).toBe(101);
    expect(Math.max(...numbers)).toBe(130);
  });

  it("refuses the consignor's own bid and a bid below the minimum, with the reason", async () => {
    const { saleLotId, consignor } = await saleWith(3_600_000);
    const own = await placeMaxBid(viewerOf(consignor), saleLotId, 5_000, "own-1");
    expect(own).toMatchObject({ accepted: false, reason: "own-lot" });
    const d = await makeUser(["dealer"]);
    const low = await placeMaxBid(viewerOf(d), saleLotId, 500, "low-1");
    expect(low).toMatchObject({ accepted: false, reason: "below-minimum", minimumCents: 1_000 });
  });

  it("a bid in the final window moves the close to bid time + window [CTP soft close]", async () => {
    const { saleLotId } = await saleWith(30_000); // closes in 30 s, window 120 s
    const d = await makeUser(["dealer"]);
    const r = await placeMaxBid(viewerOf(d), saleLotId, 2_000, "late-1");
    expect(r.accepted && r.live.extended).toBe(true);
    const left = Date.parse(r.live.closesAt) - Date.now();
    expect(left).toBeGreaterThan(110_000);
    expect(left).toBeLessThanOrEqual(121_000);
  });
});

describe("closing", () => {
  beforeAll(async () => {
    await startQueue(process.env.DATABASE_URL!);
    await startClosingWorker();
  });
  afterAll(async () => {
    await stopQueue();
  });

  it("closes exactly once however many times it is asked, sells to the leader at the shown price and mails both sides", async () => {
    const { saleLotId, consignor } = await saleWith(3_000, 2_000, 1); // a 1 s late-bid window, so these early bids do not extend
    const a = await makeUser(["dealer"]);
    const b = await makeUser(["dealer"]);
    await placeMaxBid(viewerOf(a), saleLotId, 3_000, "a-1");
    await placeMaxBid(viewerOf(b), saleLotId, 2_500, "b-1"); // A leads; price = 2,500 + one increment (1-2-5 ladder: $1 under $20, $2 from $20) = 2,700
    await untilClosingTimePassed(saleLotId);
    const results = await Promise.all(Array.from({ length: 8 }, () => closeSaleLot(saleLotId)));
    expect(results.filter((x) => x === "closed").length).toBeLessThanOrEqual(1);
    const [row] = await db().query<{ phase: string; buyer_id: string; hammer_cents: number }>(
      `SELECT phase, buyer_id, hammer_cents FROM sale_lots WHERE id = :saleLotId`,
      { replacements: { saleLotId }, type: QueryTypes.SELECT },
    );
    expect(row).toMatchObject({ phase: "sold", buyer_id: a.id, hammer_cents: 2_700 });
    const winner = await User.findByPk(a.id);
    expect((await waitForSubject(winner!.email, /You won/)).text).toContain("$27.00");
    expect((await waitForSubject(winner!.email, /invoice/i)).text).toContain("/invoices/");
    expect((await waitForSubject(consignor.email, /^Sold/)).text).toContain("$27.00");
  });

  it("the job queue closes a lot at its time without anyone asking; no bids means unsold", async () => {
    const { saleLotId } = await saleWith(1_000);
    const { phase } = await until(
      async () =>
        (
          await db().query<{ phase: string; unsold_reason: string | null }>(
            `SELECT phase, unsold_reason FROM sale_lots WHERE id = :saleLotId`,
            { replacements: { saleLotId }, type: QueryTypes.SELECT },
          )
        )[0]!,
      (row) => row.phase !== "open",
      { timeout: 15_000, interval: 300 },
    );
    expect(phase).toBe("unsold");
  }, 30_000);
});
