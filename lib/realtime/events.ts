/**
 * Socket event payloads, typed once for server and client. Events are named
 * `<resource>.<verb>`, rooms `<kind>:<id>`. Every lot event carries the
 * lot's sequence number: clients apply them in order and refetch on a gap.
 */
export type LotLive = {
  saleLotId: string;
  saleId: string;
  seq: number;
  phase: "open" | "sold" | "unsold" | "withdrawn";
  priceCents: number;
  bidCount: number;
  leaderPaddle: number | null;
  reserveMet: boolean;
  minimumCents: number;
  closesAt: string;
  extended: boolean;
  hammerCents: number | null;
};

export interface ServerToClientEvents {
  "session.ready": (p: { userId: string; roles: string[] }) => void;
  "notice.created": (p: { id: string; text: string; href?: string; at: string }) => void;
  /** A bid was accepted (or retracted): the lot's new public state. */
  "lot.bid": (p: LotLive) => void;
  /** The lot closed: sold or unsold. */
  "lot.closed": (p: LotLive) => void;
  /** Several events of one lot that became ready together, in seq order (see lib/realtime/lot-emitter). */
  "lot.batch": (p: { events: { kind: "lot.bid" | "lot.closed"; live: LotLive }[] }) => void;
}

/** The answer to a bid placed over the socket: the same result as POST /api/sale-lots/:id/bids. */
export type BidAck =
  | {
      ok: true;
      result: {
        accepted: true;
        outcome: string;
        seq: number;
        live: LotLive;
        yourMaxCents: number;
        leading: boolean;
        replayed: boolean;
      };
    }
  | {
      ok: false;
      error: { code: string; message: string; fields?: Record<string, string>; details?: Record<string, unknown> };
    };

export interface ClientToServerEvents {
  /** Place a maximum bid over the already-authenticated socket (the HTTP route does the same). */
  "bid.place": (p: { saleLotId: string; maxCents: number; idempotencyKey: string }, ack: (r: BidAck) => void) => void;
  "room.join": (p: { room: string }, ack: (r: { ok: boolean; error?: string }) => void) => void;
  "room.leave": (p: { room: string }) => void;
}

/** What the handshake learnt; the session version lets each bid check the session was not revoked since. */
export type SocketData = { userId: string; roles: string[]; sessionVersion: number };

/** Between app instances: a lot's events, sent by the instance that committed them, for the others to deliver locally in the same order. */
export interface InterServerEvents {
  "lot.relay": (p: { rooms: string[]; event: "lot.bid" | "lot.closed" | "lot.batch"; payload: unknown }) => void;
}

/** Rooms a client may join by itself: public sale and lot rooms. */
export function joinableRoom(room: string): boolean {
  return /^(sale|lot):[0-9a-zA-Z-]{1,40}$/.test(room);
}

export const userRoom = (userId: string) => `user:${userId}`;
export const lotRoom = (saleLotId: string) => `lot:${saleLotId}`;
export const saleRoom = (saleId: string) => `sale:${saleId}`;
