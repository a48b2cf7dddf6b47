import type { MakerCandidate } from "@/lib/valves/attribution";
import { FEATURE_FIELDS } from "@/lib/valves/construction-text";

const CONFIDENCE_WORDS = { high: "High", medium: "Medium", low: "Low" } as const;
const label = (k: string) => FEATURE_FIELDS[k as keyof typeof FEATURE_FIELDS]?.label ?? k;

/** Candidate makers for a tube, with the features that agree and those that conflict. */
export function Candidates({ candidates }: { candidates: MakerCandidate[] }) {
  if (candidates.length === 0) {
    return (
      <p className="text-sm text-flash-700">
        No confirmed reference of this type shares any recorded feature yet. Record more construction, or wait for more
        confirmed examples.
      </p>
    );
  }
  return (
    <table className="w-full text-sm">
      <thead className="text-left text-flash-600">
        <tr>
          <th scope="col" className="py-1 pr-3 font-medium">
            Maker
          </th>
          <th scope="col" className="py-1 pr-3 font-medium">
            Similarity
          </th>
          <th scope="col" className="py-1 pr-3 font-medium">
            Confidence
          </th>
          <th scope="col" className="py-1 pr-3 font-medium">
            Agrees
          </th>
          <th scope="col" className="py-1 font-medium">
            Conflicts
          </th>
        </tr>
      </thead>
      <tbody>
        {candidates.map((c) => (
          <tr key={c.profileId} className="border-t border-flash-100 align-top">
            <td className="py-1.5 pr-3 font-medium">{c.makerName}</td>
            <td className="py-1.5 pr-3">
              <span className="code">{Math.round(c.similarity * 100)}%</span>
              <span aria-hidden="true" className="ml-2 inline-block h-1.5 w-16 rounded bg-flash-200 align-middle">
                <span
                  className="block h-1.5 rounded bg-flash-600"
                  style={{ width: `${Math.round(c.similarity * 100)}%` }}
                />
              </span>
            </td>
            <td className="py-1.5 pr-3">{CONFIDENCE_WORDS[c.confidence]}</td>
            <td className="py-1.5 pr-3">{c.matching.map(label).join(", ") || "—"}</td>
            <td className="py-1.5">
              {c.conflicting.length ? (
                <span className="text-fault-700">{c.conflicting.map(label).join(", ")}</span>
              ) : (
                "—"
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
