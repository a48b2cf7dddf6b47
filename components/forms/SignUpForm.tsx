"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/client/api";
import { SignUpSchema, type SignUpInput } from "@/lib/validation/account";
import { Field, FormAlert } from "./Field";
import { useApiSubmit } from "./useApiSubmit";

export function SignUpForm() {
  const router = useRouter();
  const { register, handleSubmit, formState, setError } = useForm<SignUpInput>({
    resolver: zodResolver(SignUpSchema),
    defaultValues: { role: "dealer" },
  });
  const { message, setMessage, run } = useApiSubmit<SignUpInput>(setError);

  async function onSubmit(values: SignUpInput) {
    if (
      !(await run(async () => {
        await apiFetch("/api/account/sign-up", { json: values });
      }))
    )
      return;
    const csrf = await fetch("/api/auth/csrf").then((r) => r.json() as Promise<{ csrfToken: string }>);
    const signedIn = await fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({
        email: values.email,
        password: values.password,
        csrfToken: csrf.csrfToken,
        json: "true",
      }),
    }).then(
      async (r) =>
        r.ok &&
        !new URL(((await r.json()) as { url?: string }).url ?? "/?error=1", location.href).searchParams.has("error"),
    );
    if (!signedIn) {
      // The address already had an account (its owner has been told): the answer says no more than that.
      setMessage({
        tone: "sound",
        text: "Check your e-mail. If this address already has an account, sign in or reset your password.",
      });
      return;
    }
    router.push(values.role === "dealer" ? "/dealer" : "/consignor");
    router.refresh();
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
