"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";

/** Record a check against a named data sheet, and retire the type or put it back on file. */
export function ReferenceRowActions({ designation, retired }: { designation: string; retired: boolean }) {
  const router = useRouter();
  const [against, setAgainst] = useState("");
  const [reason, setReason] = useState("");
  const { message, run } = useApiSubmit();
  const base = `/api/valves/types/${encodeURIComponent(designation)}`;

  function call(path: string, json: unknown, done: string) {
    return run(async () => {
      await apiFetch(path, { json });
      router.refresh();
      return done;
    });
  }

  return (
    <div className="grid gap-4 md:grid-cols-2">
      {message ? (
        <div className="md:col-span-2">
          <FormAlert tone={message.tone}>{message.text}</FormAlert>
        </div>
      ) : null}
      <div className="card space-y-2">
        <label htmlFor="verify-against" className="label">
          Checked against (data sheet or handbook page)
        </label>
        <input id="verify-against" className="input" value={against} onChange={(e) => setAgainst(e.target.value)} />
        <button
          type="button"
          className="btn-quiet"
          onClick={() => void call(`${base}/verify`, { against }, "Check recorded.")}
        >
          Record the check
        </button>
      </div>
      <div className="card space-y-2">
        <label htmlFor="retire-reason" className="label">
          {retired ? "Why put it back on file" : "Why retire it"}
        </label>
        <input id="retire-reason" className="input" value={reason} onChange={(e) => setReason(e.target.value)} />
        <button
          type="button"
          className="btn-quiet"
          onClick={() =>
            void call(`${base}/retire`, { retired: !retired, reason }, retired ? "Back on file." : "Retired.")
          }
        >
          {retired ? "Put back on file" : "Retire this type"}
        </button>
      </div>
    </div>
  );
}
