"use client";

import { useEffect, useState } from "react";

/** Milliseconds left until `iso`, ticking every second (0 once past). */
export function useCountdown(iso: string): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, []);
  return Math.max(0, Date.parse(iso) - now);
}

export function formatLeft(ms: number): string {
  if (ms <= 0) return "closing";
  const s = Math.floor(ms / 1000);
  const h = Math.floor(s / 3600), m = Math.floor((s % 3600) / 60), sec = s % 60;
  return h ? `${h} h ${m} min` : m ? `${m} min ${String(sec).padStart(2, "0")} s` : `${sec} s`;
}
