"use client";

import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { apiFetch } from "@/lib/client/api";

/** Stops want-list digests from the link in one: a button, so a mail scanner opening the link changes nothing. */
export function UnsubscribeButton({ u, t }: { u: string; t: string }) {
  const [state, setState] = useState<{ tone: "fault" | "sound"; text: string } | null>(null);
  return (
    <div className="space-y-3">
      {state ? <FormAlert tone={state.tone}>{state.text}</FormAlert> : null}
      {state?.tone !== "sound" ? (
        <button
          type="button"
          className="btn-primary"
          onClick={() =>
            void apiFetch("/api/want-lists/unsubscribe", { json: { u, t } })
              .then(() =>
                setState({
                  tone: "sound",
                  text: "Done: no more want-list e-mails. Matches still appear in your notices in Getterline.",
                }),
              )
              .catch((e: Error) => setState({ tone: "fault", text: e.message }))
          }
        >
          Stop want-list e-mails
        </button>
      ) : null}
    </div>
  );
}
