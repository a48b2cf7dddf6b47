import type { ReactNode } from "react";

/** A labelled input row with its error message tied to the input for screen readers. */
export function Field({
  id,
  label,
  error,
  hint,
  children,
}: {
  id: string;
  label: string;
  error?: string;
  hint?: string;
  children: ReactNode;
}) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      <div className="mt-1">{children}</div>
      {hint && !error ? (
        <p id={`${id}-hint`} className="mt-1 text-sm text-flash-500">
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

export function FormAlert({ children, tone = "fault" }: { children: ReactNode; tone?: "fault" | "sound" }) {
  const cls =
    tone === "fault" ? "border-fault-600 bg-fault-50 text-fault-700" : "border-sound-600 bg-sound-50 text-sound-700";
  return (
    <div role={tone === "fault" ? "alert" : "status"} className={`rounded-md border px-3 py-2 text-sm ${cls}`}>
      {children}
    </div>
  );
}
