import { LOT_STATE_WORDS } from "./words";

const TONE: Record<string, string> = {
  draft: "border-flash-300 bg-flash-100 text-flash-800",
  "in-review": "border-glow-200 bg-glow-50 text-glow-700",
  "needs-changes": "border-glow-400 bg-glow-100 text-glow-700",
  approved: "border-sound-600 bg-sound-50 text-sound-700",
  declined: "border-fault-600 bg-fault-50 text-fault-700",
};

/** A lot's state, always in words (colour only supports it). */
export function StateBadge({ state }: { state: string }) {
  return (
    <span className={`inline-block rounded-full border px-2.5 py-0.5 text-xs font-medium ${TONE[state] ?? ""}`}>
      {LOT_STATE_WORDS[state] ?? state}
    </span>
  );
}
