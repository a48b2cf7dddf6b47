"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useFieldArray, useForm } from "react-hook-form";
import { FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { HouseSettingsChangeSchema, type HouseSettingsChange } from "@/lib/validation/house-settings";
import { NumberField, Section, errorAt, type SettingsFormApi } from "./fields";
import { HouseDetailsSection } from "./HouseDetailsSection";
import { ShippingTaxSections } from "./ShippingTaxSections";

/**
 * The house edits every figure that prices or times a sale. Saving keeps a new version with the reason; sales
 * already scheduled keep the version they were scheduled under.
 */
export function SettingsForm({ version, initial }: { version: number; initial: HouseSettingsChange["settings"] }) {
  const router = useRouter();
  const form = useForm<HouseSettingsChange>({
    resolver: zodResolver(HouseSettingsChangeSchema),
    defaultValues: { settings: initial, reason: "" },
    mode: "onBlur",
  });
  const { register, handleSubmit, setError, formState, control } = form;
  const api: SettingsFormApi = { register, errors: formState.errors, control };
  const tiers = useFieldArray({ control, name: "settings.commissionTiers" });
  const ladder = useFieldArray({ control, name: "settings.incrementLadder" });
  const { message, run } = useApiSubmit<HouseSettingsChange>(setError);

  const onSubmit = handleSubmit(async (values) => {
    const ok = await run(async () => {
      const out = await apiFetch<{ version: { version: number } }>("/api/house/settings", {
        method: "PUT",
        json: { ...values, baseVersion: version },
      });
      return `Saved as version ${out.version.version}. Sales scheduled from now on use it.`;
    });
    if (ok) {
      form.reset({ ...values, reason: "" });
      router.refresh();
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="House settings" className="space-y-4">
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      {Object.keys(formState.errors).length > 0 && formState.isSubmitted ? (
        <FormAlert>Some fields need attention: see the messages below.</FormAlert>
      ) : null}

      <Section title="Buyer's premium and commission">
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField api={api} name="settings.buyersPremiumBp" label="Buyer's premium (%)" unit="bp" />
        </div>
        <fieldset className="space-y-2">
          <legend className="label">Commission tiers (marginal; the last has no ceiling)</legend>
          {tiers.fields.map((f, i) => (
            <div key={f.id} className="flex flex-wrap items-end gap-2">
              <NumberField
                api={api}
                name={`settings.commissionTiers.${i}.upToCents`}
                label={`Tier ${i + 1} up to ($, empty = no ceiling)`}
                unit="cents"
                nullable
              />
              <NumberField api={api} name={`settings.commissionTiers.${i}.rateBp`} label="Rate (%)" unit="bp" />
              <button
                type="button"
                className="btn-quiet"
                onClick={() => tiers.remove(i)}
                disabled={tiers.fields.length < 2}
              >
                Remove tier {i + 1}
              </button>
            </div>
          ))}
          {errorAt(formState.errors, "settings.commissionTiers") ? (
            <p className="field-error" role="alert">
              {errorAt(formState.errors, "settings.commissionTiers")}
            </p>
          ) : null}
          <button type="button" className="btn-quiet" onClick={() => tiers.append({ upToCents: null, rateBp: 1000 })}>
            Add a tier
          </button>
        </fieldset>
      </Section>

      <Section title="Bidding">
        <fieldset className="space-y-2">
          <legend className="label">Increment ladder (from each price up, bids rise by the increment)</legend>
          {ladder.fields.map((f, i) => (
            <div key={f.id} className="flex flex-wrap items-end gap-2">
              <NumberField api={api} name={`settings.incrementLadder.${i}.fromCents`} label={`From ($)`} unit="cents" />
              <NumberField
                api={api}
                name={`settings.incrementLadder.${i}.incrementCents`}
                label="Increment ($)"
                unit="cents"
              />
              <button
                type="button"
                className="btn-quiet"
                onClick={() => ladder.remove(i)}
                disabled={ladder.fields.length < 2}
              >
                Remove rung {i + 1}
              </button>
            </div>
          ))}
          <button
            type="button"
            className="btn-quiet"
            onClick={() => ladder.append({ fromCents: 0, incrementCents: 100 })}
          >
            Add a rung
          </button>
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField api={api} name="settings.softClose.windowSeconds" label="Late-bid window (seconds)" />
          <NumberField
            api={api}
            name="settings.softClose.maxExtensions"
            label="Most extensions per lot (empty = no cap)"
            nullable
          />
        </div>
      </Section>

      <Section title="Payment, inspection and claims">
        <div className="grid gap-3 sm:grid-cols-3">
          <NumberField api={api} name="settings.payment.dueDays" label="Payment due (days after the invoice)" />
          <NumberField api={api} name="settings.payment.reminderDaysBefore" label="Reminder (days before due)" />
          <NumberField api={api} name="settings.inspection.baseDays" label="Inspection period (days)" />
          <NumberField api={api} name="settings.inspection.tubesPerExtraDay" label="One extra day per … tubes" />
          <NumberField api={api} name="settings.inspection.maxDays" label="Longest inspection period (days)" />
          <NumberField api={api} name="settings.claims.breakageClaimHours" label="Breakage claims within (hours)" />
          <NumberField
            api={api}
            name="settings.claims.answerBusinessDays"
            label="Consignor answers within (business days)"
          />
          <NumberField api={api} name="settings.claims.returnShipDays" label="Return shipped within (days)" />
          <NumberField api={api} name="settings.claims.receiptConfirmDays" label="Receipt confirmed within (days)" />
          <NumberField
            api={api}
            name="settings.claims.extraReviewAfterUpheld"
            label="Extra review after … upheld claims"
          />
          <NumberField api={api} name="settings.claims.testerTolerancePct" label="Tester tolerance (%)" />
        </div>
      </Section>

      <ShippingTaxSections api={api} control={control} />

      <HouseDetailsSection api={api} />

      <Section title="Save">
        <div>
          <label htmlFor="reason" className="label">
            Why the change (kept with the version)
          </label>
          <textarea
            id="reason"
            className="input mt-1 w-full"
            rows={2}
            aria-invalid={!!formState.errors.reason}
            aria-describedby={formState.errors.reason ? "reason-error" : undefined}
            {...register("reason")}
          />
          {formState.errors.reason ? (
            <p id="reason-error" role="alert" className="field-error">
              {formState.errors.reason.message}
            </p>
          ) : null}
        </div>
        <p className="text-sm text-flash-700">
          Sales already scheduled or live keep version {version}; the new version applies to sales scheduled after you
          save.
        </p>
        <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Saving…" : "Save as a new version"}
        </button>
      </Section>
    </form>
  );
}
