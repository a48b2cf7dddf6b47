"use client";

import type { FieldValues, Path, UseFormRegister } from "react-hook-form";
import { FEATURE_FIELDS } from "@/lib/valves/construction-text";
import type { FeatureKey } from "@/lib/valves/construction";

const GROUPS: { title: string; keys: FeatureKey[] }[] = [
  {
    title: "Plates",
    keys: [
      "plateShape",
      "plateSurface",
      "plateColour",
      "plateLength",
      "plateOpenings",
      "plateFastening",
      "plateFastenerCount",
    ],
  },
  { title: "Getter", keys: ["getterShape", "getterPosition", "flashPlace"] },
  {
    title: "Micas and supports",
    keys: ["micaCount", "micaOutline", "micaCoating", "micaSpringClips", "supportRodFinish"],
  },
  {
    title: "Envelope, base and markings",
    keys: ["bulbShape", "exhaustTip", "baseMaterial", "baseColour", "metalSkirt", "markingMethod"],
  },
];

const words = (v: string) => v.replace(/-/g, " ");

/**
 * Construction features as choices from our vocabulary, stored as text under
 * `features.<name>`. Leave a feature blank when it cannot be seen.
 */
export function ConstructionFields<T extends FieldValues>({
  register,
  prefix = "features",
}: {
  register: UseFormRegister<T>;
  prefix?: string;
}) {
  return (
    <div className="space-y-3">
      {GROUPS.map((g) => (
        <fieldset key={g.title} className="rounded-md border border-flash-200 p-3">
          <legend className="px-1 text-sm font-medium">{g.title}</legend>
          <div className="grid gap-2 sm:grid-cols-3 lg:grid-cols-4">
            {g.keys.map((k) => {
              const f = FEATURE_FIELDS[k];
              const id = prefix === "features" ? `feat-${k}` : `${prefix.replace(/\W/g, "-")}-feat-${k}`;
              const options =
                f.choice.kind === "enum"
                  ? f.choice.values
                  : f.choice.kind === "count"
                    ? Array.from({ length: f.choice.max - f.choice.min + 1 }, (_, i) =>
                        String(f.choice.kind === "count" ? f.choice.min + i : i),
                      )
                    : ["yes", "no"];
              return (
                <label key={k} htmlFor={id} className="text-sm">
                  <span className="block text-flash-700">{f.label}</span>
                  <select
                    id={id}
                    className="input mt-0.5 py-1.5"
                    {...register(`${prefix}.${k}` as Path<T>, { setValueAs: (v: string) => v ?? "" })}
                  >
                    <option value="">not seen</option>
                    {options.map((o) => (
                      <option key={o} value={o}>
                        {words(o)}
                      </option>
                    ))}
                  </select>
                </label>
              );
            })}
          </div>
        </fieldset>
      ))}
    </div>
  );
}
