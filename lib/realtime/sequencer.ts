/**
 * Puts a lot's broadcasts back in seq order on the receiving side. Stale
 * ones are dropped; one ahead of a missing seq waits in `pending` until the
 * gap fills or the caller's short timer gives up and refetches. Pure.
 */
export type Sequencer<T extends { seq: number }> = {
  /** Accept one event; returns the events now ready to apply, in order. */
  push(p: T): T[];
  /** True while an event waits for a missing seq. */
  waiting(): boolean;
  /** After a refetch: continue from `seq`, dropping what it covers. */
  reset(seq: number): void;
  last(): number;
};

export function createSequencer<T extends { seq: number }>(startSeq: number): Sequencer<T> {
  let last = startSeq;
  const pending = new Map<number, T>();
  return {
    push(p) {
      if (p.seq <= last) return [];
      pending.set(p.seq, p);
      const out: T[] = [];
      while (pending.has(last + 1)) {
        out.push(pending.get(last + 1)!);
        pending.delete(last + 1);
        last += 1;
      }
      return out;
    },
    waiting: () => pending.size > 0,
    reset(seq) {
      if (seq > last) last = seq;
      for (const k of [...pending.keys()]) if (k <= last) pending.delete(k);
    },
    last: () => last,
  };
}

/** How long a client waits for a missing seq before it refetches ([SUG] a little above our 280 ms worst fan-out). */
export const GAP_WAIT_MS = 400;
