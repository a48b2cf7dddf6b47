"use client";

import { useFieldArray, useWatch, type Control } from "react-hook-form";
import { countryOptions } from "@/lib/validation/address";
import type { HouseSettingsChange } from "@/lib/validation/house-settings";
import { NumberField, Section, errorAt, type SettingsFormApi } from "./fields";

const COUNTRIES = countryOptions();

/** "home, near" ↔ ["home", "near"]; codes upper-cased when `upper`. */
const asList = (upper: boolean) => (v: unknown) =>
  typeof v === "string"
    ? v
        .split(",")
        .map((s) => (upper ? s.trim().toUpperCase() : s.trim()))
        .filter(Boolean)
    : v;

function TextField({
  api,
  name,
  label,
  list,
  upper = false,
  hint,
}: {
  api: SettingsFormApi;
  name: Parameters<SettingsFormApi["register"]>[0];
  label: string;
  list?: boolean;
  upper?: boolean;
  hint?: string;
}) {
  const id = `f-${name.replace(/\./g, "-")}`;
  const error = errorAt(api.errors, name);
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <input
        id={id}
        className="input mt-1 w-full font-mono"
        aria-invalid={!!error}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        {...api.register(name, list ? { setValueAs: asList(upper) } : {})}
      />
      {hint && !error ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-flash-500">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="field-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** Shipping zones, bands and groups, and tax rules per destination. */
export function ShippingTaxSections({ api, control }: { api: SettingsFormApi; control: Control<HouseSettingsChange> }) {
  const bands = useFieldArray({ control, name: "settings.shipping.bands" });
  const groups = useFieldArray({ control, name: "settings.shipping.groups" });
  const rules = useFieldArray({ control, name: "settings.tax.rules" });
  const zonesRaw = useWatch({ control, name: "settings.shipping.zones" }) as unknown;
  const zones = (Array.isArray(zonesRaw) ? zonesRaw : String(zonesRaw ?? "").split(","))
    .map((z: string) => z.trim())
    .filter(Boolean);

  return (
    <>
      <Section title="Shipping">
        <p className="text-sm text-flash-700">
          A parcel&apos;s zone runs from the consignor&apos;s address to the buyer&apos;s: the same country, or two
          countries in one group, or anywhere else. Without both addresses a parcel is priced as same-country.
        </p>
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField api={api} name="settings.shipping.zones" label="Zones (comma-separated)" list />
          <TextField api={api} name="settings.shipping.sameCountryZone" label="Zone within one country" />
          <TextField api={api} name="settings.shipping.otherZone" label="Zone when no group joins the countries" />
          <NumberField api={api} name="settings.shipping.gramsPerTube" label="Packed weight per tube (g)" />
          <NumberField api={api} name="settings.shipping.handlingCents" label="Handling per parcel ($)" unit="cents" />
        </div>
        <fieldset className="space-y-2">
          <legend className="label">Weight bands (rate per zone, dollars)</legend>
          {bands.fields.map((f, i) => (
            <div key={f.id} className="flex flex-wrap items-end gap-2 border-t border-flash-100 pt-2">
              <NumberField
                api={api}
                name={`settings.shipping.bands.${i}.upToGrams`}
                label={`Band ${i + 1} up to (g)`}
              />
              {zones.map((z) => (
                <NumberField
                  key={z}
                  api={api}
                  name={`settings.shipping.bands.${i}.ratesCents.${z}`}
                  label={`${z} ($)`}
                  unit="cents"
                />
              ))}
              <button
                type="button"
                className="btn-quiet"
                onClick={() => bands.remove(i)}
                disabled={bands.fields.length < 2}
              >
                Remove band {i + 1}
              </button>
            </div>
          ))}
          <button
            type="button"
            className="btn-quiet"
            onClick={() => bands.append({ upToGrams: 0, ratesCents: Object.fromEntries(zones.map((z) => [z, 0])) })}
          >
            Add a band
          </button>
        </fieldset>
        <fieldset className="space-y-2">
          <legend className="label">Country groups (two countries in one group ship at the group&apos;s zone)</legend>
          {groups.fields.map((f, i) => (
            <div
              key={f.id}
              className="grid gap-2 border-t border-flash-100 pt-2 sm:grid-cols-[1fr_8rem_2fr_auto] sm:items-end"
            >
              <TextField api={api} name={`settings.shipping.groups.${i}.name`} label="Group name" />
              <TextField api={api} name={`settings.shipping.groups.${i}.zone`} label="Zone" />
              <TextField
                api={api}
                name={`settings.shipping.groups.${i}.countries`}
                label="Countries (two-letter codes, comma-separated)"
                list
                upper
              />
              <button type="button" className="btn-quiet" onClick={() => groups.remove(i)}>
                Remove group
              </button>
            </div>
          ))}
          <button
            type="button"
            className="btn-quiet"
            onClick={() => groups.append({ name: "", zone: zones[1] ?? zones[0] ?? "", countries: [] })}
          >
            Add a group
          </button>
        </fieldset>
      </Section>

      <Section title="Tax by destination">
        <p className="text-sm text-flash-700">
          A rule for the buyer&apos;s country and region wins over one for the whole country; no rule means no tax. Tax
          is worked out once per invoice on the parts the rule names, rounded half-up to the cent. Check the rates with
          a tax adviser: the house&apos;s rules are not tax advice.
        </p>
        {rules.fields.map((f, i) => {
          const id = `f-tax-${i}-country`;
          const error = errorAt(api.errors, `settings.tax.rules.${i}.country`);
          return (
            <div key={f.id} className="flex flex-wrap items-end gap-2 border-t border-flash-100 pt-2">
              <div>
                <label htmlFor={id} className="label">
                  Country
                </label>
                <select id={id} className="input mt-1" {...api.register(`settings.tax.rules.${i}.country`)}>
                  {COUNTRIES.map((c) => (
                    <option key={c.code} value={c.code}>
                      {c.name}
                    </option>
                  ))}
                </select>
                {error ? <p className="field-error">{error}</p> : null}
              </div>
              <TextField api={api} name={`settings.tax.rules.${i}.region`} label="Region (empty = whole country)" />
              <NumberField api={api} name={`settings.tax.rules.${i}.rateBp`} label="Rate (%)" unit="bp" />
              {(["taxHammer", "taxPremium", "taxShipping"] as const).map((k) => (
                <label key={k} className="flex items-center gap-1 text-sm">
                  <input type="checkbox" {...api.register(`settings.tax.rules.${i}.${k}`)} />
                  {k === "taxHammer" ? "on hammer" : k === "taxPremium" ? "on premium" : "on shipping"}
                </label>
              ))}
              <button type="button" className="btn-quiet" onClick={() => rules.remove(i)}>
                Remove rule
              </button>
            </div>
          );
        })}
        <button
          type="button"
          className="btn-quiet"
          onClick={() =>
            rules.append({
              country: "US",
              region: "",
              rateBp: 0,
              taxHammer: true,
              taxPremium: true,
              taxShipping: false,
            })
          }
        >
          Add a tax rule
        </button>
      </Section>
    </>
  );
}
