import { emitLotEvent } from "./emit";
import { lotRoom, saleRoom, type LotLive } from "./events";

/**
 * Per-lot ordered broadcasts after commit. Commits are serialised by the
 * lot's row lock, but their replies can reach this process in another order
 * (a backend descheduled between releasing the lock and answering), so every
 * writer of a lot brackets its work with beginLotWrite / finishLotWrite. An
 * event whose predecessor is still being written here waits for it; once no
 * write of the lot is in flight here, whatever waits leaves in seq order (the
 * missing seq was committed by another instance). Events ready in the same
 * turn of the event loop leave as one `lot.batch` frame per room.
 */
type Kind = "lot.bid" | "lot.closed";
type Ev = { kind: Kind; live: LotLive };
type LotQueue = {
  last: number | null;
  inflight: number;
  held: Map<number, Ev>;
  out: Ev[];
  flushing: boolean;
  timer: ReturnType<typeof setTimeout> | null;
};

/** The longest an event waits for a predecessor before it leaves anyway (a writer stuck after commit). */
export const HOLD_MAX_MS = 25;

// One set of queues per process, shared by the custom server's and Next's module graphs (as the socket.io server is).
const g = globalThis as unknown as { __getterlineLotQueues?: Map<string, LotQueue> };
const lots = (g.__getterlineLotQueues ??= new Map<string, LotQueue>());

function queueOf(saleLotId: string): LotQueue {
  let q = lots.get(saleLotId);
  if (!q) {
    q = { last: null, inflight: 0, held: new Map(), out: [], flushing: false, timer: null };
    lots.set(saleLotId, q);
  }
  return q;
}

/** A write of this lot starts (call before taking its row lock). */
export function beginLotWrite(saleLotId: string): void {
  queueOf(saleLotId).inflight += 1;
}

/** The write is done: with the event it committed, or null (refused, replayed or failed). Call exactly once per begin. */
export function finishLotWrite(saleLotId: string, ev: Ev | null): void {
  const q = queueOf(saleLotId);
  q.inflight = Math.max(0, q.inflight - 1);
  if (ev) q.held.set(ev.live.seq, ev);
  release(saleLotId, q, false);
}

/** An event from a writer that had nothing in flight to wait for (e.g. a close). */
export function emitLot(kind: Kind, live: LotLive): void {
  beginLotWrite(live.saleLotId);
  finishLotWrite(live.saleLotId, { kind, live });
}

function release(saleLotId: string, q: LotQueue, force: boolean): void {
  const take = (seq: number) => {
    q.out.push(q.held.get(seq)!);
    q.held.delete(seq);
    if (q.last == null || seq > q.last) q.last = seq;
  };
  for (const seq of [...q.held.keys()].sort((a, b) => a - b)) if (q.last != null && seq <= q.last) take(seq); // stale: let clients drop it
  while (q.last != null && q.held.has(q.last + 1)) take(q.last + 1);
  if (q.held.size && (q.inflight === 0 || force)) for (const seq of [...q.held.keys()].sort((a, b) => a - b)) take(seq);
  if (q.timer && !q.held.size) {
    clearTimeout(q.timer);
    q.timer = null;
  }
  if (q.held.size && !q.timer) {
    q.timer = setTimeout(() => {
      q.timer = null;
      release(saleLotId, q, true);
    }, HOLD_MAX_MS);
    q.timer.unref?.();
  }
  if (q.out.length && !q.flushing) {
    q.flushing = true;
    setImmediate(() => flush(saleLotId, q));
  }
}

function flush(saleLotId: string, q: LotQueue): void {
  const out = q.out;
  q.out = [];
  q.flushing = false;
  if (!out.length) return;
  const rooms = [lotRoom(saleLotId), saleRoom(out[0]!.live.saleId)];
  if (out.length === 1) emitLotEvent(rooms, out[0]!.kind, out[0]!.live);
  else emitLotEvent(rooms, "lot.batch", { events: out });
}
