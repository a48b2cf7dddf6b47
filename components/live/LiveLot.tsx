"use client";

import Link from "next/link";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useRef, useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { ApiClientError, apiFetch } from "@/lib/client/api";
import { formatCents, parseMoneyToCents } from "@/lib/money/cents";
import { lotRoom, type LotLive } from "@/lib/realtime/events";
import type { getSaleLot } from "@/lib/services/sales";
import { formatLeft, useCountdown } from "./useCountdown";
import { joinRooms, liveSocket } from "./socket";

type Data = Awaited<ReturnType<typeof getSaleLot>>;

/**
 * Send a bid over the live socket when it is connected (no extra round trip
 * through the web server), else through the HTTP route; both give the same
 * answer and the same refusals.
 */
async function sendBid(saleLotId: string, maxCents: number, idempotencyKey: string): Promise<{ leading: boolean; live: LotLive; outcome: string }> {
  const s = liveSocket();
  if (s.connected) {
    try {
      const ack = await s.timeout(10_000).emitWithAck("bid.place", { saleLotId, maxCents, idempotencyKey });
      if (ack.ok) return ack.result;
      throw new ApiClientError(ack.error.code === "conflict" ? 409 : 400, ack.error.code, ack.error.message, ack.error.fields);
    } catch (e) {
      if (e instanceof ApiClientError) throw e;
      // No answer in time: the same key over HTTP is safe (the server answers a retry with the first result).
    }
  }
  return apiFetch(`/api/sale-lots/${saleLotId}/bids`, { json: { maxCents, idempotencyKey } });
}
type Answer = { tone: "sound" | "fault"; text: string };

/**
 * One lot in a live sale: price, bids, time left, the dealer's standing and
 * a maximum-bid form. Broadcasts are applied in sequence order; a gap, a
 * reconnect or our own bid refetches the whole state from the server.
 */
export function LiveLot({ initial, canBid, lotHref }: { initial: Data; canBid: boolean; lotHref: string }) {
  const qc = useQueryClient();
  const id = initial.live.saleLotId;
  const key = ["sale-lot", id];
  const { data } = useQuery({ queryKey: key, queryFn: () => apiFetch<Data>(`/api/sale-lots/${id}`), initialData: initial });
  const [flashSeq, setFlashSeq] = useState<number | null>(null);
  const [announce, setAnnounce] = useState<string | null>(null);
  const [answer, setAnswer] = useState<Answer | null>(null);
  const [amount, setAmount] = useState("");
  const [busy, setBusy] = useState(false);
  const keyRef = useRef<string | null>(null);
  const live = data.live;
  const left = useCountdown(live.closesAt);
  const [connected, setConnected] = useState(false);
  useEffect(() => {
    const s = liveSocket();
    const on = () => setConnected(true);
    const off = () => setConnected(false);
    setConnected(s.connected);
    s.on("connect", on);
    s.on("disconnect", off);
    return () => { s.off("connect", on); s.off("disconnect", off); };
  }, []);

  useEffect(() => {
    const refetch = () => void qc.invalidateQueries({ queryKey: key });
    const leave = joinRooms([lotRoom(id)], refetch);
    const apply = (p: LotLive) => {
      if (p.saleLotId !== id) return;
      const cur = qc.getQueryData<Data>(key);
      if (!cur || p.seq <= cur.live.seq) return;
      if (p.seq > cur.live.seq + 1) return refetch();
      if (p.extended) setAnnounce(`A late bid extended the close to ${new Date(p.closesAt).toLocaleTimeString()}.`);
      setFlashSeq(p.seq);
      setTimeout(() => setFlashSeq((s) => (s === p.seq ? null : s)), 1500);
      qc.setQueryData<Data>(key, { ...cur, live: { ...cur.live, ...p } });
      refetch(); // history and standing come from the server
    };
    const s = liveSocket();
    s.on("lot.bid", apply);
    s.on("lot.closed", apply);
    return () => { leave(); s.off("lot.bid", apply); s.off("lot.closed", apply); };
  }, [id]); // eslint-disable-line react-hooks/exhaustive-deps

  async function bid(e: React.FormEvent) {
    e.preventDefault();
    setAnswer(null);
    let cents: number;
    try { cents = parseMoneyToCents(amount); } catch { return setAnswer({ tone: "fault", text: "Enter an amount like 125 or 125.50." }); }
    keyRef.current ??= crypto.randomUUID(); // the same key if this very bid is retried
    setBusy(true);
    try {
      const r = await sendBid(id, cents, keyRef.current);
      setAnswer(r.leading
        ? { tone: "sound", text: `Bid accepted: you lead at ${formatCents(r.live.priceCents)}, with your maximum of ${formatCents(cents)}.` }
        : { tone: "fault", text: `Bid accepted, but another bidder's maximum is higher: the price is now ${formatCents(r.live.priceCents)}.` });
      setAmount("");
      keyRef.current = null;
    } catch (err) {
      if (err instanceof ApiClientError && err.status === 409) keyRef.current = null; // refused: the next try is a new bid
      setAnswer({ tone: "fault", text: `Bid refused: ${(err as Error).message}` });
    } finally {
      setBusy(false);
      void qc.invalidateQueries({ queryKey: key });
    }
  }

  async function toggleWatch() {
    await apiFetch(`/api/sale-lots/${id}/watch`, { json: { on: !data.you.watching } });
    void qc.invalidateQueries({ queryKey: key });
  }

  const open = live.phase === "open";
  const standing = data.you.ownLot ? "This is your own lot: you cannot bid on it."
    : !data.you.bidding ? "You have not bid on this lot."
    : data.you.leading ? `You lead. Your maximum: ${formatCents(data.you.maxCents ?? 0)} (only you see it).`
    : `You have been outbid. Your maximum was ${formatCents(data.you.maxCents ?? 0)}.`;
  return (
    <div className="grid gap-5 lg:grid-cols-[2fr_1fr]">
      <section aria-labelledby="live-h" className="card space-y-4">
        <h2 id="live-h" className="sr-only">Live bidding</h2>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <div>
            <p className="text-xs text-flash-600">{open ? "Current price" : live.phase === "sold" ? "Hammer price" : "Highest bid"}</p>
            <p data-testid="live-price" className={`code text-3xl font-semibold transition-colors duration-700 ${flashSeq ? "text-glow-600" : ""}`}>
              {live.bidCount ? formatCents(live.phase === "sold" ? live.hammerCents ?? live.priceCents : live.priceCents) : "No bids"}
            </p>
          </div>
          <div><p className="text-xs text-flash-600">Bids</p><p data-testid="live-bids" className="text-2xl font-semibold">{live.bidCount}</p></div>
          <div>
            <p className="text-xs text-flash-600">Time left</p>
            <p data-testid="live-left" className={`text-2xl font-semibold ${open && left < 120_000 ? "text-glow-700" : ""}`}>
              {open ? formatLeft(left) : live.phase === "sold" ? "Sold" : "Closed unsold"}
            </p>
            <p className="text-xs text-flash-600">closes <time dateTime={live.closesAt}>{new Date(live.closesAt).toLocaleTimeString()}</time></p>
          </div>
          <div>
            <p className="text-xs text-flash-600">Reserve</p>
            <p className="text-lg font-semibold">{live.bidCount === 0 ? "—" : live.reserveMet ? "Met" : "Not met"}</p>
          </div>
        </div>
        <p className="text-xs text-flash-600" data-testid="live-link" data-connected={connected}>
          <span aria-hidden="true" className={`mr-1 inline-block h-2 w-2 rounded-full ${connected ? "bg-glow-500" : "bg-flash-300"}`} />
          {connected ? "Live: updates arrive as bids are placed" : "Reconnecting… the page refreshes its figures when the link is back"}
        </p>
        <p aria-live="polite" className="min-h-5 text-sm font-medium text-glow-700">{announce}</p>
        <p data-testid="standing" className="text-sm">{standing}</p>
        {open && canBid && !data.you.ownLot ? (
          <form onSubmit={bid} className="flex flex-wrap items-end gap-2" aria-label="Place a maximum bid">
            <label className="text-sm">
              <span className="label">Your maximum ($)</span>
              <input className="input code mt-1 w-40" inputMode="decimal" value={amount} onChange={(e) => setAmount(e.target.value)}
                placeholder={(live.minimumCents / 100).toFixed(2)} aria-describedby="min-hint" />
            </label>
            <button type="submit" className="btn-primary" disabled={busy}>Place bid</button>
            <span id="min-hint" className="pb-2 text-sm text-flash-600">Next minimum {formatCents(live.minimumCents)}. We bid for you up to your maximum.</span>
          </form>
        ) : null}
        {answer ? <FormAlert tone={answer.tone}>{answer.text}</FormAlert> : null}
        <div className="flex gap-4 text-sm">
          <Link href={lotHref} className="underline">Read the lot&apos;s evidence</Link>
          {canBid ? <button type="button" className="underline" onClick={() => void toggleWatch()}>{data.you.watching ? "Stop watching" : "Watch this lot"}</button> : null}
        </div>
      </section>
      <section aria-labelledby="hist-h" className="card space-y-2">
        <h2 id="hist-h" className="font-semibold">Bid history</h2>
        {data.history.length ? (
          <ol className="max-h-96 space-y-1 overflow-auto text-sm">
            {data.history.map((b) => (
              <li key={b.seq} className={`flex justify-between border-b border-flash-100 pb-1 ${b.seq === flashSeq ? "bg-glow-50" : ""} ${b.retracted ? "text-flash-400 line-through" : ""}`}>
                <span>Paddle {b.paddle ?? "?"}{b.mine ? " (you)" : ""}</span>
                <span className="code">{formatCents(b.priceAfterCents)}</span>
                <span className="text-flash-500">{new Date(b.at).toLocaleTimeString()}</span>
              </li>
            ))}
          </ol>
        ) : <p className="text-sm text-flash-600">No bids yet.</p>}
        <p className="text-xs text-flash-500">Bidders appear by paddle number only. Prices shown are after each bid; maximums stay private.</p>
      </section>
    </div>
  );
}
