"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { ConstructionFields } from "@/components/valves/ConstructionFields";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { ShelfTubeSchema, type ShelfTubeInput } from "@/lib/validation/shelf";

const fresh = (): ShelfTubeInput => ({
  designation: "",
  labelBrand: "",
  sourceCode: null,
  dateCode: null,
  features: {},
  notes: "",
  clientKey: crypto.randomUUID(),
});

/** Put a tube on the shelf with what can be read off it. */
export function ShelfForm() {
  const router = useRouter();
  const { register, handleSubmit, formState, reset, setError } = useForm<ShelfTubeInput>({
    resolver: zodResolver(ShelfTubeSchema),
    defaultValues: fresh(),
  });
  const { message, run } = useApiSubmit<ShelfTubeInput>(setError);

  async function onSubmit(values: ShelfTubeInput) {
    await run(async () => {
      const { tube } = await apiFetch<{ tube: { id: string; basis: string; makerName: string | null } }>("/api/shelf", {
        json: values,
      });
      reset(fresh());
      router.refresh();
      return tube.basis === "source-code-confirmed"
        ? `Confirmed by its source code as ${tube.makerName}; it now serves as a reference example.`
        : "On the shelf, unconfirmed. Its best candidates are listed below.";
    });
  }

  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate aria-label="Put a tube on the shelf">
      <h2 className="text-lg font-semibold">Put a tube on the shelf</h2>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <div className="grid gap-3 sm:grid-cols-4">
        <Field id="s-designation" label="Designation" error={e.designation?.message}>
          <input id="s-designation" className="input code" {...register("designation")} />
        </Field>
        <Field id="s-label" label="Label as printed" error={e.labelBrand?.message}>
          <input id="s-label" className="input" {...register("labelBrand")} />
        </Field>
        <Field id="s-source" label="Source code" hint="If one is printed" error={e.sourceCode?.message}>
          <input
            id="s-source"
            className="input code"
            {...register("sourceCode", { setValueAs: (v) => (v ? v : null) })}
          />
        </Field>
        <Field id="s-date" label="Date code" error={e.dateCode?.message}>
          <input id="s-date" className="input code" {...register("dateCode", { setValueAs: (v) => (v ? v : null) })} />
        </Field>
      </div>
      <ConstructionFields register={register} />
      <Field id="s-notes" label="Notes" error={e.notes?.message}>
        <input id="s-notes" className="input" {...register("notes")} />
      </Field>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Put on the shelf
      </button>
    </form>
  );
}
