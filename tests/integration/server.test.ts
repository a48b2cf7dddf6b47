import http from "node:http";
import type { AddressInfo } from "node:net";
import pg from "pg";
import { io as connect, type Socket } from "socket.io-client";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { gracefulShutdown } from "../../server/shutdown";
import { attachSockets, type GetterlineIo } from "../../server/socket";
import { makeUser, sessionCookie } from "../support/factories";

describe("socket.io handshake uses the same guard as the routes", () => {
  let server: http.Server;
  let io: GetterlineIo;
  let pool: pg.Pool;
  let url: string;

  beforeAll(async () => {
    server = http.createServer();
    pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
    io = await attachSockets(server, pool);
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await new Promise<void>((r) => io.close(() => r()));
    await pool.end();
  });

  const open = (cookie?: string): Socket =>
    connect(url, { path: "/socket.io", transports: ["websocket"], extraHeaders: cookie ? { cookie } : {}, reconnection: false });

  it("refuses a connection without a session", async () => {
    const s = open();
    const err = await new Promise<Error>((r) => s.on("connect_error", r));
    expect(err.message).toBe("unauthenticated");
    s.close();
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

describe("graceful shutdown", () => {
  it("stops accepting, lets an in-flight request finish, then runs the closers in order", async () => {
    const order: string[] = [];
    const server = http.createServer((_req, res) => {
      setTimeout(() => { order.push("request finished"); res.end("done"); }, 300);
    });
    const stopper = gracefulShutdown(server, {
      closeSockets: async () => { order.push("sockets closed"); },
      closers: [async () => order.push("database closed")],
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
    const port = (server.address() as AddressInfo).port;
    const pending = fetch(`http://127.0.0.1:${port}/slow`).then((r) => r.text());
    await new Promise((r) => setTimeout(r, 50));
    const done = stopper.shutdown();
    await new Promise((r) => setTimeout(r, 20));
    await expect(fetch(`http://127.0.0.1:${port}/again`)).rejects.toThrow();
    expect(await pending).toBe("done");
    await done;
    expect(order).toEqual(["sockets closed", "request finished", "database closed"]);
  });
});
