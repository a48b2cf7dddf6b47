"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { safeCallbackPath } from "@/lib/auth/callback";
import { SignInSchema, UNCONFIRMED_MESSAGE, type SignInInput } from "@/lib/validation/account";
import { Field, FormAlert } from "./Field";

/**
 * Posts to next-auth's credentials callback itself (rather than through
 * signIn()) so that a throttled account's 429 reaches the person as words.
 */
export function SignInForm({ from }: { from?: string }) {
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(SignInSchema) });

  async function onSubmit(values: SignInInput) {
    setProblem(null);
    const csrf = await fetch("/api/auth/csrf").then((r) => r.json() as Promise<{ csrfToken: string }>);
    const res = await fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({
        ...values,
        csrfToken: csrf.csrfToken,
        callbackUrl: safeCallbackPath(from) ?? "/",
        json: "true",
      }),
    });
    const body = (await res.json().catch(() => ({}))) as { url?: string; error?: { message?: string } };
    if (res.status === 429) return setProblem(body.error?.message ?? "Too many attempts; wait a while and try again.");
    const url = body.url ? new URL(body.url, window.location.origin) : null;
    if (url?.searchParams.get("error") === "unconfirmed") return setProblem(UNCONFIRMED_MESSAGE);
    if (!res.ok || !url || url.searchParams.get("error")) {
      return setProblem("That e-mail and password do not match an account. Check both, or reset your password.");
    }
    const me = await fetch("/api/account/me").then((r) => (r.ok ? r.json() : null));
    router.push(safeCallbackPath(from) ?? me?.home ?? "/");
    router.refresh();
  }

  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {problem ? <FormAlert>{problem}</FormAlert> : null}
      <Field id="email" label="E-mail" error={e.email?.message}>
        <input
          id="email"
          type="email"
          autoComplete="email"
          className="input"
          aria-invalid={!!e.email}
          {...register("email")}
        />
      </Field>
      <Field id="password" label="Password" error={e.password?.message}>
        <input
          id="password"
          type="password"
          autoComplete="current-password"
          className="input"
          aria-invalid={!!e.password}
          {...register("password")}
        />
      </Field>
      <button type="submit" className="btn-primary w-full justify-center" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
