import Link from "next/link";
import { CautionStrip } from "@/components/CautionStrip";
import type { TypeLookup } from "@/lib/services/valve-types";
import { baseFamilyLabel } from "@/lib/valves/designation";
import { describeRowSource } from "@/lib/valves/sources";

const LINK_WORDS: Record<string, string> = {
  exact: "Exact equivalent",
  premium: "Premium or ruggedised version",
  near: "Near equivalent",
  caveat: "Substitute with caveats",
  "sibling-heater": "Same pinout, different heater",
  "different-base": "Similar, on another base",
};

const SYSTEM_WORDS: Record<string, string> = {
  "us-rma": "US receiving-tube number",
  "us-special": "US four-digit registration",
  "us-numeric": "Early US number",
  european: "European letter scheme",
  "european-special": "European special-quality form",
  "military-cv": "Military CV number",
  "military-vt": "Military VT number",
  other: "Listed type outside the schemes",
};

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[10rem_1fr] gap-3 border-t border-flash-100 py-1.5 first:border-t-0">
      <dt className="text-flash-600">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

/** The answer for one designation: decode, figures, equivalents and cautions. */
export function TypeAnswer({ data }: { data: TypeLookup }) {
  const { decode, reference: ref, equivalents, hazards } = data;
  const heater = decode.heater;
  const amp = ref?.characteristics?.kind === "amplifier" ? ref.characteristics : undefined;
  const specific = hazards.notices.filter((n) => n.certainty !== "always");
  return (
    <section aria-labelledby="type-h" className="space-y-4">
      <h2 id="type-h" className="text-xl font-semibold">
        <span className="code">{decode.normalised}</span>
        {decode.normalised !== data.query.trim() ? (
          <span className="ml-2 text-sm font-normal text-flash-600">read from “{data.query}”</span>
        ) : null}
      </h2>
      {specific.map((h) => (
        <CautionStrip key={h.kind} anchor={h.kind === "mercury-vapour" ? "mercury" : h.kind}>
          <span className="font-medium">{h.title}.</span> {h.caution}
        </CautionStrip>
      ))}
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="card">
          <h3 className="mb-2 font-semibold">What the designation says</h3>
          <dl className="text-sm">
            <Row label="Scheme">{SYSTEM_WORDS[decode.system] ?? decode.system}</Row>
            <Row label="Heater">
              {heater.kind === "none"
                ? "None (cold cathode)"
                : [
                    heater.volts != null ? `${heater.volts} V` : null,
                    heater.amps != null ? `${heater.amps} A` : null,
                    heater.seriesCurrentMa != null ? `${heater.seriesCurrentMa} mA series string` : null,
                  ]
                    .filter(Boolean)
                    .join(", ") || "Not given by the designation"}
              {heater.configurations && heater.configurations.length > 1 ? (
                <span className="block text-flash-600">
                  Tapped: {heater.configurations.map((c) => `${c.volts} V ${c.amps} A`).join(" or ")}
                </span>
              ) : null}
            </Row>
            {decode.base ? <Row label="Base">{decode.base.label}</Row> : null}
            {decode.electrodes.length ? (
              <Row label="Systems">{decode.electrodes.map((e) => e.system).join(" + ")}</Row>
            ) : null}
            {decode.envelope ? (
              <Row label="Envelope">
                {decode.envelope.kind.replace(/-/g, " ")}
                {decode.envelope.ruggedised ? ", ruggedised" : ""}
              </Row>
            ) : null}
            {decode.singleEnded ? <Row label="Top cap">None (single-ended)</Row> : null}
          </dl>
          <details className="mt-3 text-sm">
            <summary className="cursor-pointer text-flash-700">
              How this was read ({decode.reasons.length} steps)
            </summary>
            <ul className="mt-2 list-disc space-y-1 pl-5 text-flash-700">
              {decode.reasons.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          </details>
        </div>
        <div className="card">
          <h3 className="mb-2 font-semibold">Published figures</h3>
          {ref ? (
            <dl className="text-sm">
              <Row label="Kind">{ref.kind.replace(/-/g, " ")}</Row>
              {ref.heater ? (
                <Row label="Heater">
                  {ref.heater.volts} V {ref.heater.amps} A
                  {ref.heater.tapped ? ` (or ${ref.heater.tapped.volts} V ${ref.heater.tapped.amps} A)` : ""}
                </Row>
              ) : null}
              <Row label="Base">{baseFamilyLabel(ref.base)}</Row>
              {amp ? (
                <Row label="Operating point">
                  <span className="code">
                    {amp.plateVolts} V plate{amp.screenVolts ? `, ${amp.screenVolts} V screen` : ""}
                    {amp.gridVolts != null
                      ? `, ${amp.gridVolts} V grid`
                      : amp.cathodeResistorOhms
                        ? `, ${amp.cathodeResistorOhms} Ω cathode`
                        : ""}
                  </span>
                  <span className="block code">
                    {[
                      amp.mu != null ? `µ ${amp.mu}` : null,
                      amp.gmMicromho != null ? `Gm ${amp.gmMicromho.toLocaleString("en")} µmho` : null,
                      amp.plateCurrentMa != null ? `Ip ${amp.plateCurrentMa} mA` : null,
                      amp.rpOhms != null ? `rp ${(amp.rpOhms / 1000).toFixed(1)} kΩ` : null,
                    ]
                      .filter(Boolean)
                      .join(" · ")}
                    {amp.approximate ? " (approximate)" : ""}
                  </span>
                </Row>
              ) : null}
              {ref.introduced ? (
                <Row label="Introduced">
                  {ref.introduced.year} <span className="text-flash-500">(from secondary histories; verify)</span>
                </Row>
              ) : null}
              <Row label="Source">
                <span className="code">{ref.source}</span>{" "}
                <span className="text-flash-600">({describeRowSource(ref.source)})</span>
                {ref.revision > 1 ? (
                  <span className="text-flash-500"> · corrected by the house (revision {ref.revision})</span>
                ) : null}
              </Row>
              <Row label="Checked">
                {ref.verification
                  ? `against ${ref.verification.against}, by ${ref.verification.by}, ${ref.verification.on}`
                  : "not yet checked against a data sheet"}
              </Row>
              {ref.note ? <Row label="Note">{ref.note}</Row> : null}
            </dl>
          ) : (
            <div className="space-y-1 text-sm text-flash-700" data-testid="no-figures">
              <p>
                {data.onFile
                  ? "Listed in our equivalents tables; no figures on file."
                  : "Decoded by its scheme; no figures on file."}
              </p>
              {decode.candidates.length ? (
                <p>
                  Close types on file:{" "}
                  {decode.candidates.slice(0, 4).map((c, i) => (
                    <span key={c}>
                      {i ? ", " : ""}
                      <Link className="code underline" href={`/reference?q=${encodeURIComponent(c)}`}>
                        {c}
                      </Link>
                    </span>
                  ))}
                </p>
              ) : null}
              {data.canAdd ? (
                <p>
                  <Link className="underline" href={`/house/reference/new?d=${encodeURIComponent(decode.normalised)}`}>
                    The house can add this type
                  </Link>
                </p>
              ) : null}
            </div>
          )}
          <p className="mt-3 text-xs text-flash-500">
            Testers use their own test points: compare readings with your tester&apos;s chart, not with these figures.
          </p>
        </div>
      </div>
      <div className="card">
        <h3 className="mb-2 font-semibold">Equivalents and substitutes</h3>
        {equivalents.matches.length ? (
          <table className="w-full text-sm">
            <thead className="text-left text-flash-600">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Type
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Relation
                </th>
                <th scope="col" className="py-1 font-medium">
                  Note
                </th>
              </tr>
            </thead>
            <tbody>
              {equivalents.matches.map((m) => (
                <tr key={m.designation} className="border-t border-flash-100 align-top">
                  <td className="py-1.5 pr-3">
                    <Link
                      className="code underline underline-offset-2"
                      href={`/reference?q=${encodeURIComponent(m.designation)}`}
                    >
                      {m.designation}
                    </Link>
                  </td>
                  <td className="py-1.5 pr-3">
                    {LINK_WORDS[m.link] ?? m.link}
                    {m.direction === "upgrade"
                      ? " (replaces it, not always the reverse)"
                      : m.direction === "downgrade"
                        ? " (lower rating)"
                        : ""}
                  </td>
                  <td className="py-1.5 text-flash-700">
                    {m.note} <span className="text-flash-500">[{m.source}]</span>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p className="text-sm text-flash-700">No equivalents on record.</p>
        )}
        {equivalents.notEquivalent.length ? (
          <div className="mt-3 text-sm">
            <p className="font-medium">Not equivalents, though they look related:</p>
            <ul className="list-disc pl-5 text-flash-700">
              {equivalents.notEquivalent.map((n) => (
                <li key={n.designation}>
                  <span className="code">{n.designation}</span>: {n.note}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
      </div>
    </section>
  );
}
