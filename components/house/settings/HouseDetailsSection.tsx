"use client";

import { Field } from "@/components/forms/Field";
import { countryOptions } from "@/lib/validation/address";
import { errorAt, Section, type SettingsFormApi } from "./fields";

const COUNTRIES = countryOptions();

type DetailName =
  | "settings.house.tradingName"
  | "settings.house.paperworkEmail"
  | `settings.house.address.${"line1" | "line2" | "city" | "region" | "postalCode" | "country"}`;

/**
 * The house's own trading name, postal address and paperwork e-mail: the sender on its invoices and packing slips.
 * Checked as any address is (lib/validation/house-details.ts); a sale's papers keep the version frozen for it.
 */
export function HouseDetailsSection({ api }: { api: SettingsFormApi }) {
  const input = (
    name: DetailName,
    label: string,
    autoComplete: string,
    opts: { hint?: string; type?: string } = {},
  ) => {
    const id = `f-${name.replace(/\./g, "-")}`;
    const error = errorAt(api.errors, name);
    return (
      <Field id={id} label={label} error={error} hint={opts.hint}>
        <input
          id={id}
          type={opts.type ?? "text"}
          className="input w-full"
          autoComplete={autoComplete}
          aria-invalid={!!error}
          aria-describedby={error ? `${id}-error` : opts.hint ? `${id}-hint` : undefined}
          {...api.register(name)}
        />
      </Field>
    );
  };
  const countryId = "f-settings-house-address-country";
  const countryError = errorAt(api.errors, "settings.house.address.country");
  return (
    <Section title="The house on its papers">
      <p className="text-sm text-flash-700">
        Printed as the sender on invoices and packing slips. A sale&apos;s papers keep the details in force when the
        sale was scheduled.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        {input("settings.house.tradingName", "Trading name", "organization")}
        {input("settings.house.paperworkEmail", "E-mail for paperwork", "email", {
          type: "email",
          hint: "Printed under the address for questions about an invoice",
        })}
      </div>
      {input("settings.house.address.line1", "Address line 1", "address-line1")}
      {input("settings.house.address.line2", "Address line 2 (optional)", "address-line2")}
      <div className="grid gap-3 sm:grid-cols-3">
        {input("settings.house.address.city", "City or town", "address-level2")}
        {input("settings.house.address.region", "State, province or region (optional)", "address-level1")}
        {input("settings.house.address.postalCode", "Postal code", "postal-code")}
      </div>
      <Field id={countryId} label="Country" error={countryError}>
        <select
          id={countryId}
          className="input w-full"
          autoComplete="country"
          aria-invalid={!!countryError}
          aria-describedby={countryError ? `${countryId}-error` : undefined}
          {...api.register("settings.house.address.country")}
        >
          <option value="">Choose a country</option>
          {COUNTRIES.map((c) => (
            <option key={c.code} value={c.code}>
              {c.name}
            </option>
          ))}
        </select>
      </Field>
    </Section>
  );
}
