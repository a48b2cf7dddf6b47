"use client";

import { formatWhen, type WhenStyle } from "@/lib/time/format";
import { useViewerZone } from "./useViewerZone";

/** A moment in the viewer's own time zone, named (UTC until the browser takes over). */
export function When({
  iso,
  style = "datetime",
  className,
}: {
  iso: string | null | undefined;
  style?: WhenStyle;
  className?: string;
}) {
  const zone = useViewerZone();
  if (!iso) return null;
  return (
    <time dateTime={iso} className={className}>
      {formatWhen(iso, zone, style)}
    </time>
  );
}
