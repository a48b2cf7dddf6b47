"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { CautionStrip } from "@/components/CautionStrip";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { ConstructionFields } from "@/components/valves/ConstructionFields";
import { apiFetch } from "@/lib/client/api";
import type { ItemView } from "@/lib/services/lots";
import {
  BASIS_VALUES,
  BLANK_ITEM,
  CONDITION_VALUES,
  HAZARD_VALUES,
  ItemSchema,
  withoutBlankSections,
  type ItemInput,
} from "@/lib/validation/lots";
import { decodeDesignation } from "@/lib/valves/designation";
import { hazardsForType } from "@/lib/valves/hazards";
import type { ReferenceTable } from "@/lib/valves/reference-table";
import { BASIS_WORDS, CONDITION_WORDS, HAZARD_WORDS } from "./words";

export function toInput(i: ItemView): ItemInput {
  return {
    designation: i.designationTyped,
    quantity: i.quantity,
    labelBrand: i.labelBrand,
    makerName: i.makerName,
    makerBasis: i.makerBasis,
    sourceCode: i.sourceCode,
    dateCode: i.dateCode,
    features: i.features,
    condition: i.condition,
    vacuumLoss: i.vacuumLoss,
    soldAsSet: i.soldAsSet,
    defects: i.defects,
    hazards: i.hazards as ItemInput["hazards"],
    readings: i.readings,
    notes: i.notes,
  };
}

const num = (v: unknown) => (v === "" || v == null || Number.isNaN(Number(v)) ? undefined : Number(v));

/** Add or edit one item of a lot, with its per-tube readings. */
export function ItemForm({
  table,
  lotId,
  item,
  onDone,
}: {
  table: ReferenceTable;
  lotId: string;
  item?: ItemView;
  onDone: () => void;
}) {
  const { register, control, handleSubmit, formState, setError, setValue } = useForm<ItemInput>({
    resolver: (values, ctx, opts) => zodResolver(ItemSchema)(withoutBlankSections(values), ctx, opts),
    defaultValues: item ? toInput(item) : BLANK_ITEM,
  });
  const { message, run } = useApiSubmit<ItemInput>(setError);
  const readings = useFieldArray({ control, name: "readings" });
  const typed = useWatch({ control, name: "designation" });
  const defects = useWatch({ control, name: "defects" });
  const decoded = typed ? decodeDesignation(table, typed) : null;
  const hazards = decoded?.ok
    ? hazardsForType(table, decoded.normalised).notices.filter((n) => n.certainty !== "always")
    : [];

  async function onSubmit(values: ItemInput) {
    const saved = await run(async () => {
      if (item) await apiFetch(`/api/lots/${lotId}/items/${item.id}`, { method: "PUT", json: values });
      else await apiFetch(`/api/lots/${lotId}/items`, { json: values });
    });
    if (saved) onDone();
  }

  const e = formState.errors;
  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      className="space-y-4"
      noValidate
      aria-label={item ? "Edit item" : "Add an item"}
    >
      {message ? <FormAlert>{message.text}</FormAlert> : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <Field
          id="designation"
          label="Designation as printed"
          error={e.designation?.message}
          hint={
            decoded
              ? decoded.ok
                ? `Reads as ${decoded.normalised}${decoded.knownType ? "" : " (decodes by its scheme; no figures on file)"}`
                : 'Not a designation we can read: it will be flagged "check type" for review'
              : undefined
          }
        >
          <input id="designation" className="input code" autoComplete="off" {...register("designation")} />
        </Field>
        <Field id="quantity" label="Quantity" error={e.quantity?.message}>
          <input
            id="quantity"
            type="number"
            min={1}
            className="input"
            {...register("quantity", { valueAsNumber: true })}
          />
        </Field>
        <Field id="condition" label="Condition" error={e.condition?.message}>
          <select id="condition" className="input" {...register("condition")}>
            {CONDITION_VALUES.map((c) => (
              <option key={c} value={c}>
                {CONDITION_WORDS[c]}
              </option>
            ))}
          </select>
        </Field>
      </div>
      {hazards.map((h) => (
        <CautionStrip key={h.kind} anchor={h.kind === "mercury-vapour" ? "mercury" : h.kind}>
          <strong>{h.title}.</strong> {h.caution}
        </CautionStrip>
      ))}
      <div className="grid gap-3 sm:grid-cols-3">
        <Field
          id="labelBrand"
          label="Label as printed"
          hint="The name on the glass or box, not the maker"
          error={e.labelBrand?.message}
        >
          <input id="labelBrand" className="input" {...register("labelBrand")} />
        </Field>
        <Field id="makerName" label="Attributed maker" error={e.makerName?.message}>
          <input id="makerName" className="input" {...register("makerName", { setValueAs: (v) => (v ? v : null) })} />
        </Field>
        <Field id="makerBasis" label="On what basis" error={e.makerBasis?.message}>
          <select id="makerBasis" className="input" {...register("makerBasis")}>
            {BASIS_VALUES.map((b) => (
              <option key={b} value={b}>
                {BASIS_WORDS[b]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="sourceCode" label="Source code" error={e.sourceCode?.message}>
          <input
            id="sourceCode"
            className="input code"
            {...register("sourceCode", { setValueAs: (v) => (v ? v : null) })}
          />
        </Field>
        <Field id="dateCode" label="Date code" error={e.dateCode?.message}>
          <input
            id="dateCode"
            className="input code"
            {...register("dateCode", { setValueAs: (v) => (v ? v : null) })}
          />
        </Field>
        <div className="flex items-end pb-2">
          <label className="inline-flex items-center gap-2 text-sm">
            <input type="checkbox" {...register("vacuumLoss")} /> White getter flash (vacuum lost)
          </label>
          <label className="ml-4 inline-flex items-center gap-2 text-sm">
            <input type="checkbox" {...register("soldAsSet")} /> Sold as one matched set
          </label>
        </div>
      </div>
      <details className="rounded-md border border-flash-200 p-3" open={Object.keys(item?.features ?? {}).length > 0}>
        <summary className="cursor-pointer text-sm font-medium">
          Construction (plates, getter, micas, base): the evidence for who made it
        </summary>
        <div className="mt-3">
          <ConstructionFields register={register} />
        </div>
      </details>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field
          id="defects"
          label="Physical defects"
          hint="Separate with semicolons: bent pin; loose base"
          error={e.defects?.message}
        >
          <input
            id="defects"
            className="input"
            defaultValue={(defects ?? []).join("; ")}
            onChange={(ev) =>
              setValue(
                "defects",
                ev.target.value
                  .split(";")
                  .map((s) => s.trim())
                  .filter(Boolean),
              )
            }
          />
        </Field>
        <fieldset>
          <legend className="label">Hazards you know of</legend>
          <div className="mt-1 flex flex-wrap gap-3">
            {HAZARD_VALUES.map((h) => (
              <label key={h} className="inline-flex items-center gap-1.5 text-sm">
                <input type="checkbox" value={h} {...register("hazards")} /> {HAZARD_WORDS[h]}
              </label>
            ))}
          </div>
        </fieldset>
      </div>
      <fieldset className="space-y-2 rounded-md border border-flash-200 p-3">
        <legend className="px-1 text-sm font-medium">Test readings, one row per tube</legend>
        {e.readings?.message ? <p className="field-error">{e.readings.message}</p> : null}
        {readings.fields.map((f, i) => (
          <div key={f.id} className="grid grid-cols-2 items-end gap-2 sm:grid-cols-8">
            <Field id={`r${i}-tube`} label="Tube #">
              <input
                id={`r${i}-tube`}
                type="number"
                className="input"
                {...register(`readings.${i}.tubeNo`, { valueAsNumber: true })}
              />
            </Field>
            <Field id={`r${i}-measure`} label="Measure">
              <select id={`r${i}-measure`} className="input" {...register(`readings.${i}.measure`)}>
                <option value="gm">Gm</option>
                <option value="emission">Emission</option>
                <option value="plate-current">Plate current</option>
              </select>
            </Field>
            <Field id={`r${i}-s1`} label="Section 1">
              <input
                id={`r${i}-s1`}
                inputMode="decimal"
                className="input"
                {...register(`readings.${i}.sections.0`, { setValueAs: num })}
              />
            </Field>
            <Field id={`r${i}-s2`} label="Section 2">
              <input
                id={`r${i}-s2`}
                inputMode="decimal"
                className="input"
                {...register(`readings.${i}.sections.1`, { setValueAs: num })}
              />
            </Field>
            <Field id={`r${i}-chart`} label="Chart new">
              <input
                id={`r${i}-chart`}
                inputMode="decimal"
                className="input"
                {...register(`readings.${i}.chartNewValue`, { setValueAs: num })}
              />
            </Field>
            <div className="col-span-2 flex flex-wrap gap-2 pb-2 text-sm">
              <label className="inline-flex items-center gap-1">
                <input type="checkbox" {...register(`readings.${i}.shorts`)} />
                Short
              </label>
              <label className="inline-flex items-center gap-1">
                <input type="checkbox" {...register(`readings.${i}.leakage`)} />
                Leakage
              </label>
              <label className="inline-flex items-center gap-1">
                <input type="checkbox" {...register(`readings.${i}.gas`)} />
                Gas
              </label>
            </div>
            <button
              type="button"
              className="btn-quiet mb-1 justify-center"
              onClick={() => readings.remove(i)}
              aria-label={`Remove reading ${i + 1}`}
            >
              Remove
            </button>
          </div>
        ))}
        <button
          type="button"
          className="btn-quiet"
          onClick={() => readings.append({ tubeNo: readings.fields.length + 1, measure: "gm", sections: [] })}
        >
          Add a reading
        </button>
      </fieldset>
      <Field id="notes" label="Notes" error={e.notes?.message}>
        <input id="notes" className="input" {...register("notes")} />
      </Field>
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
          {item ? "Save item" : "Add item"}
        </button>
        <button type="button" className="btn-quiet" onClick={onDone}>
          Cancel
        </button>
      </div>
    </form>
  );
}
