"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/client/api";
import { SignUpSchema, type SignUpInput } from "@/lib/validation/account";
import { Field, FormAlert } from "./Field";
import { useApiSubmit } from "./useApiSubmit";

export function SignUpForm() {
  const [sent, setSent] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<SignUpInput>({
    resolver: zodResolver(SignUpSchema),
    defaultValues: { role: "dealer" },
  });
  const { message, run } = useApiSubmit<SignUpInput>(setError);

  async function onSubmit(values: SignUpInput) {
    // The same answer for every address (the server's words): the account opens from the e-mailed link.
    const ok = await run(async () => {
      const answer = await apiFetch<{ message: string }>("/api/account/sign-up", { json: values });
      setSent(answer.message);
    });
    if (ok) reset({ role: values.role, displayName: "", email: "", password: "" });
  }

  if (sent) {
    return (
      <div className="space-y-3" data-testid="sign-up-sent">
        <FormAlert tone="sound">{sent}</FormAlert>
        <p className="text-sm text-flash-700">
          No e-mail after a few minutes? Look in the spam folder, or sign up again with the same address for a new link.
        </p>
        <button type="button" className="btn-quiet" onClick={() => setSent(null)}>
          Use another address
        </button>
      </div>
    );
  }

  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <fieldset>
        <legend className="label">I want to</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-2">
          <label className="flex cursor-pointer items-start gap-2 rounded-md border border-flash-300 bg-white p-3 text-sm has-[:checked]:border-glow-600">
            <input type="radio" value="dealer" className="mt-1" {...register("role")} />
            <span>
              <strong>Buy as a dealer</strong>
              <br />
              Bid on lots in live sales.
            </span>
          </label>
          <label className="flex cursor-pointer items-start gap-2 rounded-md border border-flash-300 bg-white p-3 text-sm has-[:checked]:border-glow-600">
            <input type="radio" value="consignor" className="mt-1" {...register("role")} />
            <span>
              <strong>Consign valves</strong>
              <br />
              List a box or a drawer of stock.
            </span>
          </label>
        </div>
        {e.role ? <p className="field-error">{e.role.message}</p> : null}
      </fieldset>
      <Field id="displayName" label="Name or business name" error={e.displayName?.message}>
        <input id="displayName" autoComplete="organization" className="input" {...register("displayName")} />
      </Field>
      <Field id="email" label="E-mail" error={e.email?.message}>
        <input id="email" type="email" autoComplete="email" className="input" {...register("email")} />
      </Field>
      <Field id="password" label="Password" hint="At least 10 characters." error={e.password?.message}>
        <input id="password" type="password" autoComplete="new-password" className="input" {...register("password")} />
      </Field>
      <button type="submit" className="btn-primary w-full justify-center" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Opening your account…" : "Open account"}
      </button>
    </form>
  );
}
