/**
 * Socket event payloads, typed once for server and client. Events are named
 * `<resource>.<verb>`, rooms `<kind>:<id>`. Later issues add lot and sale events.
 */
export interface ServerToClientEvents {
  "session.ready": (p: { userId: string; roles: string[] }) => void;
  "notice.created": (p: { id: string; text: string; href?: string; at: string }) => void;
}

export interface ClientToServerEvents {
  "room.join": (p: { room: string }, ack: (r: { ok: boolean; error?: string }) => void) => void;
  "room.leave": (p: { room: string }) => void;
}

export type SocketData = { userId: string; roles: string[] };

/** Rooms a client may join by itself: public sale and lot rooms. */
export function joinableRoom(room: string): boolean {
  return /^(sale|lot):[0-9a-zA-Z-]{1,40}$/.test(room);
}

export const userRoom = (userId: string) => `user:${userId}`;
