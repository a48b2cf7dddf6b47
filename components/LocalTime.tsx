"use client";

import { useEffect, useState } from "react";

const utc = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;

/**
 * A moment in the viewer's own time zone, with the zone named ("3 Dec, 14:05 GMT+1"). The server and the first
 * client render print the same UTC text, so hydration never disagrees; the local form follows at once.
 */
export function LocalTime({ iso, withDate = true }: { iso: string; withDate?: boolean }) {
  const [text, setText] = useState(() => utc(iso));
  useEffect(() => {
    const f = new Intl.DateTimeFormat(undefined, { ...(withDate ? { day: "numeric", month: "short" } : {}), hour: "2-digit", minute: "2-digit", timeZoneName: "short" });
    setText(f.format(new Date(iso)));
  }, [iso, withDate]);
  return <time dateTime={iso} suppressHydrationWarning>{text}</time>;
}
