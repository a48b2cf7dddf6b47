import http from "node:http";
import type { AddressInfo } from "node:net";
import { io as connect, type Socket } from "socket.io-client";
import { describe, expect, it, vi } from "vitest";
import { gracefulShutdown } from "../../server/shutdown";
import { createSale, getSale } from "../../lib/services/sales";
import { approvedLot, makeUser, sessionCookie, viewerOf } from "../support/factories";
import { socketServer } from "../support/socket-server";
import { until } from "../support/wait";

describe("socket.io handshake uses the same guard as the routes", () => {
  const live = socketServer();

  const open = (cookie?: string): Socket =>
    connect(live.url, {
      path: "/socket.io",
      transports: ["websocket"],
      extraHeaders: cookie ? { cookie } : {},
      reconnection: false,
    });

  it("refuses a connection without a session", async () => {
    const s = open();
    const err = await new Promise<Error>((r) => s.on("connect_error", r));
    expect(err.message).toBe("unauthenticated");
    s.close();
  });

  it("refuses another site's Origin even with a dealer's cookie, and admits the app's own [SUG]", async () => {
    const dealer = await makeUser(["dealer"]);
    const cookie = await sessionCookie(dealer);
    for (const origin of ["https://elsewhere.example", "null"]) {
      const s = connect(live.url, {
        path: "/socket.io",
        transports: ["websocket"],
        extraHeaders: { cookie, origin },
        reconnection: false,
      });
      const err = await new Promise<Error>((r) => s.on("connect_error", r));
      expect(err).toBeInstanceOf(Error);
      expect(s.connected).toBe(false);
      s.close();
    }
    const own = connect(live.url, {
      path: "/socket.io",
      transports: ["websocket"],
      extraHeaders: { cookie, origin: live.url },
      reconnection: false,
    });
    const ready = await new Promise<{ userId: string }>((r) => own.on("session.ready", r));
    expect(ready.userId).toBe(dealer.id);
    own.close();
  });

  it("admits a signed-in dealer, tells it who it is, and lets it join only public rooms", async () => {
    const dealer = await makeUser(["dealer"]);
    const s = open(await sessionCookie(dealer));
    const ready = await new Promise<{ userId: string; roles: string[] }>((r) => s.on("session.ready", r));
    expect(ready).toEqual({ userId: dealer.id, roles: ["dealer"] });
    expect(await s.emitWithAck("room.join", { room: "lot:42" })).toEqual({ ok: true });
    expect((await s.emitWithAck("room.join", { room: `user:${dealer.id}x` })).ok).toBe(false);
    s.close();
  });
});

describe("bids over the socket", () => {
  const live = socketServer();

  it("places a bid with the same rules and answers as the route; a consignor and a bad payload are refused", async () => {
    const admin = await makeUser(["admin"]);
    const consignor = await makeUser(["consignor"]);
    const lot = await approvedLot(consignor, admin, 2_000);
    const sale = await createSale(viewerOf(admin), {
      title: "Socket sale",
      startsAt: new Date(Date.now() - 60_000).toISOString(),
      firstCloseAt: new Date(Date.now() + 3_600_000).toISOString(),
      gapSeconds: 30,
      softCloseSeconds: 120,
      lots: [{ lotId: lot.id, openingCents: 1_000 }],
    });
    const { lots } = await getSale(sale.id);
    const saleLotId = lots[0]!.saleLotId;
    const open = async (cookie: string) => {
      const s = connect(live.url, {
        path: "/socket.io",
        transports: ["websocket"],
        extraHeaders: { cookie },
        reconnection: false,
      });
      await new Promise((r) => s.on("session.ready", r));
      return s;
    };
    const dealer = await makeUser(["dealer"]);
    const ds = await open(await sessionCookie(dealer));
    const ok = await ds.emitWithAck("bid.place", { saleLotId, maxCents: 3_000, idempotencyKey: "socket-bid-1" });
    expect(ok).toMatchObject({ ok: true, result: { accepted: true, seq: 1, leading: true } });
    expect(ok.ok && ok.result.live.priceCents).toBe(2_000); // the maximum reaches the $20 reserve: price = reserve [CTP]
    const again = await ds.emitWithAck("bid.place", { saleLotId, maxCents: 3_000, idempotencyKey: "socket-bid-1" });
    expect(again).toMatchObject({ ok: true, result: { seq: 1, replayed: true } });
    const low = await ds.emitWithAck("bid.place", { saleLotId, maxCents: 3_000, idempotencyKey: "socket-bid-2" });
    expect(low).toMatchObject({ ok: false, error: { code: "conflict", details: { reason: "max-not-raised" } } });
    const bad = await ds.emitWithAck("bid.place", { saleLotId: "nope", maxCents: -5, idempotencyKey: "x" } as never);
    expect(bad).toMatchObject({ ok: false, error: { code: "validation_failed" } });
    ds.close();
    const cs = await open(await sessionCookie(consignor));
    expect(
      await cs.emitWithAck("bid.place", { saleLotId, maxCents: 9_000, idempotencyKey: "own-bid-1" }),
    ).toMatchObject({ ok: false, error: { code: "forbidden" } });
    cs.close();
  });
});

describe("graceful shutdown", () => {
  it("stops accepting, lets an in-flight request finish, then runs the closers in order", async () => {
    const order: string[] = [];
    let received = false;
    let finish: () => void = () => {};
    const released = new Promise<void>((r) => (finish = r));
    // The request is held open until the test releases it, so it is in flight for as long as the test needs.
    const server = http.createServer((_req, res) => {
      received = true;
      void released.then(() => {
        order.push("request finished");
        res.end("done");
      });
    });
    const stopper = gracefulShutdown(server, {
      closeSockets: async () => {
        order.push("sockets closed");
      },
      closers: [async () => order.push("database closed")],
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
    const port = (server.address() as AddressInfo).port;
    const pending = fetch(`http://127.0.0.1:${port}/slow`).then((r) => r.text());
    await until(() => received, Boolean);
    const done = stopper.shutdown();
    // Stopped accepting: poll until a new connection is refused, while the first request is still held open.
    await vi.waitFor(() => expect(fetch(`http://127.0.0.1:${port}/again`)).rejects.toThrow(), {
      timeout: 5_000,
      interval: 20,
    });
    expect(order).not.toContain("request finished");
    finish();
    expect(await pending).toBe("done");
    await done;
    expect(order).toEqual(["sockets closed", "request finished", "database closed"]);
  });
});
