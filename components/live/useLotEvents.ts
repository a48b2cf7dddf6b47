"use client";

import { useEffect, useRef } from "react";
import type { LotLive } from "@/lib/realtime/events";
import { createSequencer, GAP_WAIT_MS, type Sequencer } from "@/lib/realtime/sequencer";
import { joinRooms, liveSocket } from "./socket";

/**
 * Follow lot events in a room, in seq order per lot. An event behind a
 * missing seq waits up to GAP_WAIT_MS for it before `onGap` refetches.
 * `seqOf(lotId)` reads the seq the page currently shows.
 */
export function useLotEvents(
  room: string,
  seqOf: (saleLotId: string) => number | null,
  onApply: (p: LotLive) => void,
  onResync: () => void,
) {
  const cb = useRef({ seqOf, onApply, onResync });
  useEffect(() => {
    cb.current = { seqOf, onApply, onResync };
  });
  useEffect(() => {
    const queues = new Map<string, Sequencer<LotLive>>();
    const timers = new Map<string, ReturnType<typeof setTimeout>>();
    const resync = () => {
      queues.clear();
      cb.current.onResync();
    };
    const leave = joinRooms([room], resync);
    const on = (p: LotLive) => {
      const shown = cb.current.seqOf(p.saleLotId);
      if (shown == null) return;
      let q = queues.get(p.saleLotId);
      if (!q) {
        q = createSequencer<LotLive>(shown);
        queues.set(p.saleLotId, q);
      }
      q.reset(shown);
      for (const e of q.push(p)) cb.current.onApply(e);
      const t = timers.get(p.saleLotId);
      if (t) {
        clearTimeout(t);
        timers.delete(p.saleLotId);
      }
      if (q.waiting()) {
        timers.set(
          p.saleLotId,
          setTimeout(() => {
            timers.delete(p.saleLotId);
            if (queues.get(p.saleLotId)?.waiting()) {
              queues.delete(p.saleLotId);
              cb.current.onResync();
            }
          }, GAP_WAIT_MS),
        );
      }
    };
    const batch = (b: { events: { live: LotLive }[] }) => {
      for (const e of b.events) on(e.live);
    };
    const s = liveSocket();
    s.on("lot.bid", on);
    s.on("lot.closed", on);
    s.on("lot.batch", batch);
    return () => {
      leave();
      s.off("lot.bid", on);
      s.off("lot.closed", on);
      s.off("lot.batch", batch);
      for (const t of timers.values()) clearTimeout(t);
    };
  }, [room]);
}
