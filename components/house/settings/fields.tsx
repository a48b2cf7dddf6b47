"use client";

import type { FieldErrors, UseFormRegister } from "react-hook-form";
import type { HouseSettingsChange } from "@/lib/validation/house-settings";

/** What the settings sections need from the form. */
export type SettingsFormApi = {
  register: UseFormRegister<HouseSettingsChange>;
  errors: FieldErrors<HouseSettingsChange>;
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

/** A labelled number input tied to its field error; `unit` adds a reading of the figure (bp as %). */
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
  const id = `f-${name.replace(/\./g, "-")}`;
  const error = errorAt(api.errors, name);
  const hint = unit === "bp" ? "100 bp = 1 %" : unit === "cents" ? "100 cents = $1.00" : undefined;
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
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        {...api.register(name, { setValueAs: nullable ? asNullableNumber : asNumber })}
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
