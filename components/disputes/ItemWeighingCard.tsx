import type { ItemWeighing, SideRanking, GradedReading, Verdict } from "@/lib/disputes/weigh";
import type { CaseView } from "@/lib/services/disputes/presenters";
import { FEATURE_FIELDS } from "@/lib/valves/construction-text";
import type { FeatureKey } from "@/lib/valves/construction";

const VERDICT: Record<Verdict, { words: string; tone: string }> = {
  supports: { words: "Evidence supports the claim", tone: "border-fault-600 bg-fault-50 text-fault-700" },
  "does-not-support": {
    words: "Evidence does not support the claim",
    tone: "border-sound-600 bg-sound-50 text-sound-700",
  },
  inconclusive: {
    words: "Inconclusive: judge from photos and messages",
    tone: "border-flash-400 bg-flash-100 text-flash-800",
  },
};
const label = (k: string) => FEATURE_FIELDS[k as FeatureKey]?.label ?? k;
const words = (v: string) => v.replace(/-/g, " ");

function Ranking({ r, claimed }: { r: SideRanking; claimed: string | null }) {
  return (
    <div className="space-y-1">
      <p>
        Source code points to: {r.sourceCodeMaker ? <strong>{r.sourceCodeMaker}</strong> : "no registered maker"}{" "}
        <span className="text-flash-500">(evidence, not proof: a code may name the brand owner)</span>
      </p>
      {r.candidates.length ? (
        <ol className="space-y-1">
          {r.candidates.map((c, i) => (
            <li
              key={c.profileId}
              className={`rounded border px-2 py-1 ${claimed && c.makerName === claimed ? "border-glow-400" : "border-flash-200"}`}
            >
              <span className="font-medium">
                {i + 1}. {c.makerName}
              </span>{" "}
              · {Math.round(c.similarity * 100)} % alike · {c.confidence} confidence
              {claimed && c.makerName === claimed ? (
                <span className="ml-1 text-xs text-glow-700">(the listed maker)</span>
              ) : null}
              <div className="text-xs">
                <span className="text-sound-700">agree: {c.matching.map(label).join(", ") || "none"}</span>
                {" · "}
                <span className="text-fault-700">conflict: {c.conflicting.map(label).join(", ") || "none"}</span>
                {c.partial.length ? (
                  <span className="text-flash-600"> · sometimes: {c.partial.map(label).join(", ")}</span>
                ) : null}
              </div>
            </li>
          ))}
        </ol>
      ) : (
        <p className="text-flash-600">No reference profile to compare these features with.</p>
      )}
    </div>
  );
}

function Readings({ rows }: { rows: GradedReading[] }) {
  if (!rows.length) return <p className="text-flash-600">No readings.</p>;
  return (
    <table className="w-full text-xs">
      <thead>
        <tr className="text-left text-flash-600">
          <th>Tube</th>
          <th>Sections</th>
          <th>Chart / nominal</th>
          <th>% of new</th>
          <th>Grade</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.tubeNo} className="border-t border-flash-100">
            <td>{r.tubeNo}</td>
            <td className="code">{r.sections.join(" / ") || "—"}</td>
            <td className="code">{r.chartNewValue ?? "—"}</td>
            <td className="code">{r.worstPercentOfNew != null ? `${r.worstPercentOfNew.toFixed(0)} %` : "—"}</td>
            <td className={r.grade === "reject" ? "font-medium text-fault-700" : ""}>{words(r.grade)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** One claimed line in the mediator's workspace: listing and buyer side by side, ranked and graded, with a verdict. */
export function ItemWeighingCard({ item, w }: { item: CaseView["items"][number]; w: ItemWeighing }) {
  const v = VERDICT[w.verdict];
  return (
    <article className="card space-y-3" aria-label={`Line ${item.position} compared`}>
      <header className="flex flex-wrap items-center gap-3">
        <h3 className="font-semibold">
          Line {item.position}: <span className="code">{item.designation}</span> × {item.quantity}
          {item.soldAsSet ? " (matched set)" : ""} · {item.tubes} claimed
        </h3>
        <span
          data-testid={`verdict-${item.position}`}
          className={`rounded-full border px-2.5 py-0.5 text-xs font-medium ${v.tone}`}
        >
          {v.words}
        </span>
      </header>
      <div className="grid gap-4 text-sm lg:grid-cols-2">
        <section className="space-y-2" aria-label="What the listing claimed">
          <h4 className="label">What the listing claimed</h4>
          <p>
            Label “{item.listing.labelBrand || "none"}” · maker <strong>{item.listing.makerName ?? "not named"}</strong>{" "}
            ({words(item.listing.makerBasis)}) · codes <span className="code">{item.listing.sourceCode ?? "—"}</span> /{" "}
            <span className="code">{item.listing.dateCode ?? "—"}</span>
          </p>
          <p className="text-flash-700">
            {Object.entries(item.listing.features)
              .filter(([, x]) => x)
              .map(([k, x]) => `${label(k)}: ${words(x)}`)
              .join(" · ") || "No construction recorded."}
          </p>
          <Ranking r={w.listing.ranking} claimed={item.listing.makerName} />
          <Readings rows={w.listing.readings} />
        </section>
        <section className="space-y-2" aria-label="What the buyer reports">
          <h4 className="label">What the buyer reports</h4>
          <p>
            Codes <span className="code">{item.report.sourceCode || "—"}</span> /{" "}
            <span className="code">{item.report.dateCode || "—"}</span>
            {item.report.vacuumLoss ? <strong className="text-fault-700"> · white getter</strong> : ""}
            {item.report.note ? ` · “${item.report.note}”` : ""}
          </p>
          <p className="text-flash-700">
            {Object.entries(item.report.features)
              .filter(([, x]) => x)
              .map(([k, x]) => `${label(k)}: ${words(x)}`)
              .join(" · ") || "No construction recorded."}
          </p>
          <Ranking r={w.buyer.ranking} claimed={item.listing.makerName} />
          <Readings rows={w.buyer.readings} />
        </section>
      </div>
      <ul className="list-disc space-y-0.5 pl-5 text-sm">
        {w.findings.map((f, i) => (
          <li key={i}>{f}</li>
        ))}
      </ul>
    </article>
  );
}
