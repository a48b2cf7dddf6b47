"use client";

import { useFieldArray, type Control, type FieldErrors, type UseFormRegister } from "react-hook-form";
import { Field } from "@/components/forms/Field";
import type { ItemInput } from "@/lib/validation/lots";

const num = (v: unknown) => (v === "" || v == null || Number.isNaN(Number(v)) ? undefined : Number(v));

type RowProps = { index: number; register: UseFormRegister<ItemInput>; onRemove: () => void };

/** One tube's reading: which tube, what was measured, each section against the chart's new value, and faults. */
function ReadingRow({ index: i, register, onRemove }: RowProps) {
  return (
    <div className="grid grid-cols-2 items-end gap-2 sm:grid-cols-8">
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
        onClick={onRemove}
        aria-label={`Remove reading ${i + 1}`}
      >
        Remove
      </button>
    </div>
  );
}

type ReadingsProps = {
  control: Control<ItemInput>;
  register: UseFormRegister<ItemInput>;
  errors: FieldErrors<ItemInput>;
};

/** The item's test readings, one row per tube, added and removed in place. */
export function ReadingsFieldset({ control, register, errors: e }: ReadingsProps) {
  const readings = useFieldArray({ control, name: "readings" });
  return (
    <fieldset className="space-y-2 rounded-md border border-flash-200 p-3">
      <legend className="px-1 text-sm font-medium">Test readings, one row per tube</legend>
      {e.readings?.message ? <p className="field-error">{e.readings.message}</p> : null}
      {readings.fields.map((f, i) => (
        <ReadingRow key={f.id} index={i} register={register} onRemove={() => readings.remove(i)} />
      ))}
      <button
        type="button"
        className="btn-quiet"
        onClick={() => readings.append({ tubeNo: readings.fields.length + 1, measure: "gm", sections: [] })}
      >
        Add a reading
      </button>
    </fieldset>
  );
}
