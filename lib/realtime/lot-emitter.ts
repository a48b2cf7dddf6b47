import { emitTo } from "./emit";
import { lotRoom, saleRoom, type LotLive } from "./events";

/**
 * Per-lot ordered broadcasts after commit. A writer reserves its seq the
 * moment its transaction commits (commits are serialised by the lot's row
 * lock, so reservations arrive in seq order), may then await other work, and
 * sends; a lot's events leave this process strictly in seq order, whichever
 * writer finishes first. Events ready in the same turn of the event loop
 * leave together as one `lot.batch` per room (fewer frames per watcher when
 * bids bunch up); a lone event leaves as itself.
 */
type Kind = "lot.bid" | "lot.closed";
type Slot = { seq: number; ready: { kind: Kind; live: LotLive } | null; cancelled: boolean };
type LotQueue = { slots: Slot[]; out: { kind: Kind; live: LotLive }[]; flushing: boolean };

const lots = new Map<string, LotQueue>();

/** How long a reserved seq may hold later ones before they go anyway (a writer that died after commit). */
export const RESERVATION_TIMEOUT_MS = 2_000;

export type Reservation = { send(kind: Kind, live: LotLive): void; cancel(): void };

/** Reserve `seq` on a lot, right after its commit; call send() (or cancel()) exactly once. */
export function reserveLotSeq(saleLotId: string, seq: number): Reservation {
  let q = lots.get(saleLotId);
  if (!q) { q = { slots: [], out: [], flushing: false }; lots.set(saleLotId, q); }
  const slot: Slot = { seq, ready: null, cancelled: false };
  // Keep slots sorted by seq (a reservation from a late-resolving commit still finds its place).
  const at = q.slots.findIndex((s) => s.seq > seq);
  if (at < 0) q.slots.push(slot); else q.slots.splice(at, 0, slot);
  const timer = setTimeout(() => { slot.cancelled = true; drain(saleLotId); }, RESERVATION_TIMEOUT_MS);
  timer.unref?.();
  return {
    send(kind, live) { clearTimeout(timer); slot.ready = { kind, live }; drain(saleLotId); },
    cancel() { clearTimeout(timer); slot.cancelled = true; drain(saleLotId); },
  };
}

/** Send a lot event now, in order behind any reserved earlier seq (for writers that had no awaits). */
export function emitLot(kind: Kind, live: LotLive): void {
  reserveLotSeq(live.saleLotId, live.seq).send(kind, live);
}

function drain(saleLotId: string): void {
  const q = lots.get(saleLotId);
  if (!q) return;
  while (q.slots.length && (q.slots[0]!.ready || q.slots[0]!.cancelled)) {
    const s = q.slots.shift()!;
    if (s.ready) q.out.push(s.ready);
  }
  if (q.out.length && !q.flushing) {
    q.flushing = true;
    setImmediate(() => flush(saleLotId));
  }
}

function flush(saleLotId: string): void {
  const q = lots.get(saleLotId);
  if (!q) return;
  const out = q.out;
  q.out = [];
  q.flushing = false;
  if (!q.slots.length && !q.out.length) lots.delete(saleLotId);
  if (!out.length) return;
  const rooms = [lotRoom(saleLotId), saleRoom(out[0]!.live.saleId)];
  if (out.length === 1) emitTo(rooms, out[0]!.kind, out[0]!.live);
  else emitTo(rooms, "lot.batch", { events: out });
}
