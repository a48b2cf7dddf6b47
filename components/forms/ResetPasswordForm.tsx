"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/client/api";
import { useApiSubmit } from "./useApiSubmit";
import { ResetConfirmSchema, type ResetConfirmInput } from "@/lib/validation/account";
import { Field, FormAlert } from "./Field";

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const { message, run } = useApiSubmit<ResetConfirmInput>();
  const { register, handleSubmit, formState } = useForm<ResetConfirmInput>({
    resolver: zodResolver(ResetConfirmSchema),
    defaultValues: { token },
  });

  async function onSubmit(values: ResetConfirmInput) {
    if (
      await run(async () => {
        await apiFetch("/api/account/password-reset/confirm", { json: values });
      })
    )
      setDone(true);
  }

  if (done) {
    return (
      <div className="space-y-3">
        <FormAlert tone="sound">Your password is set. Sign in with it now.</FormAlert>
        <Link href="/sign-in" className="btn-primary">
          Sign in
        </Link>
      </div>
    );
  }
  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {message ? <FormAlert>{message.text}</FormAlert> : null}
      <input type="hidden" {...register("token")} />
      <Field id="password" label="New password" hint="At least 10 characters." error={e.password?.message}>
        <input id="password" type="password" autoComplete="new-password" className="input" {...register("password")} />
      </Field>
      <Field id="confirm" label="The same again" error={e.confirm?.message}>
        <input id="confirm" type="password" autoComplete="new-password" className="input" {...register("confirm")} />
      </Field>
      <button type="submit" className="btn-primary w-full justify-center" disabled={formState.isSubmitting}>
        Set password
      </button>
    </form>
  );
}
