import type { DateCodeAnswer as Answer } from "@/lib/services/date-codes";

const FLAG_WORDS: Record<string, string> = {
  "joined-source-code": "A source code was printed joined to the date",
  "may-be-source-code": "Three digits can also be a source code",
  "ambiguous-decade": "More than one decade fits: check construction, label and box",
  "predates-type": "A reading is earlier than the type itself: look again at the code",
  "after-end-of-production": "A reading is after the set end of production",
  "predates-suffix": "A reading is earlier than the envelope style",
  "contradicts-evidence": "A reading contradicts other evidence",
  "week-53": "Week 53: only some years have one",
  "type-introduction-unknown": "The type's introduction year is unknown, so every decade from 1930 is open",
  "no-plausible-year": "No year fits everything known",
};

/** Ranked readings of a code off the glass, with what was dropped and why. */
export function DateCodeAnswer({ data }: { data: Answer }) {
  const { eia, european } = data;
  return (
    <section aria-labelledby="code-h" className="space-y-4">
      <h2 id="code-h" className="text-xl font-semibold">
        Code <span className="code">{data.code}</span>
        {data.type ? (
          <span className="text-base font-normal text-flash-600">
            {" "}
            on a <span className="code">{data.type.designation}</span>
            {data.type.introducedYear ? ` (introduced ${data.type.introducedYear})` : ""}
          </span>
        ) : null}
      </h2>
      <div className="card space-y-3">
        <h3 className="font-semibold">As a year-week date code</h3>
        {eia.ok ? (
          <>
            {eia.sourceCode ? (
              <p className="text-sm">
                Source code printed with it: <span className="code">{eia.sourceCode}</span>
              </p>
            ) : null}
            {eia.readings.length ? (
              <ol className="space-y-2">
                {eia.readings.map((r) => (
                  <li key={`${r.form}-${r.year}-${r.week}`} className="rounded-md border border-flash-200 px-3 py-2">
                    <p>
                      <span className="mr-2 inline-block rounded bg-flash-100 px-1.5 text-xs font-semibold">
                        #{r.rank}
                      </span>
                      <strong>{r.year}</strong>, week {r.week}{" "}
                      <span className="text-sm text-flash-600">({r.form})</span>
                    </p>
                    <ul className="mt-1 list-disc pl-5 text-sm text-flash-700">
                      {r.reasons.map((x) => (
                        <li key={x}>{x}</li>
                      ))}
                    </ul>
                  </li>
                ))}
              </ol>
            ) : (
              <p className="text-sm text-fault-700">No reading survives.</p>
            )}
            {eia.flags.length ? (
              <ul className="text-sm text-flash-800">
                {eia.flags.map((f) => (
                  <li key={f}>• {FLAG_WORDS[f] ?? f}</li>
                ))}
              </ul>
            ) : null}
          </>
        ) : (
          <p role="status" className="text-sm text-fault-700">
            Not a year-week code: {eia.error.message}
          </p>
        )}
        {eia.rejected.length ? (
          <details className="text-sm">
            <summary className="cursor-pointer text-flash-700">Readings ruled out ({eia.rejected.length})</summary>
            <ul className="mt-1 list-disc pl-5 text-flash-700">
              {eia.rejected.map((r, i) => (
                <li key={i}>
                  {r.reading.year ?? "?"}
                  {r.reading.week ? ` wk ${r.reading.week}` : ""} ({r.reading.form}): {r.reason}
                </li>
              ))}
            </ul>
          </details>
        ) : null}
      </div>
      {data.source?.ok ? (
        <div className="card space-y-2">
          <h3 className="font-semibold">
            As a source code: <span className="code">{data.source.code}</span>
          </h3>
          {data.source.found ? (
            <p className="text-sm">
              Registered to <strong>{data.source.entries.map((e) => e.makerName).join(", ")}</strong>
              {data.source.demoOnly ? (
                <span className="ml-1 rounded bg-flash-100 px-1.5 text-xs">demo registry</span>
              ) : null}
            </p>
          ) : (
            <p className="text-sm text-flash-700">Not in the house registry.</p>
          )}
          <p className="text-xs text-flash-600">{data.source.caveat}</p>
        </div>
      ) : null}
      {european ? (
        <div className="card space-y-2">
          <h3 className="font-semibold">As an etched European date line</h3>
          {european.ok ? (
            <ol className="space-y-1 text-sm">
              {european.readings.map((r) => (
                <li key={`${r.scheme}-${r.year}-${r.month}`}>
                  #{r.rank} <strong>{r.year}</strong>, month {r.month}{" "}
                  <span className="text-flash-600">({r.scheme === "A-L" ? "letters A–L" : "letters skipping I"})</span>
                </li>
              ))}
            </ol>
          ) : (
            <p className="text-sm text-flash-700">{european.error.message}</p>
          )}
          <p className="text-xs text-flash-500">
            Month-letter schemes differ between factories; treat these as leads, not proof.
          </p>
        </div>
      ) : null}
    </section>
  );
}
