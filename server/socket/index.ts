import type http from "node:http";
import { createAdapter } from "@socket.io/postgres-adapter";
import type pg from "pg";
import { Server } from "socket.io";
import { viewerFromCookieHeader } from "../../lib/auth/guards";
import type {
  ClientToServerEvents,
  InterServerEvents,
  ServerToClientEvents,
  SocketData,
} from "../../lib/realtime/events";
import { joinableRoom, userRoom, type BidAck } from "../../lib/realtime/events";
import { ApiError, fieldsFromIssues } from "../../lib/api/errors";
import { handshakeOriginAllowed } from "../../lib/auth/origin";
import { can } from "../../lib/auth/roles";
import { env } from "../../lib/config/env";
import { currentRoles } from "../../lib/services/accounts";
import { placeMaxBid } from "../../lib/services/bidding";
import { SocketBidSchema } from "../../lib/validation/sales";

/**
 * A bid over the socket: validated with the route's schema, roles re-read
 * from the database (as every guard does), then the same service as the
 * HTTP route. The answer comes back on the ack, in the one error shape.
 */
async function placeBidOverSocket(userId: string, sessionVersion: number, raw: unknown): Promise<BidAck> {
  const parsed = SocketBidSchema.safeParse(raw);
  if (!parsed.success)
    return {
      ok: false,
      error: {
        code: "validation_failed",
        message: "Some fields need attention",
        fields: fieldsFromIssues(parsed.error.issues),
      },
    };
  try {
    const roles = await currentRoles(userId, sessionVersion);
    if (!roles) return { ok: false, error: { code: "unauthenticated", message: "Sign in first" } };
    if (!can(roles, "lots.bid"))
      return { ok: false, error: { code: "forbidden", message: "Your account's roles do not allow this" } };
    const { saleLotId, maxCents, idempotencyKey } = parsed.data;
    const r = await placeMaxBid({ id: userId, email: "", name: "", roles }, saleLotId, maxCents, idempotencyKey);
    if (!r.accepted)
      return {
        ok: false,
        error: {
          code: "conflict",
          message: r.message,
          details: { reason: r.reason, minimumCents: r.minimumCents, live: r.live },
        },
      };
    return { ok: true, result: r };
  } catch (e) {
    if (e instanceof ApiError) return { ok: false, error: { code: e.code, message: e.message } };
    console.error("[socket] bid failed", e);
    return { ok: false, error: { code: "internal", message: "Something went wrong on our side" } };
  }
}

export type GetterlineIo = Server<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;

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
    // Another site's page must not open a socket with a dealer's cookie and bid: same rule as route().
    allowRequest: (req, cb) => {
      const e = env();
      const configured = [...e.TRUSTED_ORIGINS.split(",").map((o) => o.trim()), new URL(e.NEXTAUTH_URL).origin];
      cb(null, handshakeOriginAllowed(req.headers.origin, req.headers.host, configured));
    },
    adapter: createAdapter(pool, {
      payloadThreshold: 7000,
      errorHandler: (e: Error) => console.error("[socket adapter]", e.message),
    }),
  });

  io.use(async (socket, next) => {
    try {
      const viewer = await viewerFromCookieHeader(socket.handshake.headers.cookie);
      if (!viewer) return next(new Error("unauthenticated"));
      socket.data = { userId: viewer.id, roles: viewer.roles, sessionVersion: viewer.sessionVersion };
      next();
    } catch {
      next(new Error("unavailable"));
    }
  });

  // Lot events committed on another instance: deliver them to our sockets in the order they arrive (lib/realtime/emit).
  io.on("lot.relay", ({ rooms, event, payload }) => {
    if (!Array.isArray(rooms) || !rooms.every((r) => typeof r === "string" && joinableRoom(r))) return;
    if (event !== "lot.bid" && event !== "lot.closed" && event !== "lot.batch") return;
    (io.local.to(rooms) as unknown as { emit: (e: string, ...a: unknown[]) => void }).emit(event, payload);
  });

  io.on("connection", (socket) => {
    void socket.join(userRoom(socket.data.userId));
    socket.emit("session.ready", { userId: socket.data.userId, roles: socket.data.roles });
    socket.on("room.join", ({ room }, ack) => {
      if (typeof room !== "string" || !joinableRoom(room))
        return ack?.({ ok: false, error: "That room cannot be joined" });
      void socket.join(room);
      ack?.({ ok: true });
    });
    socket.on("bid.place", (p, ack) => {
      if (typeof ack !== "function") return;
      void placeBidOverSocket(socket.data.userId, socket.data.sessionVersion, p).then(ack);
    });
    socket.on("room.leave", ({ room }) => {
      if (typeof room === "string" && joinableRoom(room)) void socket.leave(room);
    });
  });

  (globalThis as { __getterlineIo?: GetterlineIo }).__getterlineIo = io;
  return io;
}
