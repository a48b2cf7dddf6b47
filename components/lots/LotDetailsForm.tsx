"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { LotDetailsSchema, TESTER_KIND_VALUES, type LotDetailsInput } from "@/lib/validation/lots";
import { TESTER_WORDS } from "./words";

/** Create a lot (no id) or edit its details (with id). */
export function LotDetailsForm({
  lotId,
  initial,
  readOnly = false,
}: {
  lotId?: string;
  initial?: LotDetailsInput;
  readOnly?: boolean;
}) {
  const router = useRouter();
  const { register, handleSubmit, formState, setError } = useForm<LotDetailsInput>({
    resolver: zodResolver(LotDetailsSchema),
    defaultValues: initial ?? {
      title: "",
      provenance: "",
      shippingOrigin: "",
      testerKind: "untested",
      testerNotes: "",
    },
  });
  const { message, run } = useApiSubmit<LotDetailsInput>(setError);

  async function onSubmit(values: LotDetailsInput) {
    await run(async () => {
      if (lotId) {
        await apiFetch(`/api/lots/${lotId}`, { method: "PATCH", json: values });
        router.refresh();
        return "Lot details saved.";
      }
      const { lot } = await apiFetch<{ lot: { id: string } }>("/api/lots", { json: values });
      router.push(`/consignor/lots/${lot.id}`);
    });
  }

  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate aria-label="Lot details">
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <fieldset disabled={readOnly} className="space-y-4">
        <Field
          id="title"
          label="Title"
          hint="What a dealer sees first, e.g. “Attic box: 120 mixed receiving tubes”."
          error={e.title?.message}
        >
          <input id="title" className="input" {...register("title")} />
        </Field>
        <Field id="provenance" label="Where the tubes came from, in your words" error={e.provenance?.message}>
          <textarea id="provenance" rows={3} className="input" {...register("provenance")} />
        </Field>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field id="shippingOrigin" label="Ships from" hint="Town and country" error={e.shippingOrigin?.message}>
            <input id="shippingOrigin" className="input" {...register("shippingOrigin")} />
          </Field>
          <Field id="testerKind" label="How were they tested?" error={e.testerKind?.message}>
            <select id="testerKind" className="input" {...register("testerKind")}>
              {TESTER_KIND_VALUES.map((k) => (
                <option key={k} value={k}>
                  {TESTER_WORDS[k]}
                </option>
              ))}
            </select>
          </Field>
        </div>
        <Field
          id="testerNotes"
          label="Tester notes"
          hint="Model, settings, chart edition: whatever lets a dealer compare."
          error={e.testerNotes?.message}
        >
          <input id="testerNotes" className="input" {...register("testerNotes")} />
        </Field>
        {!readOnly ? (
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {lotId ? "Save details" : "Start the lot"}
          </button>
        ) : null}
      </fieldset>
    </form>
  );
}
