"use client";

import { useMutation } from "@tanstack/react-query";
import { FormAlert } from "@/components/forms/Field";
import { apiFetch } from "@/lib/client/api";

/** Stops want-list digests from the link in one: a button, so a mail scanner opening the link changes nothing. */
export function UnsubscribeButton({ u, t }: { u: string; t: string }) {
  const stop = useMutation({ mutationFn: () => apiFetch("/api/want-lists/unsubscribe", { json: { u, t } }) });
  const state: { tone: "fault" | "sound"; text: string } | null = stop.isSuccess
    ? { tone: "sound", text: "Done: no more want-list e-mails. Matches still appear in your notices in Getterline." }
    : stop.error
      ? { tone: "fault", text: stop.error.message }
      : null;
  return (
    <div className="space-y-3">
      {state ? <FormAlert tone={state.tone}>{state.text}</FormAlert> : null}
      {state?.tone !== "sound" ? (
        <button type="button" className="btn-primary" disabled={stop.isPending} onClick={() => stop.mutate()}>
          Stop want-list e-mails
        </button>
      ) : null}
    </div>
  );
}
