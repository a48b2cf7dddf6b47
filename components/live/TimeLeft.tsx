"use client";

import { formatLeft, useCountdown } from "./useCountdown";

/** Time left until a close, ticking; "…" until the browser has its clock (no hydration mismatch). */
export function TimeLeft({ iso, phase = "open" }: { iso: string; phase?: string }) {
  const ms = useCountdown(iso);
  if (phase !== "open") return <span>{phase === "sold" ? "Sold" : phase === "unsold" ? "Unsold" : "Withdrawn"}</span>;
  if (ms == null) return <span>…</span>;
  return <span className={ms < 120_000 ? "font-semibold text-glow-700" : ""}>{formatLeft(ms)}</span>;
}
