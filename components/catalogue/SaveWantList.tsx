"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { CLOSENESS, CLOSENESS_WORDS } from "@/lib/catalogue/want-list";
import { apiFetch } from "@/lib/client/api";
import { WantListCreateSchema, type WantListCreateInput } from "@/lib/validation/want-lists";

type Form = z.input<typeof WantListCreateSchema>;

/**
 * Save the searched type as a want list: Getterline then tells the dealer of every matching lot the moment
 * it is listed or offered. Visitors are offered sign-in, back to this search.
 */
export function SaveWantList({
  designation,
  condition,
  noVacuumLoss,
  signedIn,
  isDealer,
  here,
}: {
  designation: string;
  condition: string[];
  noVacuumLoss: boolean;
  signedIn: boolean;
  isDealer: boolean;
  here: string;
}) {
  const { register, handleSubmit, setError, formState } = useForm<Form, unknown, WantListCreateInput>({
    resolver: zodResolver(WantListCreateSchema),
    defaultValues: {
      name: `${designation} wanted`,
      criteria: {
        designation,
        closeness: "exact",
        minQuantity: 1,
        conditions: condition as WantListCreateInput["criteria"]["conditions"],
        makerBases: [],
        noVacuumLoss,
        maxEstimateCents: null,
      },
    },
  });
  const { message, run } = useApiSubmit<Form>(setError);
  if (!signedIn) {
    return (
      <p className="text-sm">
        <Link href={`/sign-in?from=${encodeURIComponent(here)}`} className="font-medium underline underline-offset-4">
          Sign in
        </Link>{" "}
        to save this search as a want list and hear of every new {designation} lot at once.
      </p>
    );
  }
  if (!isDealer) return null;
  const e = formState.errors;
  return (
    <form
      aria-label="Save as a want list"
      className="space-y-3"
      onSubmit={handleSubmit((v) =>
        run(async () => {
          await apiFetch("/api/want-lists", { json: v });
          return `Saved. You will hear of every new lot with ${designation} at once, in Getterline and in a daily e-mail.`;
        }),
      )}
    >
      <h2 className="font-semibold">
        Want more <span className="code">{designation}</span>?
      </h2>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <input type="hidden" {...register("criteria.designation")} />
      <div className="grid gap-3 sm:grid-cols-3">
        <Field id="want-name" label="Name of the list" error={e.name?.message}>
          <input id="want-name" className="input w-full" {...register("name")} />
        </Field>
        <Field id="want-closeness" label="Which types" error={e.criteria?.closeness?.message}>
          <select id="want-closeness" className="input w-full" {...register("criteria.closeness")}>
            {CLOSENESS.map((c) => (
              <option key={c} value={c}>
                {designation} {CLOSENESS_WORDS[c]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="want-min" label="At least this many tubes" error={e.criteria?.minQuantity?.message}>
          <input id="want-min" inputMode="numeric" className="input w-full" {...register("criteria.minQuantity")} />
        </Field>
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" {...register("criteria.noVacuumLoss")} /> Only lots without white getters on these types
      </label>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Save as a want list
      </button>
    </form>
  );
}
