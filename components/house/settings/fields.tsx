"use client";

import { useState } from "react";
import { useController, type Control, type FieldErrors, type UseFormRegister } from "react-hook-form";
import { bpToPercentText, centsToDollarText, dollarsToCents, percentToBp } from "@/lib/money/form-units";
import type { HouseSettingsChange } from "@/lib/validation/house-settings";

/** What the settings sections need from the form. */
export type SettingsFormApi = {
  register: UseFormRegister<HouseSettingsChange>;
  errors: FieldErrors<HouseSettingsChange>;
  control: Control<HouseSettingsChange>;
};
type Name = Parameters<UseFormRegister<HouseSettingsChange>>[0];

/** The message at a dotted path of the form's errors (arrays included), if any. */
export function errorAt(errors: unknown, path: string): string | undefined {
  let at: unknown = errors;
  for (const key of path.split(".")) {
    if (at == null || typeof at !== "object") return undefined;
    at = (at as Record<string, unknown>)[key];
  }
  if (at && typeof at === "object") {
    const node = at as { message?: unknown; root?: { message?: unknown } };
    if (typeof node.message === "string") return node.message;
    if (typeof node.root?.message === "string") return node.root.message;
  }
  return undefined;
}

/** Empty input → null (an open ceiling, no cap); anything else → a number (NaN is refused by the schema). */
export const asNullableNumber = (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v));
const asNumber = (v: unknown) => (v === "" || v === null || v === undefined ? Number.NaN : Number(v));

/** A labelled number input tied to its field error; with a `unit`, the figure is typed in percent or dollars. */
export function NumberField({
  api,
  name,
  label,
  unit,
  nullable = false,
}: {
  api: SettingsFormApi;
  name: Name;
  label: string;
  unit?: "bp" | "cents";
  nullable?: boolean;
}) {
  if (unit) return <UnitField api={api} name={name} label={label} unit={unit} nullable={nullable} />;
  const id = `f-${name.replace(/\./g, "-")}`;
  const error = errorAt(api.errors, name);
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <input
        id={id}
        type="number"
        inputMode="numeric"
        step={1}
        className="input mt-1 w-40 font-mono"
        aria-invalid={!!error}
        aria-describedby={error ? `${id}-error` : undefined}
        {...api.register(name, { setValueAs: nullable ? asNullableNumber : asNumber })}
      />
      {error ? (
        <p id={`${id}-error`} role="alert" className="field-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/**
 * A rate typed in percent (up to 2 decimals) or an amount typed in dollars, held in the form as the API's basis
 * points or cents (exact conversion, lib/money/form-units). Text that does not convert is held as NaN, which the
 * schema refuses; the conversion's own message is shown in its place.
 */
function UnitField({
  api,
  name,
  label,
  unit,
  nullable,
}: {
  api: SettingsFormApi;
  name: Name;
  label: string;
  unit: "bp" | "cents";
  nullable: boolean;
}) {
  const {
    field: { ref, onBlur, onChange, value },
  } = useController({ control: api.control, name });
  const show = (v: unknown) =>
    typeof v === "number" ? (unit === "bp" ? bpToPercentText(v) : centsToDollarText(v)) : "";
  const [text, setText] = useState(() => show(value));
  const [own, setOwn] = useState<string | undefined>();
  const id = `f-${name.replace(/\./g, "-")}`;
  const error = own ?? errorAt(api.errors, name);
  const sign = unit === "bp" ? "%" : "$";
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <div className="mt-1 flex items-center gap-1">
        {unit === "cents" ? (
          <span aria-hidden="true" className="font-mono text-flash-500">
            {sign}
          </span>
        ) : null}
        <input
          id={id}
          ref={ref}
          name={name}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          className="input w-36 font-mono"
          value={text}
          aria-invalid={!!error}
          aria-describedby={error ? `${id}-error` : undefined}
          onBlur={onBlur}
          onChange={(e) => {
            const typed = e.target.value;
            setText(typed);
            if (nullable && typed.trim() === "") {
              setOwn(undefined);
              onChange(null);
              return;
            }
            const r = unit === "bp" ? percentToBp(typed) : dollarsToCents(typed);
            setOwn(r.ok ? undefined : r.error);
            onChange(r.ok ? r.value : Number.NaN);
          }}
        />
        {unit === "bp" ? (
          <span aria-hidden="true" className="font-mono text-flash-500">
            {sign}
          </span>
        ) : null}
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="field-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** A titled card. */
export function Section({ title, children }: { title: string; children: React.ReactNode }) {
  const id = `s-${title.toLowerCase().replace(/[^a-z]+/g, "-")}`;
  return (
    <section aria-labelledby={id} className="card space-y-3">
      <h2 id={id} className="text-lg font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}
