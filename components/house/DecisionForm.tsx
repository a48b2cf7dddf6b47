"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { parseMoneyToCents } from "@/lib/money/cents";
import { ReviewDecisionSchema } from "@/lib/validation/lots";
import { fieldsFromIssues } from "@/lib/api/errors";

type Action = "request-changes" | "approve" | "decline";

/**
 * The house's decision on a lot in review. Money is typed in dollars and sent
 * in cents; the same schema as the route checks it before sending.
 */
export function DecisionForm({
  lotId,
  suggestedLowCents,
  suggestedHighCents,
}: {
  lotId: string;
  suggestedLowCents?: number;
  suggestedHighCents?: number;
}) {
  const router = useRouter();
  const [action, setAction] = useState<Action>("request-changes");
  const [comment, setComment] = useState("");
  const [low, setLow] = useState(suggestedLowCents != null ? (suggestedLowCents / 100).toFixed(2) : "");
  const [high, setHigh] = useState(suggestedHighCents != null ? (suggestedHighCents / 100).toFixed(2) : "");
  const [reserve, setReserve] = useState("");
  const [agreed, setAgreed] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const { message, setMessage, run, pending } = useApiSubmit();

  function cents(text: string, field: string, bad: Record<string, string>): number {
    try {
      return parseMoneyToCents(text);
    } catch {
      bad[field] = "Enter an amount like 250 or 250.00";
      return -1;
    }
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setMessage(null);
    const bad: Record<string, string> = {};
    const body =
      action === "approve"
        ? {
            action,
            comment,
            estimateLowCents: cents(low, "estimateLowCents", bad),
            estimateHighCents: cents(high, "estimateHighCents", bad),
            reserveCents: cents(reserve, "reserveCents", bad),
            reserveAgreed: agreed,
          }
        : { action, comment };
    const parsed = ReviewDecisionSchema.safeParse(body);
    const all = { ...(parsed.success ? {} : fieldsFromIssues(parsed.error.issues)), ...bad };
    setErrors(all);
    if (Object.keys(all).length) return;
    await run(async () => {
      await apiFetch(`/api/house/lots/${lotId}/decision`, { json: body });
      router.push("/house/review");
      router.refresh();
    });
  }

  return (
    <form onSubmit={submit} className="card space-y-4" noValidate aria-label="Review decision">
      <h2 className="text-lg font-semibold">Decision</h2>
      {message ? <FormAlert>{message.text}</FormAlert> : null}
      <fieldset className="flex flex-wrap gap-4">
        <legend className="label mb-1">What next for this lot?</legend>
        {(
          [
            ["request-changes", "Ask the consignor for changes"],
            ["approve", "Approve for sale"],
            ["decline", "Decline"],
          ] as const
        ).map(([v, label]) => (
          <label key={v} className="inline-flex items-center gap-2 text-sm">
            <input type="radio" name="action" value={v} checked={action === v} onChange={() => setAction(v)} /> {label}
          </label>
        ))}
      </fieldset>
      {action === "approve" ? (
        <div className="grid gap-3 sm:grid-cols-3">
          <Field id="low" label="Low estimate ($)" error={errors.estimateLowCents}>
            <input
              id="low"
              inputMode="decimal"
              className="input"
              value={low}
              onChange={(e) => setLow(e.target.value)}
            />
          </Field>
          <Field id="high" label="High estimate ($)" error={errors.estimateHighCents}>
            <input
              id="high"
              inputMode="decimal"
              className="input"
              value={high}
              onChange={(e) => setHigh(e.target.value)}
            />
          </Field>
          <Field id="reserve" label="Reserve ($), hidden from bidders" error={errors.reserveCents}>
            <input
              id="reserve"
              inputMode="decimal"
              className="input"
              value={reserve}
              onChange={(e) => setReserve(e.target.value)}
            />
          </Field>
          <label className="inline-flex items-center gap-2 text-sm sm:col-span-3">
            <input type="checkbox" checked={agreed} onChange={(e) => setAgreed(e.target.checked)} /> The consignor has
            agreed this reserve
          </label>
          {errors.reserveAgreed ? <p className="field-error sm:col-span-3">{errors.reserveAgreed}</p> : null}
        </div>
      ) : null}
      <Field
        id="comment"
        label={action === "approve" ? "Note to the consignor (optional)" : "Comment to the consignor"}
        error={errors.comment}
        hint={action === "request-changes" ? "They get it by e-mail and on the lot." : undefined}
      >
        <textarea
          id="comment"
          rows={3}
          className="input"
          value={comment}
          onChange={(e) => setComment(e.target.value)}
        />
      </Field>
      <button type="submit" className="btn-primary" disabled={pending}>
        {action === "approve"
          ? "Approve and lock the lot"
          : action === "decline"
            ? "Decline the lot"
            : "Send back for changes"}
      </button>
    </form>
  );
}
