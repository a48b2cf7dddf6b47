import type { Server } from "socket.io";
import type { ServerToClientEvents } from "./events";

/**
 * Emit after commit, from any server code. The socket.io server is created by
 * the custom server and shared on globalThis; in tests without one, emits go nowhere.
 */
type Io = Server<Record<string, never>, ServerToClientEvents>;

export function io(): Io | undefined {
  return (globalThis as { __getterlineIo?: Io }).__getterlineIo;
}

export function emitTo<E extends keyof ServerToClientEvents>(rooms: string[], event: E, ...args: Parameters<ServerToClientEvents[E]>): void {
  const server = io();
  if (!server) return;
  (server.to(rooms) as unknown as { emit: (e: string, ...a: unknown[]) => void }).emit(event, ...args);
}
