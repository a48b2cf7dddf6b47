"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import { CautionStrip } from "@/components/CautionStrip";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { ConstructionFields } from "@/components/valves/ConstructionFields";
import { apiFetch } from "@/lib/client/api";
import type { ItemView } from "@/lib/services/lots";
import { BLANK_ITEM, ItemSchema, withoutBlankSections, type ItemInput } from "@/lib/validation/lots";
import { decodeDesignation } from "@/lib/valves/designation";
import { hazardsForType } from "@/lib/valves/hazards";
import type { ReferenceTable } from "@/lib/valves/reference-table";
import { AttributionFields, DefectsAndHazardsFields, TypeAndCountFields } from "./ItemFormSections";
import { ReadingsFieldset } from "./ItemReadings";

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

type ItemFormProps = {
  table: ReferenceTable;
  lotId: string;
  item?: ItemView;
  onDone: () => void;
};

/**
 * One item being added or edited: the form (checked by the shared schema, blank sections dropped first), how the
 * typed designation decodes and the cautions its type carries, and the save to the lot.
 */
function useItemDraft({ table, lotId, item, onDone }: ItemFormProps) {
  const form = useForm<ItemInput>({
    resolver: (values, ctx, opts) => zodResolver(ItemSchema)(withoutBlankSections(values), ctx, opts),
    defaultValues: item ? toInput(item) : BLANK_ITEM,
  });
  const { message, run } = useApiSubmit<ItemInput>(form.setError);
  const typed = useWatch({ control: form.control, name: "designation" });
  const defects = useWatch({ control: form.control, name: "defects" });
  const decoded = typed ? decodeDesignation(table, typed) : null;
  const hazards = decoded?.ok
    ? hazardsForType(table, decoded.normalised).notices.filter((n) => n.certainty !== "always")
    : [];

  async function save(values: ItemInput) {
    const saved = await run(async () => {
      if (item) await apiFetch(`/api/lots/${lotId}/items/${item.id}`, { method: "PUT", json: values });
      else await apiFetch(`/api/lots/${lotId}/items`, { json: values });
    });
    if (saved) onDone();
  }

  return { form, message, decoded, hazards, defects, save };
}

/** Add or edit one item of a lot, with its per-tube readings. */
export function ItemForm(props: ItemFormProps) {
  const { item, onDone } = props;
  const { form, message, decoded, hazards, defects, save } = useItemDraft(props);
  const { register, control, handleSubmit, formState, setValue } = form;
  const e = formState.errors;
  return (
    <form
      onSubmit={handleSubmit(save)}
      className="space-y-4"
      noValidate
      aria-label={item ? "Edit item" : "Add an item"}
    >
      {message ? <FormAlert>{message.text}</FormAlert> : null}
      <TypeAndCountFields register={register} errors={e} decoded={decoded} />
      {hazards.map((h) => (
        <CautionStrip key={h.kind} anchor={h.kind === "mercury-vapour" ? "mercury" : h.kind}>
          <strong>{h.title}.</strong> {h.caution}
        </CautionStrip>
      ))}
      <AttributionFields register={register} errors={e} />
      <details className="rounded-md border border-flash-200 p-3" open={Object.keys(item?.features ?? {}).length > 0}>
        <summary className="cursor-pointer text-sm font-medium">
          Construction (plates, getter, micas, base): the evidence for who made it
        </summary>
        <div className="mt-3">
          <ConstructionFields register={register} />
        </div>
      </details>
      <DefectsAndHazardsFields register={register} errors={e} defects={defects} setValue={setValue} />
      <ReadingsFieldset control={control} register={register} errors={e} />
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
