// Bid benchmark: W socket.io watchers in a process of their own, so that
// receiving W copies of every broadcast does not slow the bidders' loop.
// Started by watchers.ts with an IPC channel; exits when the parent goes away.
import { performance } from "node:perf_hooks";
import { io as connect, type Socket } from "socket.io-client";
import { GAP_WAIT_MS } from "../../lib/realtime/sequencer";
import type { FromParent, ToParent } from "./protocol";

const now = () => performance.timeOrigin + performance.now();
const send = (m: ToParent) => process.send?.(m);

/** A growable per-watcher bit set of the sequence numbers it has seen. */
class SeqSet {
  private bits = new Uint8Array(1024);
  /** True if `seq` was already present. */
  add(seq: number): boolean {
    const byte = seq >> 3;
    if (byte >= this.bits.length) {
      const next = new Uint8Array(Math.max(this.bits.length * 2, byte + 1));
      next.set(this.bits);
      this.bits = next;
    }
    const mask = 1 << (seq & 7);
    const had = (this.bits[byte]! & mask) !== 0;
    this.bits[byte]! |= mask;
    return had;
  }
}

/** Per-sequence aggregates over all watchers, growable. */
let counts = new Uint32Array(4096);
let lastArrival = new Float64Array(4096);
let dupes = new Uint32Array(4096);
function grow(seq: number): void {
  if (seq < counts.length) return;
  const size = Math.max(counts.length * 2, seq + 1);
  const c = new Uint32Array(size);
  c.set(counts);
  counts = c;
  const a = new Float64Array(size);
  a.set(lastArrival);
  lastArrival = a;
  const d = new Uint32Array(size);
  d.set(dupes);
  dupes = d;
}

const sockets: Socket[] = [];
let disconnects = 0;
let connectErrors = 0;
let otherEvents = 0;
let maxSeq = 0;
let outOfOrder = 0;
let jumps = 0;
let refetches = 0;
const orderExamples: string[] = [];
let batches = 0;

async function startAll(url: string, saleLotId: string, cookies: string[], batch: number): Promise<void> {
  const room = `lot:${saleLotId}`;
  const started = now();
  const one = (cookie: string) =>
    new Promise<void>((resolve, reject) => {
      const seen = new SeqSet();
      let highest = -1;
      const s = connect(url, {
        path: "/socket.io",
        transports: ["websocket"],
        forceNew: true,
        reconnection: true,
        reconnectionDelay: 200,
        extraHeaders: { cookie },
        timeout: 20_000,
      });
      sockets.push(s);
      let first = true;
      const timer = setTimeout(() => reject(new Error("watcher did not connect and join within 30 s")), 30_000);
      s.on("connect", () => {
        // Join (and re-join after any reconnect) the lot's room; resolve on the first ack.
        s.timeout(20_000).emit("room.join", { room }, (err: Error | null, r?: { ok: boolean; error?: string }) => {
          if (!first) return;
          first = false;
          clearTimeout(timer);
          if (err || !r?.ok) reject(new Error(`room.join refused: ${err?.message ?? r?.error}`));
          else resolve();
        });
      });
      s.on("connect_error", () => {
        connectErrors++;
      });
      s.on("disconnect", (reason) => {
        if (reason !== "io client disconnect") disconnects++;
      });
      // A client's sequencer (lib/realtime/sequencer): one ahead of a gap waits GAP_WAIT_MS for the missing seq, then refetches.
      let applied = -1;
      const held = new Set<number>();
      let gapTimer: ReturnType<typeof setTimeout> | null = null;
      const settle = () => {
        while (held.has(applied + 1)) {
          held.delete(applied + 1);
          applied += 1;
        }
        if (gapTimer) {
          clearTimeout(gapTimer);
          gapTimer = null;
        }
        if (held.size)
          gapTimer = setTimeout(() => {
            gapTimer = null;
            if (held.size) {
              refetches++;
              applied = Math.max(...held);
              held.clear();
            }
          }, GAP_WAIT_MS);
      };
      const onLot = (p: { saleLotId: string; seq: number }) => {
        const at = now();
        if (p.saleLotId !== saleLotId) {
          otherEvents++;
          return;
        }
        const seq = p.seq;
        grow(seq);
        if (seq > maxSeq) maxSeq = seq;
        if (seen.add(seq)) {
          dupes[seq]!++;
          return;
        }
        if (highest >= 0 && seq < highest) {
          outOfOrder++;
          if (orderExamples.length < 10) orderExamples.push(`${seq} after ${highest}`);
        } else if (highest >= 0 && seq > highest + 1) {
          jumps++;
          if (orderExamples.length < 10) orderExamples.push(`${seq} skipping from ${highest}`);
        }
        if (seq > highest) highest = seq;
        counts[seq]!++;
        if (at > lastArrival[seq]!) lastArrival[seq] = at;
        if (applied < 0) applied = seq - 1;
        if (seq > applied) {
          held.add(seq);
          settle();
        }
      };
      s.on("lot.bid", onLot);
      s.on("lot.batch", (b: { events: { live: { saleLotId: string; seq: number } }[] }) => {
        batches++;
        for (const e of b.events) onLot(e.live);
      });
    });
  for (let i = 0; i < cookies.length; i += batch) await Promise.all(cookies.slice(i, i + batch).map(one));
  send({ type: "ready", connected: sockets.filter((s) => s.connected).length, ms: now() - started });
}

process.on("message", (m: FromParent) => {
  if (m.type === "start") {
    startAll(m.url, m.saleLotId, m.cookies, m.batch).catch((e: Error) => send({ type: "failed", message: e.message }));
  } else if (m.type === "query") {
    const to = Math.min(m.to, counts.length - 1);
    const n = Math.max(0, to - m.from + 1);
    send({
      type: "result",
      id: m.id,
      from: m.from,
      counts: Array.from(counts.subarray(m.from, m.from + n)),
      lastArrival: Array.from(lastArrival.subarray(m.from, m.from + n)),
      dupes: Array.from(dupes.subarray(m.from, m.from + n)),
      maxSeq,
      outOfOrder,
      jumps,
      refetches,
      batches,
      orderExamples,
      disconnects,
      connectErrors,
      otherEvents,
      connected: sockets.filter((s) => s.connected).length,
    });
  } else if (m.type === "stop") {
    for (const s of sockets) s.disconnect();
    setTimeout(() => process.exit(0), 200);
  }
});
// Never outlive the bench.
process.on("disconnect", () => process.exit(0));
