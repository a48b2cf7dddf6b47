import { formatCents } from "@/lib/money/cents";
import { When } from "@/components/time/When";

type Row = {
  seq: number;
  paddle: number | null;
  priceAfterCents: number;
  at: string;
  retracted: boolean;
  mine: boolean;
  privateRaise?: boolean;
};

/** The public bid trail by paddle number, newest first; a dealer's own private ceiling raises are marked as such. */
export function BidHistory({ rows, flashSeq }: { rows: Row[]; flashSeq: number | null }) {
  return (
    <section aria-labelledby="hist-h" className="card space-y-2">
      <h2 id="hist-h" className="font-semibold">
        Bid trail
      </h2>
      {rows.length ? (
        <ol className="max-h-96 space-y-1 overflow-auto text-sm" data-testid="bid-trail">
          {rows.map((b) => (
            <li
              key={b.seq}
              className={`flex flex-wrap justify-between gap-x-3 border-b border-flash-100 pb-1 ${b.seq === flashSeq ? "bg-glow-50" : ""} ${b.retracted ? "text-flash-400 line-through" : ""}`}
            >
              <span>
                Paddle {b.paddle ?? "?"}
                {b.mine ? " (you)" : ""}
                {b.privateRaise ? " · ceiling raised, seen only by you" : ""}
              </span>
              <span className="code">{formatCents(b.priceAfterCents)}</span>
              <When iso={b.at} style="time" className="text-flash-500" />
            </li>
          ))}
        </ol>
      ) : (
        <p className="text-sm text-flash-600">No bids yet.</p>
      )}
      <p className="text-xs text-flash-500">
        Dealers appear by paddle number. Each row shows the price after that bid; ceilings stay private.
      </p>
    </section>
  );
}
