import { CONDITION_WORDS } from "@/components/lots/words";
import type { PriceSeries } from "@/lib/catalogue/price-history";
import { formatCents } from "@/lib/money/cents";

const W = 560;
const H = 180;
const PAD = { left: 56, right: 12, top: 12, bottom: 28 };
const STROKE = ["#b45309", "#475569", "#0f766e"]; // one line per condition; each is named in the legend and the table

function monthsBetween(a: string, b: string): number {
  const [ay, am] = a.split("-").map(Number) as [number, number];
  const [by, bm] = b.split("-").map(Number) as [number, number];
  return (by - ay) * 12 + (bm - am);
}

/** One family's chart: the monthly median net hammer per tube, a line per condition, low–high as a bar. */
function Chart({ series }: { series: PriceSeries[] }) {
  const months = series.flatMap((s) => s.months);
  const first = months.map((m) => m.month).sort()[0]!;
  const last = months
    .map((m) => m.month)
    .sort()
    .at(-1)!;
  const span = Math.max(1, monthsBetween(first, last));
  const top = Math.max(...months.map((m) => m.highCents)) * 1.1 || 100;
  const x = (month: string) => PAD.left + (monthsBetween(first, month) / span) * (W - PAD.left - PAD.right);
  const y = (cents: number) => H - PAD.bottom - (cents / top) * (H - PAD.top - PAD.bottom);
  const ticks = [0, top / 2, top].map((c) => Math.round(c));
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="h-auto w-full max-w-xl"
      role="img"
      aria-label="Net hammer per tube by month; the table below gives the figures"
    >
      {ticks.map((t) => (
        <g key={t}>
          <line x1={PAD.left} x2={W - PAD.right} y1={y(t)} y2={y(t)} stroke="#e2e8f0" />
          <text x={PAD.left - 6} y={y(t) + 4} textAnchor="end" fontSize="10" fill="#475569">
            {formatCents(t)}
          </text>
        </g>
      ))}
      <text x={PAD.left} y={H - 8} fontSize="10" fill="#475569">
        {first}
      </text>
      <text x={W - PAD.right} y={H - 8} fontSize="10" fill="#475569" textAnchor="end">
        {last}
      </text>
      {series.map((s, i) => (
        <g key={s.condition} stroke={STROKE[i % STROKE.length]} fill={STROKE[i % STROKE.length]}>
          {s.months.map((m) => (
            <line
              key={`r${m.month}`}
              x1={x(m.month)}
              x2={x(m.month)}
              y1={y(m.lowCents)}
              y2={y(m.highCents)}
              strokeOpacity="0.35"
              strokeWidth="6"
            />
          ))}
          <polyline
            fill="none"
            strokeWidth="2"
            points={s.months.map((m) => `${x(m.month)},${y(m.medianCents)}`).join(" ")}
          />
          {s.months.map((m) => (
            <circle key={m.month} cx={x(m.month)} cy={y(m.medianCents)} r="3" />
          ))}
        </g>
      ))}
    </svg>
  );
}

/**
 * Price history from our own sold lots, per type family and condition: a chart for the eye and the same
 * figures as a table for screen readers and for anyone who wants the numbers.
 */
export function PriceHistory({ series, heading = "Price history" }: { series: PriceSeries[]; heading?: string }) {
  const families = [...new Set(series.map((s) => s.family))];
  return (
    <section aria-labelledby="price-h" className="space-y-3">
      <h2 id="price-h" className="text-lg font-semibold">
        {heading}
      </h2>
      <p className="text-sm text-flash-600">
        Net hammer per tube in our own sold lots of one type family and one condition, month by month (median, with the
        lowest and highest). Mixed lots are left out.
      </p>
      {families.length === 0 ? (
        <p className="text-sm text-flash-600">No sales of these types yet.</p>
      ) : (
        families.map((family) => {
          const mine = series.filter((s) => s.family === family);
          return (
            <figure key={family} className="card space-y-2" data-testid="price-history">
              <figcaption className="font-medium">
                <span className="code">{family}</span> family ·{" "}
                {mine.map((s, i) => (
                  <span key={s.condition} className="mr-3 inline-flex items-center gap-1 text-sm">
                    <span
                      aria-hidden="true"
                      className="inline-block h-2 w-4 rounded"
                      style={{ background: STROKE[i % STROKE.length] }}
                    />
                    {CONDITION_WORDS[s.condition] ?? s.condition} ({s.sales} sale{s.sales === 1 ? "" : "s"})
                  </span>
                ))}
              </figcaption>
              <Chart series={mine} />
              <details>
                <summary className="cursor-pointer text-sm">The figures</summary>
                <table className="mt-2 text-sm">
                  <thead>
                    <tr className="text-left text-flash-600">
                      <th className="pr-4 font-medium">Month</th>
                      <th className="pr-4 font-medium">Condition</th>
                      <th className="pr-4 font-medium">Sales</th>
                      <th className="pr-4 font-medium">Median per tube</th>
                      <th className="font-medium">Range</th>
                    </tr>
                  </thead>
                  <tbody>
                    {mine.flatMap((s) =>
                      s.months.map((m) => (
                        <tr key={`${s.condition}${m.month}`}>
                          <td className="pr-4">{m.month}</td>
                          <td className="pr-4">{CONDITION_WORDS[s.condition] ?? s.condition}</td>
                          <td className="pr-4">{m.sales}</td>
                          <td className="code pr-4">{formatCents(m.medianCents)}</td>
                          <td className="code">
                            {formatCents(m.lowCents)}–{formatCents(m.highCents)}
                          </td>
                        </tr>
                      )),
                    )}
                  </tbody>
                </table>
              </details>
            </figure>
          );
        })
      )}
    </section>
  );
}
