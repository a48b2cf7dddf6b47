"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRef, useState, useSyncExternalStore } from "react";
import { useViewerZone } from "@/components/time/useViewerZone";
import { apiFetch } from "@/lib/client/api";
import { lotRoom } from "@/lib/realtime/events";
import type { getSaleLot } from "@/lib/services/sales";
import { formatWhen } from "@/lib/time/format";
import { liveSocket } from "./socket";
import { closedText } from "./standing-words";
import { useLotEvents } from "./useLotEvents";

export type LiveLotData = Awaited<ReturnType<typeof getSaleLot>>;

/** The query key under which one sale lot's live state is cached. */
export const saleLotKey = (id: string) => ["sale-lot", id];

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
 * One lot's live state: the server's figures, kept current by the lot's broadcasts (applied in seq order; a gap
 * waits briefly, then refetches), which seq was just applied (to highlight it), the last extension or close in
 * words, whether the live link is up, and following the lot on the dealer's desk.
 */
export function useLiveLotState(initial: LiveLotData) {
  const qc = useQueryClient();
  const id = initial.live.saleLotId;
  const key = saleLotKey(id);
  const { data } = useQuery({
    queryKey: key,
    queryFn: () => apiFetch<LiveLotData>(`/api/sale-lots/${id}`),
    initialData: initial,
  });
  const [flashSeq, setFlashSeq] = useState<number | null>(null);
  const [announce, setAnnounce] = useState<string | null>(null);
  const zone = useViewerZone();
  const connected = useSyncExternalStore(
    followConnection,
    () => liveSocket().connected,
    () => false,
  );

  const refetchSoon = useRef<ReturnType<typeof setTimeout> | null>(null);
  const refetch = () => void qc.invalidateQueries({ queryKey: key });
  useLotEvents(
    lotRoom(id),
    (lotId) => (lotId === id ? (qc.getQueryData<LiveLotData>(key)?.live.seq ?? null) : null),
    (p) => {
      const cur = qc.getQueryData<LiveLotData>(key);
      if (!cur || p.seq <= cur.live.seq) return;
      if (p.extended) setAnnounce(`A late bid moved the close to ${formatWhen(p.closesAt, zone, "time")}.`);
      if (p.phase !== "open") setAnnounce(`${closedText(p.phase, p.hammerCents)}.`);
      setFlashSeq(p.seq);
      setTimeout(() => setFlashSeq((s) => (s === p.seq ? null : s)), 1500);
      qc.setQueryData<LiveLotData>(key, { ...cur, live: { ...cur.live, ...p } });
      // The trail and the private standing come from the server; one refetch per burst.
      if (refetchSoon.current) clearTimeout(refetchSoon.current);
      refetchSoon.current = setTimeout(refetch, 150);
    },
    refetch,
  );

  const watch = useMutation({
    mutationFn: (on: boolean) => apiFetch(`/api/sale-lots/${id}/watch`, { json: { on } }),
    onSuccess: () => refetch(),
  });
  const toggleWatch = () => watch.mutate(!data.you.watching);

  return { data, flashSeq, announce, connected, refetch, toggleWatch };
}
