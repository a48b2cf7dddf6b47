// Bid benchmark: messages between the bench and its watcher process.

export type FromParent =
  | { type: "start"; url: string; saleLotId: string; cookies: string[]; batch: number }
  | { type: "query"; id: number; from: number; to: number }
  | { type: "stop" };

/** Per-sequence receipts over all watchers for seq `from`, `from + 1`, …; arrival times are epoch ms. */
export type Receipts = {
  from: number;
  /** Distinct watchers that received each seq. */
  counts: number[];
  /** When the last of them received it. */
  lastArrival: number[];
  /** Extra copies of each seq received by a watcher that already had it. */
  dupes: number[];
  maxSeq: number;
  /** Arrivals with a seq below one the same watcher already had (broadcasts overtaking each other). */
  outOfOrder: number;
  /** Arrivals that skipped seqs the watcher had not seen yet (a client following the seq rule would refetch). */
  jumps: number;
  /** Refetches a client would make: a gap still open GAP_WAIT_MS after the event ahead of it arrived. */
  refetches: number;
  /** lot.batch frames received (several events of the lot in one frame). */
  batches: number;
  /** The first few arrivals out of order, as "seq after highest". */
  orderExamples: string[];
  disconnects: number;
  connectErrors: number;
  /** lot.bid events for other lots (expected 0). */
  otherEvents: number;
  connected: number;
};

export type ToParent =
  | { type: "ready"; connected: number; ms: number }
  | { type: "failed"; message: string }
  | ({ type: "result"; id: number } & Receipts);
