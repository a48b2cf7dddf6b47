import type { NominalPoint } from "@/lib/lots/summary";

/**
 * Each tested tube's Gm as % of its type's published figure, as dots against
 * the grade lines. A small SVG drawn on the server; the numbers are also in a
 * table for screen readers.
 */
export function ReadingsChart({ points }: { points: NominalPoint[] }) {
  if (points.length === 0)
    return <p className="text-sm text-flash-600">No Gm readings with a published figure to compare against.</p>;
  const W = 560,
    H = 180,
    pad = 32;
  const max = Math.max(140, ...points.map((p) => p.percentOfNominal));
  const min = Math.min(40, ...points.map((p) => p.percentOfNominal));
  const y = (pct: number) => H - pad / 2 - ((H - pad) * (pct - min)) / (max - min);
  const x = (i: number) => pad + ((W - pad - 8) * (i + 0.5)) / points.length;
  return (
    <figure className="space-y-1">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-xl" role="img" aria-labelledby="rvn-title">
        <title id="rvn-title">Gm readings as a percentage of each type&apos;s published figure</title>
        {[60, 80, 100].map((g) => (
          <g key={g}>
            <line x1={pad} x2={W - 4} y1={y(g)} y2={y(g)} stroke="#b8babf" strokeDasharray={g === 100 ? "0" : "4 3"} />
            <text x={2} y={y(g) + 4} fontSize="10" fill="#565961">
              {g}%
            </text>
          </g>
        ))}
        {points.map((p, i) => (
          <circle
            key={`${p.itemIndex}-${p.tubeNo}`}
            cx={x(i)}
            cy={y(Math.min(p.percentOfNominal, max))}
            r={p.failed ? 4 : 3}
            fill={p.failed ? "#c0262d" : p.percentOfNominal >= 80 ? "#565961" : "#e8701a"}
          >
            <title>{`${p.designation} tube ${p.tubeNo}: ${p.percentOfNominal}%${p.failed ? " (failed a check)" : ""}`}</title>
          </circle>
        ))}
      </svg>
      <figcaption className="text-xs text-flash-600">
        Dots: tubes (red = failed a short, leakage, gas or getter check). Lines: 60, 80 and 100 % of the published Gm.
        Testers use their own test points, so this is a rough picture, not a grade.
      </figcaption>
      <details className="text-xs">
        <summary className="cursor-pointer">The numbers</summary>
        <table className="mt-1">
          <tbody>
            {points.map((p) => (
              <tr key={`${p.itemIndex}-${p.tubeNo}`}>
                <td className="code pr-3">
                  {p.designation} #{p.tubeNo}
                </td>
                <td>
                  {p.percentOfNominal}%{p.failed ? " failed a check" : ""}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
