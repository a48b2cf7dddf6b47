/**
 * Dates and times as people read them: in a named time zone, 24-hour clock,
 * with the zone's short name ([SUG] our house style). Pure: Intl only.
 */
export type WhenStyle = "time" | "datetime" | "date";

/** `iso` in `timeZone`, e.g. "3 Dec 2026, 19:05 CET" (datetime), "19:05:30 CET" (time) or "3 Dec 2026" (date). */
export function formatWhen(iso: string, timeZone: string, style: WhenStyle = "datetime"): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return "";
  const zone = safeZone(timeZone);
  const opts: Intl.DateTimeFormatOptions = { timeZone: zone };
  if (style !== "time") Object.assign(opts, { day: "numeric", month: "short", year: "numeric" });
  if (style !== "date")
    Object.assign(opts, { hour: "2-digit", minute: "2-digit", hourCycle: "h23", timeZoneName: "short" });
  if (style === "time") opts.second = "2-digit";
  return new Intl.DateTimeFormat("en-GB", opts).format(d);
}

/** A zone the runtime knows, else UTC. */
export function safeZone(timeZone: string): string {
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone });
    return timeZone;
  } catch {
    return "UTC";
  }
}

/** Time left until a closing time, in words: "1 h 05 min", "4 min 09 s", "12 s", or "closing" once reached. */
export function formatLeft(ms: number): string {
  if (ms <= 0) return "closing";
  const s = Math.floor(ms / 1000);
  const h = Math.floor(s / 3600),
    m = Math.floor((s % 3600) / 60),
    sec = s % 60;
  return h ? `${h} h ${String(m).padStart(2, "0")} min` : m ? `${m} min ${String(sec).padStart(2, "0")} s` : `${sec} s`;
}
