import type { Server } from "socket.io";
import type { InterServerEvents, ServerToClientEvents } from "./events";

/**
 * Emit after commit, from any server code. The socket.io server is created by
 * the custom server and shared on globalThis; in tests without one, emits go nowhere.
 */
type Io = Server<Record<string, never>, ServerToClientEvents, InterServerEvents>;

export function io(): Io | undefined {
  return (globalThis as { __getterlineIo?: Io }).__getterlineIo;
}

export function emitTo<E extends keyof ServerToClientEvents>(
  rooms: string[],
  event: E,
  ...args: Parameters<ServerToClientEvents[E]>
): void {
  const server = io();
  if (!server) return;
  (server.to(rooms) as unknown as { emit: (e: string, ...a: unknown[]) => void }).emit(event, ...args);
}

/**
 * A lot event, in order: delivered to this instance's sockets at once and in
 * call order (the adapter's own broadcast awaits a database round trip per
 * message, so two broadcasts can overtake each other), then relayed to the
 * other instances, which deliver it locally in the order they receive it.
 */
export function emitLotEvent(rooms: string[], event: "lot.bid" | "lot.closed" | "lot.batch", payload: unknown): void {
  const server = io();
  if (!server) return;
  (server.local.to(rooms) as unknown as { emit: (e: string, ...a: unknown[]) => void }).emit(event, payload);
  server.serverSideEmit("lot.relay", { rooms, event, payload });
}
