"use client";

import { useNow } from "@/components/time/useViewerZone";

export { formatLeft } from "@/lib/time/format";

/**
 * Milliseconds left until `iso`, ticking every second, or null on the server
 * and during hydration (so server and browser render the same text).
 */
export function useCountdown(iso: string): number | null {
  const now = useNow();
  if (now == null) return null;
  return Math.max(0, Date.parse(iso) - now);
}
