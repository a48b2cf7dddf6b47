"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { fieldsFromIssues } from "@/lib/api/errors";
import { apiFetch } from "@/lib/client/api";
import { formatCents, parseMoneyToCents } from "@/lib/money/cents";
import { SaleCreateSchema } from "@/lib/validation/sales";

type Offerable = {
  id: string;
  title: string;
  consignor: string;
  estimateLowCents: number | null;
  estimateHighCents: number | null;
  reserveCents: number | null;
};

const local = (d: Date) => new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
const defaultOpening = (l: Offerable) =>
  Math.max(100, Math.min(l.reserveCents ?? Infinity, Math.round(((l.estimateLowCents ?? 1000) * 0.25) / 100) * 100));

/** The house schedules approved lots into a sale with staggered closing times. */
export function SaleForm({ lots, softCloseSeconds = 120 }: { lots: Offerable[]; softCloseSeconds?: number }) {
  const router = useRouter();
  const [title, setTitle] = useState("");
  const [startsAt, setStartsAt] = useState(() => local(new Date(Date.now() + 5 * 60_000)));
  const [firstCloseAt, setFirstCloseAt] = useState(() => local(new Date(Date.now() + 65 * 60_000)));
  const [gap, setGap] = useState("60");
  const [soft, setSoft] = useState(String(softCloseSeconds));
  const [chosen, setChosen] = useState<Record<string, string>>({});
  const [errors, setErrors] = useState<Record<string, string>>({});
  const { message, setMessage, run } = useApiSubmit();

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setMessage(null);
    const bad: Record<string, string> = {};
    const picked = lots
      .filter((l) => chosen[l.id] !== undefined)
      .map((l, i) => {
        try {
          return { lotId: l.id, openingCents: parseMoneyToCents(chosen[l.id]!) };
        } catch {
          bad[`lots.${i}`] = `Opening price for ${l.title} is not an amount`;
          return { lotId: l.id, openingCents: 0 };
        }
      });
    const body = {
      title,
      startsAt: new Date(startsAt).toISOString(),
      firstCloseAt: new Date(firstCloseAt).toISOString(),
      gapSeconds: Number(gap),
      softCloseSeconds: Number(soft),
      lots: picked,
    };
    const parsed = SaleCreateSchema.safeParse(body);
    const all = { ...(parsed.success ? {} : fieldsFromIssues(parsed.error.issues)), ...bad };
    setErrors(all);
    if (Object.keys(all).length) return;
    await run(async () => {
      const { sale } = await apiFetch<{ sale: { id: string } }>("/api/sales", { json: body });
      router.push(`/sales/${sale.id}`);
    });
  }

  return (
    <form onSubmit={submit} className="card space-y-4" noValidate aria-label="Schedule a sale">
      {message ? <FormAlert>{message.text}</FormAlert> : null}
      <Field id="sale-title" label="Title" error={errors.title}>
        <input id="sale-title" className="input" value={title} onChange={(e) => setTitle(e.target.value)} />
      </Field>
      <div className="grid gap-3 sm:grid-cols-4">
        <Field id="starts" label="Bidding opens" error={errors.startsAt}>
          <input
            id="starts"
            type="datetime-local"
            className="input"
            value={startsAt}
            onChange={(e) => setStartsAt(e.target.value)}
          />
        </Field>
        <Field id="first-close" label="First lot closes" error={errors.firstCloseAt}>
          <input
            id="first-close"
            type="datetime-local"
            className="input"
            value={firstCloseAt}
            onChange={(e) => setFirstCloseAt(e.target.value)}
          />
        </Field>
        <Field id="gap" label="Seconds between closings" error={errors.gapSeconds}>
          <input id="gap" type="number" className="input" value={gap} onChange={(e) => setGap(e.target.value)} />
        </Field>
        <Field id="soft" label="Late-bid window (seconds)" error={errors.softCloseSeconds}>
          <input id="soft" type="number" className="input" value={soft} onChange={(e) => setSoft(e.target.value)} />
        </Field>
      </div>
      <fieldset className="space-y-2">
        <legend className="label">Approved lots to offer, in closing order</legend>
        {errors.lots ? <p className="field-error">{errors.lots}</p> : null}
        {lots.length === 0 ? <p className="text-sm text-flash-600">No approved lots are waiting for a sale.</p> : null}
        {lots.map((l) => (
          <div
            key={l.id}
            className="flex flex-wrap items-center gap-3 rounded-md border border-flash-200 px-3 py-2 text-sm"
          >
            <label className="inline-flex flex-1 items-center gap-2">
              <input
                type="checkbox"
                checked={chosen[l.id] !== undefined}
                onChange={(e) =>
                  setChosen((c) => {
                    const n = { ...c };
                    if (e.target.checked) n[l.id] = (defaultOpening(l) / 100).toFixed(2);
                    else delete n[l.id];
                    return n;
                  })
                }
              />
              <span>
                <strong>{l.title}</strong> · {l.consignor} · estimate{" "}
                {l.estimateLowCents != null ? formatCents(l.estimateLowCents) : "—"}–
                {l.estimateHighCents != null ? formatCents(l.estimateHighCents) : "—"} · reserve{" "}
                {l.reserveCents != null ? formatCents(l.reserveCents) : "none"}
              </span>
            </label>
            {chosen[l.id] !== undefined ? (
              <label className="inline-flex items-center gap-1">
                Opening $
                <input
                  className="input w-28 py-1"
                  inputMode="decimal"
                  value={chosen[l.id]}
                  onChange={(e) => setChosen((c) => ({ ...c, [l.id]: e.target.value }))}
                  aria-label={`Opening price for ${l.title}`}
                />
              </label>
            ) : null}
          </div>
        ))}
      </fieldset>
      <button type="submit" className="btn-primary">
        Schedule the sale
      </button>
    </form>
  );
}
