import { formatCents } from "@/lib/money/cents";

const CONDITION_WORDS: Record<string, string> = {
  "new-in-box": "new in box",
  "new-old-stock": "new old stock",
  used: "used",
};

type Facts = {
  estimateLowCents: number | null;
  estimateHighCents: number | null;
  tubes: number;
  conditions: Record<string, number>;
  photoId: string | null;
};

/** What the lot is, beside the bid form: a photo, the estimate, the tube count and the condition mix. */
export function LotFacts({ lot }: { lot: Facts }) {
  const mix = Object.entries(lot.conditions)
    .map(([c, n]) => `${n} ${CONDITION_WORDS[c] ?? c}`)
    .join(", ");
  return (
    <div className="flex gap-3 border-t border-flash-100 pt-3 text-sm" data-testid="lot-facts">
      {lot.photoId ? (
        // eslint-disable-next-line @next/next/no-img-element
        <img
          src={`/api/photos/${lot.photoId}?size=thumb`}
          alt="First photo of the lot"
          className="h-20 w-20 shrink-0 rounded object-cover"
        />
      ) : null}
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
        <dt className="text-flash-600">Estimate</dt>
        <dd>
          {lot.estimateLowCents != null
            ? `${formatCents(lot.estimateLowCents)}–${formatCents(lot.estimateHighCents ?? lot.estimateLowCents)}`
            : "none yet"}
        </dd>
        <dt className="text-flash-600">Tubes</dt>
        <dd>{lot.tubes}</dd>
        <dt className="text-flash-600">Condition</dt>
        <dd>{mix || "—"}</dd>
      </dl>
    </div>
  );
}
