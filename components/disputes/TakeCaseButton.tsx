"use client";

import { useRouter } from "next/navigation";
import { FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";

/** Take a claim from the queue; another mediator who got there first wins and this says so. */
export function TakeCaseButton({ caseId, number }: { caseId: string; number: string }) {
  const router = useRouter();
  const { message, run } = useApiSubmit();
  return (
    <span className="inline-flex flex-col gap-1">
      <button
        type="button"
        className="btn-primary"
        aria-label={`Take claim ${number}`}
        onClick={() =>
          void run(async () => {
            await apiFetch(`/api/disputes/${caseId}/take`, { json: {} });
            router.push(`/mediation/cases/${caseId}`);
          })
        }
      >
        Take
      </button>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
    </span>
  );
}
