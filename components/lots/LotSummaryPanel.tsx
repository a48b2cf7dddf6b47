import { CautionStrip } from "@/components/CautionStrip";
import type { LotSummary, NominalPoint } from "@/lib/lots/summary";
import { formatCents } from "@/lib/money/cents";
import { ReadingsChart } from "./ReadingsChart";

const ANCHOR: Record<string, string> = {
  "mercury-vapour": "mercury",
  "beryllium-oxide": "beryllium-oxide",
  radioactive: "radioactive",
  glass: "glass",
  "high-voltage": "high-voltage",
};

function Stat({ label, value, tone }: { label: string; value: React.ReactNode; tone?: "fault" }) {
  return (
    <div className="rounded-md border border-flash-200 bg-white px-3 py-2">
      <dt className="text-xs text-flash-600">{label}</dt>
      <dd className={`text-lg font-semibold ${tone === "fault" ? "text-fault-700" : ""}`}>{value}</dd>
    </div>
  );
}

/** The lot summary dealers read before anything else. */
export function LotSummaryPanel({ summary: s, chart }: { summary: LotSummary; chart: NominalPoint[] }) {
  const t = s.tests;
  // Cautions that apply to every valve (high voltage, ordinary glass) are on every lot page already; show the specific ones.
  const specific = s.hazards.filter((h) => h.types.some((x) => x.certainty !== "always"));
  return (
    <section aria-labelledby="summary-h" className="space-y-4">
      <h2 id="summary-h" className="text-lg font-semibold">
        Summary
      </h2>
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4 lg:grid-cols-8">
        <Stat label="Tubes" value={s.tubeCount} />
        <Stat label="Tested" value={t.tested} />
        <Stat label="Strong" value={t.strong} />
        <Stat label="Good / fair" value={`${t.good} / ${t.fair}`} />
        <Stat label="Weak" value={t.weak} />
        <Stat label="Reject" value={t.reject} tone={t.reject ? "fault" : undefined} />
        <Stat label="Vacuum lost" value={s.vacuumLoss} tone={s.vacuumLoss ? "fault" : undefined} />
        <Stat
          label={`Matched pairs / quads (${s.matched.tolerancePct} %)`}
          value={`${s.matched.pairs} / ${s.matched.quads}`}
        />
      </dl>
      {specific.map((h) => (
        <CautionStrip key={h.kind} anchor={ANCHOR[h.kind]}>
          <strong>{h.title}</strong> ({h.types.map((x) => x.designation).join(", ")}; {h.tubes} tubes). {h.caution}
        </CautionStrip>
      ))}
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="card space-y-2">
          <h3 className="font-semibold">By type family</h3>
          <table className="w-full text-sm">
            <thead className="text-left text-flash-600">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Family
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Tubes
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Tested
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Strong / good / fair / weak / reject
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Pairs / quads
                </th>
              </tr>
            </thead>
            <tbody>
              {s.families.map((f) => (
                <tr key={f.key} className="border-t border-flash-100">
                  <td className="py-1 pr-3">{f.label}</td>
                  <td className="py-1 pr-3">{f.tubes}</td>
                  <td className="py-1 pr-3">{f.tests.tested}</td>
                  <td className="code py-1 pr-3">
                    {f.tests.strong} / {f.tests.good} / {f.tests.fair} / {f.tests.weak} / {f.tests.reject}
                  </td>
                  <td className="py-1 pr-3">
                    {f.pairs} / {f.quads}
                    {f.quadsProven ? "" : "*"}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {s.families.some((f) => !f.quadsProven) ? (
            <p className="text-xs text-flash-600">
              * the largest possible number of quads was not proven for this family.
            </p>
          ) : null}
          {t.testedNotGraded ? (
            <p className="text-xs text-flash-600">
              {t.testedNotGraded} tested tubes have no tester chart value to grade against.
            </p>
          ) : null}
        </div>
        <div className="card space-y-3">
          <h3 className="font-semibold">Who made them</h3>
          <ul className="text-sm">
            <li>
              Confirmed by source code: <strong>{s.attribution["source-code-confirmed"]}</strong> tubes
            </li>
            <li>
              Matched by construction: <strong>{s.attribution["construction-matched"]}</strong> tubes
            </li>
            <li>
              Unconfirmed (sold by label): <strong>{s.attribution.unconfirmed}</strong> tubes
            </li>
          </ul>
          <h3 className="font-semibold">Estimate from past sales</h3>
          {s.estimate.kind === "range" ? (
            <p className="text-sm">
              <strong>
                {formatCents(s.estimate.lowCents)}–{formatCents(s.estimate.highCents)}
              </strong>{" "}
              from {s.estimate.parts.reduce((n, p) => n + p.comparablesUsed, 0)} comparable sale(s) of single-type lots
              here
              {s.estimate.familiesWithoutComparables.length
                ? ` (not counting ${s.estimate.familiesWithoutComparables.map((f) => f.familyLabel).join(", ")}, which have none)`
                : ""}
              .
            </p>
          ) : (
            <p className="text-sm text-flash-700">No comparables yet.</p>
          )}
          {s.unknownDesignations.length ? (
            <div className="text-sm">
              <h3 className="font-semibold">Types to check</h3>
              <ul>
                {s.unknownDesignations.map((u) => (
                  <li key={u.typed}>
                    <span className="code">{u.normalised ?? u.typed}</span> ({u.tubes} tubes)
                    {u.candidates.length ? `: perhaps ${u.candidates.slice(0, 3).join(", ")}` : ""}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </div>
      </div>
      <div className="card">
        <h3 className="mb-2 font-semibold">Readings against published figures</h3>
        <ReadingsChart points={chart} />
      </div>
    </section>
  );
}
