import { STATE_WORDS, type DisputeState } from "@/lib/disputes/rules";

const TONE: Record<DisputeState, string> = {
  "awaiting-answer": "border-glow-200 bg-glow-50 text-glow-700",
  answered: "border-glow-400 bg-glow-100 text-glow-700",
  "with-mediator": "border-flash-400 bg-flash-100 text-flash-800",
  settling: "border-flash-400 bg-flash-100 text-flash-800",
  "awaiting-return": "border-glow-400 bg-glow-100 text-glow-700",
  closed: "border-sound-600 bg-sound-50 text-sound-700",
};

/** Where a claim stands, always in words (colour only supports it). */
export function CaseStateBadge({ state }: { state: DisputeState }) {
  return (
    <span
      data-testid="case-state"
      className={`inline-block rounded-full border px-2.5 py-0.5 text-xs font-medium ${TONE[state]}`}
    >
      {STATE_WORDS[state]}
    </span>
  );
}
