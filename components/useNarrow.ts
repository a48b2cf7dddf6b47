"use client";

import { useSyncExternalStore } from "react";

/**
 * True on screens narrower than `px` (default 768, Tailwind's md). The server
 * and hydration render the wide layout; a phone then switches to cards, so
 * one set of controls exists at a time.
 */
export function useNarrow(px = 768): boolean {
  const q = `(max-width: ${px - 1}px)`;
  return useSyncExternalStore(
    (cb) => {
      const m = window.matchMedia(q);
      m.addEventListener("change", cb);
      return () => m.removeEventListener("change", cb);
    },
    () => window.matchMedia(q).matches,
    () => false,
  );
}
