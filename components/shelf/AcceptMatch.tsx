"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { apiFetch } from "@/lib/client/api";

/** Accept the leading construction match for a shelf tube. */
export function AcceptMatch({
  tubeId,
  makerName,
  confidence,
}: {
  tubeId: string;
  makerName: string;
  confidence: string;
}) {
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <div className="space-y-2">
      {problem ? <FormAlert>{problem}</FormAlert> : null}
      <button
        type="button"
        className="btn-primary"
        onClick={async () => {
          try {
            await apiFetch(`/api/shelf/${tubeId}/accept`, { json: { makerName } });
            router.refresh();
          } catch (e) {
            setProblem((e as Error).message);
          }
        }}
      >
        Accept {makerName} as matched by construction ({confidence})
      </button>
    </div>
  );
}
