"use client";

import Link from "next/link";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRef, useState, useSyncExternalStore } from "react";
import { ApiClientError, apiFetch } from "@/lib/client/api";
import { canBidIn, panelMessage, type LastAction } from "@/lib/auction/standing";
import { formatCents, parseMoneyToCents } from "@/lib/money/cents";
import { lotRoom, type LotLive } from "@/lib/realtime/events";
import { formatWhen } from "@/lib/time/format";
import type { getSaleLot } from "@/lib/services/sales";
import { When } from "@/components/time/When";
import { useViewerZone } from "@/components/time/useViewerZone";
import { BidHistory } from "./BidHistory";
import { LotFacts } from "./LotFacts";
import { closedText, standingText } from "./standing-words";
import { formatLeft, useCountdown } from "./useCountdown";
import { useLotEvents } from "./useLotEvents";
import { liveSocket } from "./socket";

type Data = Awaited<ReturnType<typeof getSaleLot>>;
type BidAnswer = {
  accepted: true;
  outcome: "first-bid" | "new-leader" | "outbid-by-proxy" | "max-raised";
  seq: number;
  leading: boolean;
  live: LotLive;
  yourMaxCents: number;
};

/** Tell React when the live socket connects or drops. */
function followConnection(changed: () => void): () => void {
  const s = liveSocket();
  s.on("connect", changed);
  s.on("disconnect", changed);
  return () => {
    s.off("connect", changed);
    s.off("disconnect", changed);
  };
}

/**
 * Send a bid over the live socket when it is connected (no extra round trip
 * through the web server), else through the HTTP route; both give the same
 * answer and the same refusals.
 */
async function sendBid(saleLotId: string, maxCents: number, idempotencyKey: string): Promise<BidAnswer> {
  const s = liveSocket();
  if (s.connected) {
    try {
      const ack = await s.timeout(10_000).emitWithAck("bid.place", { saleLotId, maxCents, idempotencyKey });
      if (ack.ok) return ack.result as BidAnswer;
      throw new ApiClientError(
        ack.error.code === "conflict" ? 409 : 400,
        ack.error.code,
        ack.error.message,
        ack.error.fields,
      );
    } catch (e) {
      if (e instanceof ApiClientError) throw e;
      // No answer in time: the same key over HTTP is safe (the server answers a retry with the first result).
    }
  }
  return apiFetch(`/api/sale-lots/${saleLotId}/bids`, { json: { maxCents, idempotencyKey } });
}

const TONE = {
  lead: "border-sound-600 bg-sound-50",
  behind: "border-glow-500 bg-glow-50",
  neutral: "border-flash-200 bg-flash-50",
  done: "border-flash-300 bg-flash-100",
};

/**
 * One lot in a live sale. The panel shows one message at a time, derived
 * from the latest lot state and the dealer's own last action (see
 * lib/auction/standing). Broadcasts apply in seq order; a gap waits briefly, then refetches.
 */
export function LiveLot({ initial, canBid, lotHref }: { initial: Data; canBid: boolean; lotHref: string }) {
  const qc = useQueryClient();
  const id = initial.live.saleLotId;
  const key = ["sale-lot", id];
  const { data } = useQuery({
    queryKey: key,
    queryFn: () => apiFetch<Data>(`/api/sale-lots/${id}`),
    initialData: initial,
  });
  const [flashSeq, setFlashSeq] = useState<number | null>(null);
  const [announce, setAnnounce] = useState<string | null>(null);
  const [last, setLast] = useState<LastAction | null>(null);
  const [amount, setAmount] = useState("");
  const keyRef = useRef<string | null>(null);
  const zone = useViewerZone();
  const live = data.live;
  const left = useCountdown(live.closesAt);
  const connected = useSyncExternalStore(
    followConnection,
    () => liveSocket().connected,
    () => false,
  );

  const refetchSoon = useRef<ReturnType<typeof setTimeout> | null>(null);
  const refetch = () => void qc.invalidateQueries({ queryKey: key });
  useLotEvents(
    lotRoom(id),
    (lotId) => (lotId === id ? (qc.getQueryData<Data>(key)?.live.seq ?? null) : null),
    (p) => {
      const cur = qc.getQueryData<Data>(key);
      if (!cur || p.seq <= cur.live.seq) return;
      if (p.extended) setAnnounce(`A late bid moved the close to ${formatWhen(p.closesAt, zone, "time")}.`);
      if (p.phase !== "open") setAnnounce(`${closedText(p.phase, p.hammerCents)}.`);
      setFlashSeq(p.seq);
      setTimeout(() => setFlashSeq((s) => (s === p.seq ? null : s)), 1500);
      qc.setQueryData<Data>(key, { ...cur, live: { ...cur.live, ...p } });
      // The trail and the private standing come from the server; one refetch per burst.
      if (refetchSoon.current) clearTimeout(refetchSoon.current);
      refetchSoon.current = setTimeout(refetch, 150);
    },
    refetch,
  );

  // The socket-or-HTTP send runs as a mutation: never retried on its own; a retry by the dealer reuses the key.
  const placeBid = useMutation({
    mutationFn: (b: { cents: number; idempotencyKey: string }) => sendBid(id, b.cents, b.idempotencyKey),
  });
  const watch = useMutation({
    mutationFn: (on: boolean) => apiFetch(`/api/sale-lots/${id}/watch`, { json: { on } }),
    onSuccess: () => refetch(),
  });
  const busy = placeBid.isPending;

  async function bid(e: React.FormEvent) {
    e.preventDefault();
    let cents: number;
    try {
      cents = parseMoneyToCents(amount);
    } catch {
      return setLast({ kind: "refused", seq: live.seq, message: "Enter an amount like 125 or 125.50." });
    }
    keyRef.current ??= crypto.randomUUID(); // the same key if this very bid is retried
    try {
      const r = await placeBid.mutateAsync({ cents, idempotencyKey: keyRef.current });
      setLast({ kind: "bid", outcome: r.outcome, seq: r.live.seq, maxCents: r.yourMaxCents });
      const cur = qc.getQueryData<Data>(key);
      if (cur && r.live.seq >= cur.live.seq) {
        qc.setQueryData<Data>(key, {
          ...cur,
          live: { ...cur.live, ...r.live },
          you: {
            ...cur.you,
            bidding: true,
            leading: r.leading,
            maxCents: Math.max(cur.you.maxCents ?? 0, r.yourMaxCents),
          },
        });
      }
      setAmount("");
      keyRef.current = null;
    } catch (err) {
      if (err instanceof ApiClientError && err.status === 409) keyRef.current = null; // refused: the next try is a new bid
      setLast({ kind: "refused", seq: live.seq, message: (err as Error).message });
    } finally {
      refetch();
    }
  }

  function toggleWatch() {
    watch.mutate(!data.you.watching);
  }

  // Leading follows the latest public state at once when the dealer's paddle is known.
  const leading =
    data.you.paddle != null && live.leaderPaddle != null ? live.leaderPaddle === data.you.paddle : data.you.leading;
  const msg = panelMessage(
    { phase: live.phase, ownLot: data.you.ownLot, bidding: data.you.bidding, leading, seq: live.seq },
    last,
  );
  const words = standingText(msg, {
    priceCents: live.priceCents,
    hammerCents: live.hammerCents,
    maxCents: data.you.maxCents,
    leaderPaddle: live.leaderPaddle,
  });
  const open = live.phase === "open";
  const showForm = canBid && canBidIn(live.phase, msg.standing);
  return (
    <div className="grid gap-5 pb-28 sm:pb-0 lg:grid-cols-[2fr_1fr]">
      <section aria-labelledby="live-h" className="card space-y-4">
        <h2 id="live-h" className="sr-only">
          Bidding
        </h2>
        <div
          data-testid="standing"
          data-standing={msg.standing}
          className={`rounded-md border-l-4 px-3 py-2 ${TONE[msg.tone]}`}
          role="status"
        >
          <p className="font-semibold">{words.title}</p>
          {words.detail ? <p className="text-sm">{words.detail}</p> : null}
        </div>
        <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <div>
            <dt className="text-xs text-flash-600">
              {open ? "Price now" : live.phase === "sold" ? "Hammer price" : "Last price"}
            </dt>
            <dd
              data-testid="live-price"
              className={`code text-3xl font-semibold transition-colors duration-700 ${flashSeq ? "text-glow-600" : ""}`}
            >
              {live.bidCount
                ? formatCents(live.phase === "sold" ? (live.hammerCents ?? live.priceCents) : live.priceCents)
                : "Opens"}
            </dd>
          </div>
          <div>
            <dt className="text-xs text-flash-600">Bids placed</dt>
            <dd data-testid="live-bids" className="text-2xl font-semibold">
              {live.bidCount}
            </dd>
          </div>
          <div>
            <dt className="text-xs text-flash-600">{open ? "Closes in" : "Outcome"}</dt>
            <dd
              data-testid="live-left"
              className={`text-2xl font-semibold ${open && left != null && left < 120_000 ? "text-glow-700" : ""}`}
            >
              {open ? (left == null ? "…" : formatLeft(left)) : closedText(live.phase, live.hammerCents)}
            </dd>
            <p className="text-xs text-flash-600">
              {open ? "at " : "closed "}
              <When iso={live.closesAt} style="time" />
            </p>
          </div>
          <div>
            <dt className="text-xs text-flash-600">Reserve</dt>
            <dd className="text-lg font-semibold">
              {live.bidCount === 0 ? "—" : live.reserveMet ? "Reached" : "Not yet reached"}
            </dd>
          </div>
        </dl>
        <p className="text-xs text-flash-600" data-testid="live-link" data-connected={connected}>
          <span
            aria-hidden="true"
            className={`mr-1 inline-block h-2 w-2 rounded-full ${connected ? "bg-glow-500" : "bg-flash-300"}`}
          />
          {connected ? "Following live" : "Link lost: figures refresh when it is back"}
        </p>
        <p aria-live="polite" className="min-h-5 text-sm font-medium text-glow-700">
          {announce}
        </p>
        {showForm ? (
          <form
            onSubmit={bid}
            aria-label="Set your ceiling"
            className="fixed inset-x-0 bottom-0 z-20 flex flex-wrap items-end gap-2 border-t border-flash-200 bg-white p-3 shadow-lg sm:static sm:border-0 sm:p-0 sm:shadow-none"
          >
            <label className="min-w-0 flex-1 text-sm sm:flex-none">
              <span className="label">Your ceiling ($)</span>
              <input
                className="input code mt-1 w-full sm:w-40"
                inputMode="decimal"
                value={amount}
                onChange={(e) => setAmount(e.target.value)}
                placeholder={(live.minimumCents / 100).toFixed(2)}
                aria-describedby="min-hint"
              />
            </label>
            <button type="submit" className="btn-primary min-h-11" disabled={busy}>
              {busy ? "Sending…" : "Bid"}
            </button>
            <span id="min-hint" className="w-full pb-1 text-xs text-flash-600 sm:w-auto sm:pb-2 sm:text-sm">
              At least {formatCents(live.minimumCents)}. The house raises your bid in steps only when someone bids
              against you, never past your ceiling.
            </span>
          </form>
        ) : null}
        <div className="flex flex-wrap gap-4 text-sm">
          <Link href={lotHref} className="underline">
            Read the lot&apos;s evidence
          </Link>
          {canBid && open ? (
            <button type="button" className="underline" onClick={toggleWatch}>
              {data.you.watching ? "Stop following on my desk" : "Follow on my desk"}
            </button>
          ) : null}
        </div>
        <LotFacts lot={data.lot} />
      </section>
      <BidHistory rows={data.history} flashSeq={flashSeq} />
    </div>
  );
}
