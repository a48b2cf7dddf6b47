import Link from "next/link";
import { notFound } from "next/navigation";
import { AcceptMatch } from "@/components/shelf/AcceptMatch";
import { Candidates } from "@/components/shelf/Candidates";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { shelfTube } from "@/lib/services/shelf";
import { FEATURE_FIELDS } from "@/lib/valves/construction-text";

export const metadata = { title: "Shelf tube" };

const BASIS = {
  "source-code-confirmed": "Confirmed by source code",
  "construction-matched": "Matched by construction",
  unconfirmed: "Unconfirmed",
} as Record<string, string>;

export default async function ShelfTubePage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageViewer("shelf.use", "/shelf");
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const data = await shelfTube(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const t = data.tube;
  const top = data.candidates[0];
  return (
    <div className="space-y-5">
      <p className="text-sm">
        <Link href="/shelf" className="underline">
          Unconfirmed shelf
        </Link>{" "}
        / <span className="code">{t.designation}</span>
      </p>
      <h1 className="text-2xl font-semibold">
        <span className="code">{t.designation}</span>{" "}
        {t.labelBrand ? <span className="text-base font-normal text-flash-700">labelled “{t.labelBrand}”</span> : null}
      </h1>
      <dl className="card grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        <div>
          <dt className="inline text-flash-600">Status: </dt>
          <dd className="inline">
            {BASIS[t.basis]}
            {t.makerName ? ` · ${t.makerName}` : ""}
          </dd>
        </div>
        <div>
          <dt className="inline text-flash-600">Codes: </dt>
          <dd className="code inline">{[t.sourceCode, t.dateCode].filter(Boolean).join(" · ") || "none read"}</dd>
        </div>
        <div className="sm:col-span-2">
          <dt className="inline text-flash-600">Construction: </dt>
          <dd className="inline">
            {Object.entries(t.features)
              .map(
                ([k, v]) => `${FEATURE_FIELDS[k as keyof typeof FEATURE_FIELDS]?.label ?? k}: ${v.replace(/-/g, " ")}`,
              )
              .join(" · ") || "none recorded"}
          </dd>
        </div>
        {t.notes ? (
          <div className="sm:col-span-2">
            <dt className="inline text-flash-600">Notes: </dt>
            <dd className="inline">{t.notes}</dd>
          </div>
        ) : null}
      </dl>
      <section aria-labelledby="cand-h" className="card space-y-3">
        <h2 id="cand-h" className="text-lg font-semibold">
          Best candidates
        </h2>
        <p className="text-sm text-flash-700">
          Compared with {data.profilesCompared} confirmed reference{data.profilesCompared === 1 ? "" : "s"} of this type
          family. Confidence is high only when several independent parts of the construction agree.
        </p>
        <Candidates candidates={data.candidates} />
        {t.basis === "unconfirmed" && top && top.confidence !== "low" ? (
          <AcceptMatch tubeId={t.id} makerName={top.makerName} confidence={top.confidence} />
        ) : null}
      </section>
    </div>
  );
}
