"use client";

import Link from "next/link";
import { useState } from "react";
import { apiFetch } from "@/lib/client/api";
import { ConfirmEmailSchema } from "@/lib/validation/account";
import { FormAlert } from "./Field";
import { useApiSubmit } from "./useApiSubmit";

/**
 * Confirms on a button press, not on opening the page: mail scanners open links, and a GET should change
 * nothing. The token is checked with the route's own schema before it is sent.
 */
export function ConfirmEmailForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const { message, run, pending } = useApiSubmit();
  const valid = ConfirmEmailSchema.safeParse({ token });

  if (done) {
    return (
      <div className="space-y-3">
        <FormAlert tone="sound">
          Your address is confirmed and the account is open. Sign in with your password.
        </FormAlert>
        <Link href="/sign-in" className="btn-primary">
          Sign in
        </Link>
      </div>
    );
  }
  if (!valid.success) return <FormAlert>{valid.error.issues[0]?.message ?? "This link is not valid."}</FormAlert>;
  return (
    <div className="space-y-4">
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <p className="text-sm text-flash-700">Press the button to confirm that this address is yours.</p>
      <button
        type="button"
        className="btn-primary w-full justify-center"
        disabled={pending}
        onClick={async () => {
          if (await run(async () => void (await apiFetch("/api/account/confirm-email", { json: { token } }))))
            setDone(true);
        }}
      >
        {pending ? "Confirming…" : "Confirm my address"}
      </button>
    </div>
  );
}
