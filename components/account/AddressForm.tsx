"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { AddressSchema, countryOptions, type Address } from "@/lib/validation/address";

const COUNTRIES = countryOptions();
const EMPTY: Address = { name: "", line1: "", line2: "", city: "", region: "", postalCode: "", country: "" };

/** Add or edit the shipping address the invoices use (a buyer's destination, a consignor's origin). */
export function AddressForm({ initial, purpose }: { initial: Address | null; purpose: string }) {
  const router = useRouter();
  const { register, handleSubmit, setError, formState } = useForm<Address>({
    resolver: zodResolver(AddressSchema),
    defaultValues: initial ?? EMPTY,
  });
  const { message, run } = useApiSubmit<Address>(setError);
  const e = formState.errors;
  const text = (name: keyof Address, label: string, autoComplete: string, hint?: string) => (
    <Field id={`a-${name}`} label={label} error={e[name]?.message} hint={hint}>
      <input
        id={`a-${name}`}
        className="input w-full"
        autoComplete={autoComplete}
        aria-invalid={!!e[name]}
        aria-describedby={e[name] ? `a-${name}-error` : hint ? `a-${name}-hint` : undefined}
        {...register(name)}
      />
    </Field>
  );

  return (
    <form
      noValidate
      aria-label="Shipping address"
      className="card max-w-2xl space-y-3"
      onSubmit={handleSubmit(async (values) => {
        if (
          await run(async () => {
            await apiFetch("/api/account/address", { method: "PUT", json: values });
            return `Address saved. ${purpose}`;
          })
        )
          router.refresh();
      })}
    >
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      {text("name", "Name", "name")}
      {text("line1", "Address line 1", "address-line1")}
      {text("line2", "Address line 2 (optional)", "address-line2")}
      <div className="grid gap-3 sm:grid-cols-3">
        {text("city", "City or town", "address-level2")}
        {text("region", "State, province or region", "address-level1", "Used for tax where the house has a rule")}
        {text("postalCode", "Postal code", "postal-code")}
      </div>
      <Field id="a-country" label="Country" error={e.country?.message}>
        <select
          id="a-country"
          className="input w-full"
          autoComplete="country"
          aria-invalid={!!e.country}
          aria-describedby={e.country ? "a-country-error" : undefined}
          {...register("country")}
        >
          <option value="">Choose a country</option>
          {COUNTRIES.map((c) => (
            <option key={c.code} value={c.code}>
              {c.name}
            </option>
          ))}
        </select>
      </Field>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Saving…" : "Save address"}
      </button>
    </form>
  );
}
