"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { BASE_FAMILY_LABELS } from "@/lib/valves/designation/base-families";
import { VALVE_KINDS } from "@/lib/valves/reference-row";
import { ReferenceAddSchema, type ReferenceAddInput } from "@/lib/validation/valves";

const toNumber = (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v));

/**
 * The house adds a type to the reference table. Figures it does not have stay
 * empty; the source says where the row stands (a publication tag, CTP or MEM).
 */
export function ReferenceAddForm({ designation }: { designation: string }) {
  const router = useRouter();
  const { register, handleSubmit, formState, setError } = useForm<ReferenceAddInput>({
    resolver: zodResolver(ReferenceAddSchema),
    defaultValues: {
      designation,
      aliases: "",
      kind: "pentode",
      base: "noval",
      coldCathode: false,
      heaterVolts: null,
      heaterAmps: null,
      source: "MEM",
      note: "",
      reason: "",
    },
  });
  const { message, run } = useApiSubmit<ReferenceAddInput>(setError);
  const e = formState.errors;

  async function onSubmit(values: ReferenceAddInput) {
    await run(async () => {
      const r = await apiFetch<{ reference: { designation: string } }>("/api/valves/types", { json: values });
      router.push(`/house/reference/${encodeURIComponent(r.reference.designation)}`);
      return `Added ${r.reference.designation}.`;
    });
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate aria-label="Add a type">
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Field id="designation" label="Designation" error={e.designation?.message}>
          <input id="designation" className="input code" {...register("designation")} />
        </Field>
        <Field id="aliases" label="Also known as" hint="Separate with ;" error={e.aliases?.message}>
          <input id="aliases" className="input code" {...register("aliases")} />
        </Field>
        <Field id="kind" label="Kind" error={e.kind?.message}>
          <select id="kind" className="input" {...register("kind")}>
            {VALVE_KINDS.map((k) => (
              <option key={k} value={k}>
                {k.replace(/-/g, " ")}
              </option>
            ))}
          </select>
        </Field>
        <Field id="base" label="Base" error={e.base?.message}>
          <select id="base" className="input" {...register("base")}>
            {Object.entries(BASE_FAMILY_LABELS).map(([k, label]) => (
              <option key={k} value={k}>
                {label}
              </option>
            ))}
          </select>
        </Field>
        <Field
          id="heaterVolts"
          label="Heater voltage (V)"
          hint="Leave empty if you have no data sheet"
          error={e.heaterVolts?.message}
        >
          <input
            id="heaterVolts"
            inputMode="decimal"
            className="input code"
            {...register("heaterVolts", { setValueAs: toNumber })}
          />
        </Field>
        <Field id="heaterAmps" label="Heater current (A)" error={e.heaterAmps?.message}>
          <input
            id="heaterAmps"
            inputMode="decimal"
            className="input code"
            {...register("heaterAmps", { setValueAs: toNumber })}
          />
        </Field>
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" {...register("coldCathode")} /> Cold cathode (no heater)
      </label>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field
          id="source"
          label="Source tag"
          hint="REG, EU-DS, MIL-E-1 with ✓ or MEM; CTP; MEM"
          error={e.source?.message}
        >
          <input id="source" className="input code" {...register("source")} />
        </Field>
        <Field id="note" label="Note" error={e.note?.message}>
          <input id="note" className="input" {...register("note")} />
        </Field>
      </div>
      <Field id="reason" label="Why add it" error={e.reason?.message}>
        <textarea id="reason" rows={2} className="input" {...register("reason")} />
      </Field>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Add type
      </button>
    </form>
  );
}
