"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRef, useState } from "react";
import type { LastAction } from "@/lib/auction/standing";
import { ApiClientError, apiFetch } from "@/lib/client/api";
import { parseMoneyToCents } from "@/lib/money/cents";
import type { LotLive } from "@/lib/realtime/events";
import { liveSocket } from "./socket";
import { saleLotKey, type LiveLotData } from "./useLiveLotState";

type BidAnswer = {
  accepted: true;
  outcome: "first-bid" | "new-leader" | "outbid-by-proxy" | "max-raised";
  seq: number;
  leading: boolean;
  live: LotLive;
  yourMaxCents: number;
};

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

/** The lot as cached, with the accepted bid's public state and the dealer's own standing folded in. */
function withOwnBid(cur: LiveLotData, r: BidAnswer): LiveLotData {
  return {
    ...cur,
    live: { ...cur.live, ...r.live },
    you: {
      ...cur.you,
      bidding: true,
      leading: r.leading,
      maxCents: Math.max(cur.you.maxCents ?? 0, r.yourMaxCents),
    },
  };
}

/**
 * The dealer's ceiling bid: the amount being typed, the send (socket or HTTP, never retried on its own; a retry
 * by the dealer reuses the key) and the dealer's last action, from which the panel's message is derived.
 */
export function useCeilingBid({ id, seq, refetch }: { id: string; seq: number; refetch: () => void }) {
  const qc = useQueryClient();
  const [last, setLast] = useState<LastAction | null>(null);
  const [amount, setAmount] = useState("");
  const keyRef = useRef<string | null>(null);
  const placeBid = useMutation({
    mutationFn: (b: { cents: number; idempotencyKey: string }) => sendBid(id, b.cents, b.idempotencyKey),
  });

  async function bid(e: React.FormEvent) {
    e.preventDefault();
    let cents: number;
    try {
      cents = parseMoneyToCents(amount);
    } catch {
      return setLast({ kind: "refused", seq, message: "Enter an amount like 125 or 125.50." });
    }
    keyRef.current ??= crypto.randomUUID(); // the same key if this very bid is retried
    try {
      const r = await placeBid.mutateAsync({ cents, idempotencyKey: keyRef.current });
      setLast({ kind: "bid", outcome: r.outcome, seq: r.live.seq, maxCents: r.yourMaxCents });
      const cur = qc.getQueryData<LiveLotData>(saleLotKey(id));
      if (cur && r.live.seq >= cur.live.seq) qc.setQueryData<LiveLotData>(saleLotKey(id), withOwnBid(cur, r));
      setAmount("");
      keyRef.current = null;
    } catch (err) {
      if (err instanceof ApiClientError && err.status === 409) keyRef.current = null; // refused: the next try is a new bid
      setLast({ kind: "refused", seq, message: (err as Error).message });
    } finally {
      refetch();
    }
  }

  return { amount, setAmount, last, busy: placeBid.isPending, bid };
}
