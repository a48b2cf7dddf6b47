// Bid benchmark: percentiles, and the lost / duplicated / gap checks over answers, broadcasts and the bids table.
import type { Accepted } from "./bidders";
import type { Receipts } from "./protocol";
import type { BidRow } from "./setup";

/** Nearest-rank percentile of an unsorted list (NaN when empty). */
export function percentile(values: number[], p: number): number {
  if (!values.length) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.min(sorted.length, Math.max(1, Math.ceil((p / 100) * sorted.length)));
  return sorted[rank - 1]!;
}

export const round = (x: number, digits = 1) =>
  Number.isFinite(x) ? Math.round(x * 10 ** digits) / 10 ** digits : null;

export type Audit = {
  /** Accepted bids missing from some watcher or from the table (each bid once). */
  lost: number;
  /** Accepted bids some watcher never received. */
  lostBroadcast: number;
  /** Accepted bids with no row (same seq and key) in the bids table. */
  lostTable: number;
  /** Seqs some watcher received twice (counted per extra copy). */
  dupBroadcast: number;
  /** Seqs answered as accepted to two different requests. */
  dupAnswers: number;
  /** Idempotency keys with two rows. */
  dupKeys: number;
  /** Seqs missing between 1 and the highest seq in the table. */
  gaps: number;
  /** Table rows with no accepted answer (requests that timed out or failed in transit); not counted as lost. */
  unanswered: number;
  /** Broadcast seqs with no table row. */
  phantom: number;
  examples: string[];
};

/** Cross-check every accepted answer against the watchers' receipts and the bids table. */
export function audit(
  accepted: Accepted[],
  receipts: Receipts,
  watchers: number,
  table: { rows: BidRow[]; lotSeq: number; dupKeys: number },
): Audit {
  const examples: string[] = [];
  const note = (m: string) => {
    if (examples.length < 10) examples.push(m);
  };
  const got = (seq: number) => receipts.counts[seq - receipts.from] ?? 0;

  const bySeq = new Map<number, BidRow>(table.rows.map((r) => [r.seq, r]));
  const answeredSeqs = new Map<number, number>();
  let lostBroadcast = 0;
  let lostTable = 0;
  let lost = 0;
  for (const a of accepted) {
    answeredSeqs.set(a.seq, (answeredSeqs.get(a.seq) ?? 0) + 1);
    const notBroadcast = got(a.seq) < watchers;
    const row = bySeq.get(a.seq);
    const notStored = !row || row.idempotency_key !== a.key;
    if (notBroadcast) {
      lostBroadcast++;
      note(`seq ${a.seq} reached ${got(a.seq)} of ${watchers} watchers`);
    }
    if (notStored) {
      lostTable++;
      note(`seq ${a.seq} (key ${a.key}) is not in the bids table`);
    }
    if (notBroadcast || notStored) lost++;
  }
  let dupAnswers = 0;
  for (const [seq, n] of answeredSeqs)
    if (n > 1) {
      dupAnswers += n - 1;
      note(`seq ${seq} answered as accepted ${n} times`);
    }
  const dupBroadcast = receipts.dupes.reduce((s, n) => s + n, 0);
  if (dupBroadcast) note(`${dupBroadcast} extra broadcast copies`);

  let gaps = 0;
  const maxSeq = table.rows.length ? table.rows[table.rows.length - 1]!.seq : 0;
  for (let s = 1, i = 0; s <= maxSeq; s++) {
    if (table.rows[i]?.seq === s) i++;
    else {
      gaps++;
      note(`seq ${s} missing from the bids table`);
    }
  }
  if (table.lotSeq !== maxSeq) note(`sale_lots.seq is ${table.lotSeq} but the highest bid seq is ${maxSeq}`);

  let unanswered = 0;
  for (const r of table.rows) if (!answeredSeqs.has(r.seq)) unanswered++;
  let phantom = 0;
  for (let i = 0; i < receipts.counts.length; i++)
    if (receipts.counts[i]! > 0 && !bySeq.has(receipts.from + i)) phantom++;
  if (phantom) note(`${phantom} broadcast seqs have no bids row`);

  return {
    lost,
    lostBroadcast,
    lostTable,
    dupBroadcast,
    dupAnswers,
    dupKeys: table.dupKeys,
    gaps: gaps + (table.lotSeq !== maxSeq ? 1 : 0),
    unanswered,
    phantom,
    examples,
  };
}
