"use client";

import { useRef, useState } from "react";

type Photo = { id: string; itemId: string | null; caption: string; width: number; height: number };

/**
 * A lot's photos to look through: one large picture with its caption, the rest as a strip of thumbnails.
 * Arrow keys (with the gallery focused), the buttons and a sideways swipe move between them. Pictures
 * load lazily; only the one shown is fetched at full size.
 */
export function PhotoGallery({ photos, labelOf }: { photos: Photo[]; labelOf: Record<string, string> }) {
  const [at, setAt] = useState(0);
  const swipe = useRef<number | null>(null);
  if (!photos.length) return <p className="text-sm text-flash-600">No photos of this lot yet.</p>;
  const go = (d: number) => setAt((i) => (i + d + photos.length) % photos.length);
  const p = photos[at]!;
  const what = (x: Photo) =>
    `${x.itemId ? (labelOf[x.itemId] ?? "An item") : "The whole lot"}${x.caption ? `: ${x.caption}` : ""}`;
  const alt = (x: Photo) =>
    `Photo of ${x.itemId ? (labelOf[x.itemId] ?? "an item") : "the lot"}${x.caption ? `: ${x.caption}` : ""}`;
  return (
    <div
      className="space-y-2 outline-none focus-visible:ring-2 focus-visible:ring-glow-400"
      tabIndex={0}
      role="region"
      aria-roledescription="gallery"
      aria-label={`Photos, ${at + 1} of ${photos.length}: use the arrow keys`}
      onKeyDown={(e) => {
        if (e.key === "ArrowRight") {
          e.preventDefault();
          go(1);
        }
        if (e.key === "ArrowLeft") {
          e.preventDefault();
          go(-1);
        }
      }}
      onPointerDown={(e) => {
        swipe.current = e.clientX;
      }}
      onPointerUp={(e) => {
        if (swipe.current !== null && Math.abs(e.clientX - swipe.current) > 40) go(e.clientX < swipe.current ? 1 : -1);
        swipe.current = null;
      }}
    >
      <figure className="relative overflow-hidden rounded-lg border border-flash-200 bg-flash-100">
        {/* eslint-disable-next-line @next/next/no-img-element -- permission-checked route, not a static asset */}
        <img
          key={p.id}
          src={`/api/photos/${p.id}?size=full`}
          alt={alt(p)}
          width={p.width}
          height={p.height}
          decoding="async"
          className="mx-auto max-h-[28rem] w-auto touch-pan-y select-none object-contain"
          draggable={false}
        />
        {photos.length > 1 ? (
          <>
            <button
              type="button"
              onClick={() => go(-1)}
              className="absolute left-2 top-1/2 -translate-y-1/2 rounded-full border border-flash-300 bg-white/90 px-3 py-2 text-lg"
              aria-label="Previous photo"
            >
              ‹
            </button>
            <button
              type="button"
              onClick={() => go(1)}
              className="absolute right-2 top-1/2 -translate-y-1/2 rounded-full border border-flash-300 bg-white/90 px-3 py-2 text-lg"
              aria-label="Next photo"
            >
              ›
            </button>
          </>
        ) : null}
        <figcaption className="border-t border-flash-200 bg-white px-3 py-2 text-sm text-flash-700" aria-live="polite">
          {at + 1} of {photos.length} · {what(p)}
        </figcaption>
      </figure>
      {photos.length > 1 ? (
        <ul className="flex gap-2 overflow-x-auto pb-1">
          {photos.map((x, i) => (
            <li key={x.id} className="shrink-0">
              <button
                type="button"
                onClick={() => setAt(i)}
                aria-label={`Show photo ${i + 1}: ${what(x)}`}
                aria-current={i === at ? "true" : undefined}
                className={`block h-16 w-16 overflow-hidden rounded border-2 ${i === at ? "border-glow-500" : "border-transparent"}`}
              >
                {/* eslint-disable-next-line @next/next/no-img-element -- permission-checked route */}
                <img
                  src={`/api/photos/${x.id}?size=list`}
                  alt=""
                  width={64}
                  height={64}
                  loading="lazy"
                  className="h-full w-full object-cover"
                />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
