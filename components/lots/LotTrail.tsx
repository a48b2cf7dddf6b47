import { EVENT_WORDS } from "./words";
import { When } from "@/components/time/When";

export type TrailEvent = {
  id: number;
  kind: string;
  comment: string;
  details: Record<string, unknown>;
  at: string;
  actor: string | null;
};

/** The dated trail of a lot: submissions, the house's comments and decisions, amendments. */
export function LotTrail({ events }: { events: TrailEvent[] }) {
  return (
    <ol className="space-y-2">
      {events.map((e) => (
        <li
          key={e.id}
          className={`rounded-md border px-3 py-2 text-sm ${e.kind === "amended" ? "border-glow-400 bg-glow-50" : e.kind === "changes-requested" ? "border-glow-200 bg-white" : "border-flash-200 bg-white"}`}
        >
          <p>
            <strong>{EVENT_WORDS[e.kind] ?? e.kind}</strong>
            <span className="text-flash-600">
              {" "}
              · {e.actor ?? "Getterline"} · <When iso={e.at} />
            </span>
          </p>
          {e.comment ? <p className="mt-1 whitespace-pre-wrap text-flash-800">{e.comment}</p> : null}
          {e.kind === "amended" && e.details.before ? (
            <p className="mt-1 text-xs text-flash-700">
              <span className="code">{String(e.details.designation ?? "")}</span>:{" "}
              {Object.entries(e.details.before as Record<string, unknown>)
                .map(([k, v]) => `${k} ${String(v)} → ${String((e.details.after as Record<string, unknown>)[k])}`)
                .join("; ")}
            </p>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
