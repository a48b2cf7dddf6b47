"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/client/api";
import { useApiSubmit } from "./useApiSubmit";
import { ResetRequestSchema, type ResetRequestInput } from "@/lib/validation/account";
import { Field, FormAlert } from "./Field";

export function ForgotPasswordForm() {
  const [sent, setSent] = useState(false);
  const { message, run } = useApiSubmit<ResetRequestInput>();
  const { register, handleSubmit, formState } = useForm<ResetRequestInput>({
    resolver: zodResolver(ResetRequestSchema),
  });

  async function onSubmit(values: ResetRequestInput) {
    if (
      await run(async () => {
        await apiFetch("/api/account/password-reset", { json: values });
      })
    )
      setSent(true);
  }

  if (sent) {
    return (
      <FormAlert tone="sound">
        If that address has an account, a reset link is on its way. It works once, within an hour.
      </FormAlert>
    );
  }
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {message ? <FormAlert>{message.text}</FormAlert> : null}
      <Field id="email" label="E-mail" error={formState.errors.email?.message}>
        <input id="email" type="email" autoComplete="email" className="input" {...register("email")} />
      </Field>
      <button type="submit" className="btn-primary w-full justify-center" disabled={formState.isSubmitting}>
        Send reset link
      </button>
    </form>
  );
}
