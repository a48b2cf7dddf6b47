import { io as connect, type Socket } from "socket.io-client";
import { afterAll, describe, expect, it, vi } from "vitest";
import { createSale, getSale } from "../../lib/services/sales";
import type { LotLive } from "../../lib/realtime/events";
import { approvedLot, makeUser, sessionCookie, viewerOf } from "../support/factories";
import { socketServer } from "../support/socket-server";

// [SUG] Our delivery rule: every watcher receives a lot's broadcasts exactly once each, in seq order, with no gap.
describe("ordered delivery across two instances", () => {
  const a = socketServer();
  const b = socketServer();
  const sockets: Socket[] = [];
  afterAll(() => {
    for (const s of sockets) s.close();
  });

  const open = async (url: string, cookie: string) => {
    const s = connect(url, {
      path: "/socket.io",
      transports: ["websocket"],
      extraHeaders: { cookie },
      reconnection: false,
    });
    sockets.push(s);
    await new Promise((r) => s.on("session.ready", r));
    return s;
  };

  it("concurrent bids through both instances reach watchers on both in seq order, each once", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lot = await approvedLot(consignor, admin, 1_000);
    const sale = await createSale(viewerOf(admin), {
      title: "Order sale",
      startsAt: new Date(Date.now() - 60_000).toISOString(),
      firstCloseAt: new Date(Date.now() + 3_600_000).toISOString(),
      gapSeconds: 30,
      softCloseSeconds: 60,
      lots: [{ lotId: lot.id, openingCents: 1_000 }],
    });
    const saleLotId = (await getSale(sale.id)).lots[0]!.saleLotId;

    // Four watchers, two on each instance, record every seq in arrival order (batched frames unpacked in order).
    const arrivals: number[][] = [];
    for (const url of [a.url, a.url, b.url, b.url]) {
      const w = await open(url, await sessionCookie(await makeUser(["dealer"])));
      const seen: number[] = [];
      arrivals.push(seen);
      w.on("lot.bid", (p: LotLive) => seen.push(p.seq));
      w.on("lot.batch", (p: { events: { live: LotLive }[] }) => {
        for (const e of p.events) seen.push(e.live.seq);
      });
      expect(await w.emitWithAck("room.join", { room: `lot:${saleLotId}` })).toEqual({ ok: true });
    }

    // Six dealers, three on each instance, each send eight rising ceilings at once.
    const dealers = await Promise.all(
      Array.from({ length: 6 }, async (_, i) =>
        open(i % 2 ? b.url : a.url, await sessionCookie(await makeUser(["dealer"]))),
      ),
    );
    const answers = await Promise.all(
      dealers.flatMap((d, i) =>
        Array.from({ length: 8 }, (_, k) =>
          d.emitWithAck("bid.place", {
            saleLotId,
            maxCents: 1_000 + (k * 6 + i + 1) * 500,
            idempotencyKey: `order-${i}-${k}`,
          }),
        ),
      ),
    );
    const accepted = answers.filter((x) => x.ok && x.result.accepted).length;
    expect(accepted).toBeGreaterThan(1);
    const { lots } = await getSale(sale.id);
    const last = lots[0]!.seq;
    expect(last).toBe(accepted);

    await vi.waitFor(
      () => {
        for (const seen of arrivals) expect(seen.length).toBe(last);
      },
      { timeout: 10_000, interval: 50 },
    );
    const inOrder = Array.from({ length: last }, (_, i) => i + 1);
    for (const seen of arrivals) expect(seen).toEqual(inOrder);
  });
});
