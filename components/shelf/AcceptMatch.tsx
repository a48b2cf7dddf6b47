"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
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
  const accept = useMutation({
    mutationFn: () => apiFetch(`/api/shelf/${tubeId}/accept`, { json: { makerName } }),
    onSuccess: () => router.refresh(),
  });
  return (
    <div className="space-y-2">
      {accept.error ? <FormAlert>{accept.error.message}</FormAlert> : null}
      <button type="button" className="btn-primary" disabled={accept.isPending} onClick={() => accept.mutate()}>
        Accept {makerName} as matched by construction ({confidence})
      </button>
    </div>
  );
}
