import http from "node:http";
import type { AddressInfo } from "node:net";
import pg from "pg";
import { afterAll, beforeAll } from "vitest";
import { attachSockets, type GetterlineIo } from "../../server/socket";

/**
 * Our socket.io server (with its Postgres adapter) on a plain HTTP server and
 * a real pool, for the describe block that calls it. Two calls make two
 * instances that exchange broadcasts through the database, as in production.
 */
export function socketServer(): { readonly url: string } {
  let io: GetterlineIo;
  let pool: pg.Pool;
  const state = { url: "" };
  beforeAll(async () => {
    const server = http.createServer();
    pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
    io = await attachSockets(server, pool);
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
    state.url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await new Promise<void>((r) => io.close(() => r()));
    await pool.end();
  });
  return state;
}
