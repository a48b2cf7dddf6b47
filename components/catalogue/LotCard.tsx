import Link from "next/link";
import { When } from "@/components/time/When";
import { HAZARD_WORDS } from "@/components/lots/words";
import { formatCents } from "@/lib/money/cents";
import type { CatalogueLot } from "@/lib/services/catalogue/search";
import { GRADE_WORDS, RELATION_LABEL, STATUS_WORDS } from "./words";

const STATUS_TONE: Record<string, string> = {
  approved: "border-flash-300 bg-flash-50 text-flash-800",
  upcoming: "border-glow-200 bg-glow-50 text-glow-700",
  live: "border-glow-400 bg-glow-100 text-glow-700",
  sold: "border-flash-400 bg-white text-flash-700",
};

function Price({ lot }: { lot: CatalogueLot }) {
  if (lot.status === "sold" && lot.priceCents != null)
    return (
      <p>
        <span className="text-flash-600">Hammer</span> <strong className="code">{formatCents(lot.priceCents)}</strong>
      </p>
    );
  if (lot.status === "live" && lot.priceCents != null)
    return (
      <p>
        <span className="text-flash-600">Now</span> <strong className="code">{formatCents(lot.priceCents)}</strong>{" "}
        <span className="text-flash-600">
          · {lot.bids} bid{lot.bids === 1 ? "" : "s"}
        </span>
      </p>
    );
  if (lot.estimateLowCents != null)
    return (
      <p>
        <span className="text-flash-600">Estimate</span>{" "}
        <span className="code">
          {formatCents(lot.estimateLowCents)}–{formatCents(lot.estimateHighCents ?? lot.estimateLowCents)}
        </span>
      </p>
    );
  return null;
}

/** One lot in the catalogue: picture, what it is, where it stands, and how it matched the search. */
export function LotCard({ lot }: { lot: CatalogueLot }) {
  const facts = [
    `${lot.tubes} tube${lot.tubes === 1 ? "" : "s"}`,
    lot.grades.length
      ? `graded ${lot.grades
          .map((g) => GRADE_WORDS[g] ?? g)
          .join(", ")
          .toLowerCase()}`
      : "not graded",
    lot.vacuumLossTubes ? `${lot.vacuumLossTubes} with white getter` : "no white getters declared",
    ...(lot.quads
      ? [`${lot.quads} matched quad${lot.quads === 1 ? "" : "s"}`]
      : lot.pairs
        ? [`${lot.pairs} matched pair${lot.pairs === 1 ? "" : "s"}`]
        : []),
  ];
  return (
    <li className="card flex gap-3 sm:gap-4" data-testid="catalogue-lot">
      <Link
        href={`/lots/${lot.id}`}
        className="block h-20 w-20 shrink-0 overflow-hidden rounded-md border border-flash-200 bg-flash-100 sm:h-24 sm:w-24"
        tabIndex={-1}
        aria-hidden="true"
      >
        {lot.thumbnail ? (
          // eslint-disable-next-line @next/next/no-img-element -- permission-checked route, sized thumbnail
          <img
            src={lot.thumbnail}
            alt=""
            width={96}
            height={96}
            loading="lazy"
            decoding="async"
            className="h-full w-full object-cover"
          />
        ) : (
          <span className="flex h-full items-center justify-center text-xs text-flash-500">No photo</span>
        )}
      </Link>
      <div className="min-w-0 flex-1 space-y-1 text-sm">
        <div className="flex flex-wrap items-center gap-2">
          <h3 className="text-base font-semibold">
            <Link href={`/lots/${lot.id}`} className="underline-offset-4 hover:underline">
              {lot.title}
            </Link>
          </h3>
          <span className={`rounded-full border px-2 py-0.5 text-xs font-medium ${STATUS_TONE[lot.status] ?? ""}`}>
            {STATUS_WORDS[lot.status]}
          </span>
        </div>
        {lot.matches.length ? (
          <p className="text-flash-800" data-testid="lot-matches">
            {lot.matches.map((m, i) => (
              <span key={m.designation}>
                {i ? "; " : ""}
                <span className="code font-semibold">
                  {m.quantity} × {m.designation}
                </span>{" "}
                <span className="text-flash-600">({RELATION_LABEL[m.relation]})</span>
              </span>
            ))}
          </p>
        ) : null}
        <p className="text-flash-700">
          {facts.join(" · ")}
          {lot.hazards.length ? (
            <>
              {" "}
              · <span className="text-fault-700">{lot.hazards.map((h) => HAZARD_WORDS[h] ?? h).join(", ")}</span>
            </>
          ) : null}
        </p>
        <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
          <Price lot={lot} />
          {lot.closesAt && lot.status !== "sold" ? (
            <p className="text-flash-600">
              {lot.status === "upcoming" ? "First bids from" : "Closes"}{" "}
              <When iso={lot.status === "upcoming" && lot.startsAt ? lot.startsAt : lot.closesAt} />
            </p>
          ) : null}
          {lot.soldAt && lot.status === "sold" ? (
            <p className="text-flash-600">
              Sold <When iso={lot.soldAt} />
            </p>
          ) : null}
          {lot.saleId && lot.saleLotId && lot.status === "live" ? (
            <Link
              href={`/sales/${lot.saleId}/lots/${lot.saleLotId}`}
              className="font-medium text-glow-700 underline underline-offset-4"
            >
              Bid on it
            </Link>
          ) : null}
        </div>
      </div>
    </li>
  );
}
