"use client";

import { useRouter } from "next/navigation";
import { formatWhen } from "@/lib/time/format";
import { useViewerZone } from "@/components/time/useViewerZone";
import { useFieldArray, useForm, useWatch, type Path } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { ConstructionFields } from "@/components/valves/ConstructionFields";
import { apiFetch } from "@/lib/client/api";
import { parseReadingsText, readingsToText } from "@/lib/disputes/readings-text";
import {
  DISPUTE_REASONS,
  REASON_WORDS,
  REMEDIES,
  REMEDY_WORDS,
  type DisputeReason,
  type Remedy,
} from "@/lib/disputes/rules";
import { OpenDisputeSchema, type OpenDisputeInput } from "@/lib/validation/disputes";

export type ClaimLine = {
  id: string;
  position: number;
  designation: string;
  quantity: number;
  labelBrand: string;
  makerName: string | null;
  makerBasis: string;
  sourceCode: string | null;
  dateCode: string | null;
  soldAsSet: boolean;
};

type ItemValues = {
  itemId: string;
  tubes: number;
  sourceCode: string;
  dateCode: string;
  designationSeen: string;
  tubesReceived: string;
  vacuumLoss: boolean;
  features: Record<string, string>;
  readingsText: string;
  note: string;
};
type Values = { reason: DisputeReason | ""; remedy: Remedy | ""; statement: string; items: ItemValues[] };

const blank = (line: ClaimLine): ItemValues => ({
  itemId: line.id,
  tubes: line.quantity,
  sourceCode: "",
  dateCode: "",
  designationSeen: "",
  tubesReceived: "",
  vacuumLoss: false,
  features: {},
  readingsText: "",
  note: "",
});
const orNull = (s: string) => (s.trim() ? s.trim() : null);

/** The buyer's claim on a delivered lot: what is wrong, on which lines, with the codes, construction and readings they found. */
export function ClaimForm({
  invoiceId,
  lines,
  windowEnds,
}: {
  invoiceId: string;
  lines: ClaimLine[];
  windowEnds: string;
}) {
  const router = useRouter();
  const zone = useViewerZone();
  const { register, control, handleSubmit, setError, formState } = useForm<Values>({
    defaultValues: { reason: "", remedy: "", statement: "", items: [] },
  });
  const { fields, append, remove } = useFieldArray({ control, name: "items" });
  const { message, run } = useApiSubmit<Values>(setError);
  const reason = useWatch({ control, name: "reason" });
  const items = useWatch({ control, name: "items" });
  const byId = new Map(lines.map((l) => [l.id, l]));

  function toggle(line: ClaimLine, on: boolean) {
    const at = fields.findIndex((f) => f.itemId === line.id);
    if (on && at < 0) append(blank(line));
    if (!on && at >= 0) remove(at);
  }

  async function onSubmit(v: Values) {
    const payload = {
      reason: v.reason || undefined,
      remedy: v.remedy || undefined,
      statement: v.statement,
      items: v.items.map((i) => ({
        itemId: i.itemId,
        tubes: Number(i.tubes),
        sourceCode: orNull(i.sourceCode),
        dateCode: orNull(i.dateCode),
        designationSeen: orNull(i.designationSeen),
        tubesReceived: i.tubesReceived.trim() === "" ? null : Number(i.tubesReceived),
        vacuumLoss: i.vacuumLoss,
        features: Object.fromEntries(Object.entries(i.features ?? {}).filter(([, x]) => x)),
        readings: parseReadingsText(i.readingsText, byId.get(i.itemId)?.quantity ?? 1).readings,
        note: i.note,
      })),
    };
    const checked = OpenDisputeSchema.safeParse(payload);
    if (!checked.success) {
      for (const issue of checked.error.issues)
        setError((issue.path.join(".") || "root") as Path<Values>, { message: issue.message });
      return;
    }
    await run(async () => {
      const { dispute } = await apiFetch<{ dispute: { id: string } }>(`/api/invoices/${invoiceId}/dispute`, {
        json: checked.data satisfies OpenDisputeInput,
      });
      router.push(`/disputes/${dispute.id}`);
      return "Claim opened.";
    });
  }

  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-5" noValidate aria-label="Open a claim">
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      {e.items?.root?.message || e.items?.message ? (
        <FormAlert>{e.items?.root?.message ?? e.items?.message}</FormAlert>
      ) : null}
      <div className="card grid gap-4 sm:grid-cols-2">
        <Field id="reason" label="What is wrong" error={e.reason?.message}>
          <select id="reason" className="input" {...register("reason")}>
            <option value="">Choose…</option>
            {DISPUTE_REASONS.map((r) => (
              <option key={r} value={r}>
                {REASON_WORDS[r]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="remedy" label="What you ask for" error={e.remedy?.message}>
          <select id="remedy" className="input" {...register("remedy")}>
            <option value="">Choose…</option>
            {REMEDIES.map((r) => (
              <option key={r} value={r}>
                {REMEDY_WORDS[r]}
              </option>
            ))}
          </select>
        </Field>
        <div className="sm:col-span-2">
          <Field
            id="statement"
            label="Your statement"
            hint={`Say what you found and how you tested. Claims close with the inspection window, ${formatWhen(windowEnds, zone, "datetime")}.`}
            error={e.statement?.message}
          >
            <textarea id="statement" rows={4} className="input" {...register("statement")} />
          </Field>
        </div>
      </div>
      {reason === "maker-misattributed" ? (
        <p className="rounded-md border border-flash-300 bg-flash-50 px-3 py-2 text-sm text-flash-800">
          A misattribution claim stands only against a maker the listing named. A tube sold by its label alone carries
          no maker claim, and rebranding by itself is not misdescription: lines without a named maker cannot be claimed
          for this reason.
        </p>
      ) : null}

      <fieldset className="card space-y-3">
        <legend className="px-1 font-semibold">Lines the claim covers</legend>
        <ul className="space-y-2">
          {lines.map((l) => {
            const at = fields.findIndex((f) => f.itemId === l.id);
            const lineError = at >= 0 ? e.items?.[at]?.itemId?.message : undefined;
            return (
              <li key={l.id} className="rounded-md border border-flash-200 p-3">
                <label className="flex flex-wrap items-center gap-2 text-sm">
                  <input type="checkbox" checked={at >= 0} onChange={(ev) => toggle(l, ev.target.checked)} />
                  <span className="font-medium">
                    Line {l.position}: <span className="code">{l.designation}</span> × {l.quantity}
                    {l.soldAsSet ? " (matched set)" : ""}
                  </span>
                  <span className="text-flash-600">
                    label “{l.labelBrand || "none"}” · maker{" "}
                    {l.makerName ? `${l.makerName} (${l.makerBasis.replace(/-/g, " ")})` : "not named"}
                  </span>
                </label>
                {lineError ? (
                  <p role="alert" className="field-error">
                    {lineError}
                  </p>
                ) : null}
                {at >= 0 ? (
                  <ItemFields
                    index={at}
                    line={l}
                    register={register}
                    tubesError={e.items?.[at]?.tubes?.message}
                    readingsText={items[at]?.readingsText ?? ""}
                  />
                ) : null}
              </li>
            );
          })}
        </ul>
      </fieldset>
      <p className="text-sm text-flash-600">
        Photos of the tubes, getters and printed codes are added on the claim&apos;s page once it is open. Evidence
        cannot be changed once posted.
      </p>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Open the claim
      </button>
    </form>
  );
}

type Reg = ReturnType<typeof useForm<Values>>["register"];

function ItemFields({
  index,
  line,
  register,
  tubesError,
  readingsText,
}: {
  index: number;
  line: ClaimLine;
  register: Reg;
  tubesError?: string;
  readingsText: string;
}) {
  const p = `items.${index}` as const;
  const parsed = readingsText.trim() ? parseReadingsText(readingsText, line.quantity) : null;
  return (
    <div className="mt-3 space-y-3 border-t border-flash-100 pt-3">
      <div className="grid gap-3 sm:grid-cols-4">
        <Field id={`${p}-tubes`} label="Tubes affected" error={tubesError}>
          <input
            id={`${p}-tubes`}
            type="number"
            min={1}
            max={line.quantity}
            className="input"
            {...register(`${p}.tubes`, { valueAsNumber: true })}
          />
        </Field>
        <Field
          id={`${p}-source`}
          label="Source code you read"
          hint={line.sourceCode ? `Listed: ${line.sourceCode}` : "None listed"}
        >
          <input id={`${p}-source`} className="input code" {...register(`${p}.sourceCode`)} />
        </Field>
        <Field
          id={`${p}-date`}
          label="Date code you read"
          hint={line.dateCode ? `Listed: ${line.dateCode}` : undefined}
        >
          <input id={`${p}-date`} className="input code" {...register(`${p}.dateCode`)} />
        </Field>
        <div className="flex items-end pb-2">
          <label className="inline-flex items-center gap-2 text-sm">
            <input type="checkbox" {...register(`${p}.vacuumLoss`)} /> White getter flash seen
          </label>
        </div>
        <Field id={`${p}-seen`} label="Type as printed, if different">
          <input id={`${p}-seen`} className="input code" {...register(`${p}.designationSeen`)} />
        </Field>
        <Field id={`${p}-received`} label="Tubes received, if short">
          <input id={`${p}-received`} type="number" min={0} className="input" {...register(`${p}.tubesReceived`)} />
        </Field>
        <div className="sm:col-span-2">
          <Field
            id={`${p}-readings`}
            label="Your Gm readings"
            hint={
              parsed
                ? parsed.problems.length
                  ? `Not read: ${parsed.problems.join("; ")}`
                  : `Read: ${readingsToText(parsed.readings)}`
                : "Tube by tube, e.g. 1: 1600/1550; 2: 900/880; 3: gas"
            }
          >
            <input id={`${p}-readings`} className="input code" {...register(`${p}.readingsText`)} />
          </Field>
        </div>
      </div>
      <details>
        <summary className="cursor-pointer text-sm font-medium">
          Construction you see (plates, getter, micas, markings)
        </summary>
        <div className="mt-2">
          <ConstructionFields register={register} prefix={`${p}.features`} />
        </div>
      </details>
      <Field id={`${p}-note`} label="Note on this line">
        <input id={`${p}-note`} className="input" {...register(`${p}.note`)} />
      </Field>
    </div>
  );
}
