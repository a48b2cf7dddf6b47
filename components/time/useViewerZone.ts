"use client";

import { useSyncExternalStore } from "react";

const subscribe = () => () => undefined;
const clientZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || "UTC";
const serverZone = () => "UTC";

/**
 * The viewer's time zone. The server (and hydration) render in UTC, then the
 * browser re-renders in its own zone: no server/client text mismatch.
 */
export function useViewerZone(): string {
  return useSyncExternalStore(subscribe, clientZone, serverZone);
}

const noNow = () => null;
let nowCache = 0;
const tickSubs = new Set<() => void>();
let timer: ReturnType<typeof setInterval> | null = null;
function subscribeTick(cb: () => void) {
  tickSubs.add(cb);
  if (!timer)
    timer = setInterval(() => {
      nowCache = Date.now();
      for (const s of tickSubs) s();
    }, 1000);
  return () => {
    tickSubs.delete(cb);
    if (!tickSubs.size && timer) {
      clearInterval(timer);
      timer = null;
    }
  };
}
const clientNow = () => {
  if (!timer || !nowCache) nowCache = Date.now();
  return nowCache;
};

/** The browser's clock ticking each second, or null on the server and during hydration. */
export function useNow(): number | null {
  return useSyncExternalStore(subscribeTick, clientNow, noNow);
}
