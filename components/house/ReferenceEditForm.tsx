"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { ReferenceEditSchema, type ReferenceEditInput } from "@/lib/validation/valves";

type NumField = Exclude<keyof ReferenceEditInput, "reason" | "source" | "note">;

const NUMBERS: { name: NumField; label: string; unit: string }[] = [
  { name: "heaterVolts", label: "Heater voltage", unit: "V" },
  { name: "heaterAmps", label: "Heater current", unit: "A" },
  { name: "introducedYear", label: "Introduced", unit: "year" },
  { name: "plateVolts", label: "Plate voltage", unit: "V" },
  { name: "gridVolts", label: "Grid bias", unit: "V" },
  { name: "screenVolts", label: "Screen voltage", unit: "V" },
  { name: "mu", label: "Amplification factor µ", unit: "" },
  { name: "gmMicromho", label: "Transconductance", unit: "µmho" },
  { name: "plateCurrentMa", label: "Plate current", unit: "mA" },
  { name: "rpOhms", label: "Plate resistance", unit: "Ω" },
];

const toNumber = (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v));

/** The house corrects one reference row; the server keeps who, when, why, before and after. */
export function ReferenceEditForm({
  designation,
  revision,
  initial,
}: {
  designation: string;
  revision: number;
  initial: ReferenceEditInput;
}) {
  const router = useRouter();
  const { register, handleSubmit, formState, setError, reset } = useForm<ReferenceEditInput>({
    resolver: zodResolver(ReferenceEditSchema),
    defaultValues: { ...initial, reason: "" },
  });
  const { message, run } = useApiSubmit<ReferenceEditInput>(setError);

  async function onSubmit(values: ReferenceEditInput) {
    await run(async () => {
      await apiFetch(`/api/valves/types/${encodeURIComponent(designation)}`, {
        method: "PATCH",
        json: { ...values, expectedRevision: revision },
      });
      reset({ ...values, reason: "" });
      router.refresh();
      return `Saved as revision ${revision + 1}.`;
    });
  }

  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {NUMBERS.map((n) => (
          <Field
            key={n.name}
            id={n.name}
            label={`${n.label}${n.unit ? ` (${n.unit})` : ""}`}
            error={e[n.name]?.message}
          >
            <input
              id={n.name}
              inputMode="decimal"
              className="input code"
              {...register(n.name, { setValueAs: toNumber })}
            />
          </Field>
        ))}
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="source" label="Source tag" hint="e.g. REG ✓, EU-DS MEM" error={e.source?.message}>
          <input id="source" className="input code" {...register("source")} />
        </Field>
        <Field id="note" label="Note" error={e.note?.message}>
          <input id="note" className="input" {...register("note")} />
        </Field>
      </div>
      <Field
        id="reason"
        label="Why this change"
        hint="Name the data sheet or handbook you checked."
        error={e.reason?.message}
      >
        <textarea id="reason" rows={2} className="input" {...register("reason")} />
      </Field>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Save correction
      </button>
    </form>
  );
}
