"use client";

import { io, type Socket } from "socket.io-client";
import type { ClientToServerEvents, ServerToClientEvents } from "@/lib/realtime/events";

export type LiveSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

let shared: LiveSocket | null = null;

/** One socket per browser tab, authenticated by the session cookie at the handshake. */
export function liveSocket(): LiveSocket {
  if (!shared) shared = io({ path: "/socket.io", transports: ["websocket", "polling"], withCredentials: true });
  return shared;
}

/** Join rooms now and again after every reconnect; `onResync` runs on each (re)connect so the page refetches. */
export function joinRooms(rooms: string[], onResync: () => void): () => void {
  const s = liveSocket();
  const join = () => {
    for (const room of rooms) s.emit("room.join", { room }, () => undefined);
    onResync();
  };
  if (s.connected) join();
  s.on("connect", join);
  return () => {
    s.off("connect", join);
    for (const room of rooms) s.emit("room.leave", { room });
  };
}
