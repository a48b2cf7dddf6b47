"use client";

import type { FieldErrors, UseFormRegister, UseFormSetValue } from "react-hook-form";
import { Field } from "@/components/forms/Field";
import { BASIS_VALUES, CONDITION_VALUES, HAZARD_VALUES, type ItemInput } from "@/lib/validation/lots";
import type { decodeDesignation } from "@/lib/valves/designation";
import { BASIS_WORDS, CONDITION_WORDS, HAZARD_WORDS } from "./words";

type FormParts = { register: UseFormRegister<ItemInput>; errors: FieldErrors<ItemInput> };

/** How the typed designation reads, for the hint under it. */
function designationHint(decoded: ReturnType<typeof decodeDesignation> | null): string | undefined {
  if (!decoded) return undefined;
  return decoded.ok
    ? `Reads as ${decoded.normalised}${decoded.knownType ? "" : " (decodes by its scheme; no figures on file)"}`
    : 'Not a designation we can read: it will be flagged "check type" for review';
}

/** What the line is: the designation as printed, how many, and their condition. */
export function TypeAndCountFields({
  register,
  errors: e,
  decoded,
}: FormParts & { decoded: ReturnType<typeof decodeDesignation> | null }) {
  return (
    <div className="grid gap-3 sm:grid-cols-3">
      <Field
        id="designation"
        label="Designation as printed"
        error={e.designation?.message}
        hint={designationHint(decoded)}
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
  );
}

const orNull = (v: string) => (v ? v : null);

/** Who the tubes are attributed to and why: label, maker and basis, source and date codes, getter and set. */
export function AttributionFields({ register, errors: e }: FormParts) {
  return (
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
        <input id="makerName" className="input" {...register("makerName", { setValueAs: orNull })} />
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
        <input id="sourceCode" className="input code" {...register("sourceCode", { setValueAs: orNull })} />
      </Field>
      <Field id="dateCode" label="Date code" error={e.dateCode?.message}>
        <input id="dateCode" className="input code" {...register("dateCode", { setValueAs: orNull })} />
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
  );
}

type DefectsProps = FormParts & { defects: string[] | undefined; setValue: UseFormSetValue<ItemInput> };

/** Physical defects as a semicolon list, and the hazards the consignor knows of. */
export function DefectsAndHazardsFields({ register, errors: e, defects, setValue }: DefectsProps) {
  return (
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
  );
}
