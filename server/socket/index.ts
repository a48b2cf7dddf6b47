import type http from "node:http";
import { createAdapter } from "@socket.io/postgres-adapter";
import type pg from "pg";
import { Server } from "socket.io";
import { viewerFromCookieHeader } from "../../lib/auth/guards";
import type { ClientToServerEvents, ServerToClientEvents, SocketData } from "../../lib/realtime/events";
import { joinableRoom, userRoom } from "../../lib/realtime/events";

export type GetterlineIo = Server<ClientToServerEvents, ServerToClientEvents, Record<string, never>, SocketData>;

/**
 * socket.io on the app's own HTTP server, path /socket.io. Every connection is
 * authenticated at the handshake from the next-auth session cookie through
 * the same guard module the routes use. Broadcasts cross app instances through
 * the Postgres adapter.
 */
export async function attachSockets(server: http.Server, pool: pg.Pool): Promise<GetterlineIo> {
  await pool.query(`
    CREATE TABLE IF NOT EXISTS socket_io_attachments (
      id bigserial UNIQUE,
      created_at timestamptz DEFAULT NOW(),
      payload bytea
    );`);
  const io: GetterlineIo = new Server(server, {
    path: "/socket.io",
    serveClient: false,
    cors: { origin: false },
    adapter: createAdapter(pool, {
      payloadThreshold: 7000,
      errorHandler: (e: Error) => console.error("[socket adapter]", e.message),
    }),
  });

  io.use(async (socket, next) => {
    try {
      const viewer = await viewerFromCookieHeader(socket.handshake.headers.cookie);
      if (!viewer) return next(new Error("unauthenticated"));
      socket.data = { userId: viewer.id, roles: viewer.roles };
      next();
    } catch {
      next(new Error("unavailable"));
    }
  });

  io.on("connection", (socket) => {
    void socket.join(userRoom(socket.data.userId));
    socket.emit("session.ready", { userId: socket.data.userId, roles: socket.data.roles });
    socket.on("room.join", ({ room }, ack) => {
      if (typeof room !== "string" || !joinableRoom(room)) return ack?.({ ok: false, error: "That room cannot be joined" });
      void socket.join(room);
      ack?.({ ok: true });
    });
    socket.on("room.leave", ({ room }) => {
      if (typeof room === "string" && joinableRoom(room)) void socket.leave(room);
    });
  });

  (globalThis as { __getterlineIo?: GetterlineIo }).__getterlineIo = io;
  return io;
}
