import type { CaseView } from "@/lib/services/disputes/presenters";
import { readingsToText } from "@/lib/disputes/readings-text";
import { FEATURE_FIELDS } from "@/lib/valves/construction-text";
import type { FeatureKey } from "@/lib/valves/construction";

const featureText = (f: Record<string, string>) =>
  Object.entries(f)
    .filter(([, v]) => v)
    .map(([k, v]) => `${FEATURE_FIELDS[k as FeatureKey]?.label ?? k}: ${v.replace(/-/g, " ")}`)
    .join(" · ");

/** Each claimed line: what the listing said beside what the buyer reports. */
export function ClaimedItems({ items }: { items: CaseView["items"] }) {
  return (
    <section aria-labelledby="claimed-h" className="space-y-3">
      <h2 id="claimed-h" className="text-lg font-semibold">
        Lines claimed
      </h2>
      {items.map((i) => (
        <article key={i.id} className="card space-y-2" aria-label={`Line ${i.position}`}>
          <h3 className="font-medium">
            Line {i.position}: <span className="code">{i.designation}</span> × {i.quantity}
            {i.soldAsSet ? " (matched set)" : ""} · {i.tubes} tube{i.tubes === 1 ? "" : "s"} claimed
          </h3>
          <div className="grid gap-3 text-sm md:grid-cols-2">
            <dl className="space-y-1">
              <dt className="label">The listing said</dt>
              <dd>
                Label “{i.listing.labelBrand || "none"}”; maker{" "}
                {i.listing.makerName ? <strong>{i.listing.makerName}</strong> : "not named"} (
                {i.listing.makerBasis.replace(/-/g, " ")})
              </dd>
              <dd>
                Codes: source <span className="code">{i.listing.sourceCode ?? "—"}</span>, date{" "}
                <span className="code">{i.listing.dateCode ?? "—"}</span>
                {i.listing.vacuumLoss ? " · vacuum loss disclosed" : ""}
              </dd>
              <dd className="text-flash-700">{featureText(i.listing.features) || "No construction recorded."}</dd>
              <dd className="text-flash-700">
                Readings:{" "}
                {i.listing.readings.length ? (
                  <span className="code">{readingsToText(i.listing.readings)}</span>
                ) : (
                  "none listed"
                )}
              </dd>
            </dl>
            <dl className="space-y-1">
              <dt className="label">The buyer reports</dt>
              <dd>
                Codes: source <span className="code">{i.report.sourceCode || "—"}</span>, date{" "}
                <span className="code">{i.report.dateCode || "—"}</span>
                {i.report.vacuumLoss ? <strong className="text-fault-700"> · white getter seen</strong> : ""}
              </dd>
              {i.report.designationSeen ? (
                <dd>
                  Printed type: <span className="code">{i.report.designationSeen}</span>
                </dd>
              ) : null}
              {i.report.tubesReceived != null ? (
                <dd>
                  Tubes received: {i.report.tubesReceived} of {i.quantity}
                </dd>
              ) : null}
              <dd className="text-flash-700">{featureText(i.report.features) || "No construction recorded."}</dd>
              <dd className="text-flash-700">
                Readings:{" "}
                {i.report.readings.length ? (
                  <span className="code">{readingsToText(i.report.readings)}</span>
                ) : (
                  "none given"
                )}
              </dd>
              {i.report.note ? <dd className="text-flash-700">“{i.report.note}”</dd> : null}
            </dl>
          </div>
        </article>
      ))}
    </section>
  );
}
