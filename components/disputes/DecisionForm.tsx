"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch, type Path } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { OUTCOMES, OUTCOME_WORDS, type Outcome } from "@/lib/disputes/rules";
import { formatCents, parseMoneyToCents } from "@/lib/money/cents";
import { DecisionSchema, RefundPreviewSchema } from "@/lib/validation/disputes";

export type DecisionLine = {
  id: string;
  position: number;
  designation: string;
  quantity: number;
  soldAsSet: boolean;
  labelBrand: string;
  makerName: string | null;
};
type Claimed = { itemId: string; position: number; tubes: number; supported: boolean; soldAsSet: boolean };
type LineValues = { value: string; single: string };
type RulingValues = { upheld: boolean; tubes: number; worth: string };
type Values = { outcome: Outcome; reasons: string; lines: LineValues[]; rulings: RulingValues[] };
type Preview = {
  lotValueCents: number;
  claimValueCents: number;
  hammerRefundCents: number;
  premiumRefundCents: number;
  commissionReductionCents: number;
  buyerRefundCents: number;
  consignorChangeCents: number;
  houseChangeCents: number;
};

const dollars = (c: number | undefined) => (c === undefined ? "" : (c / 100).toFixed(2));

/**
 * The mediator's decision. For a partial refund: each line's value (per tube,
 * or the set's value and one tube's value alone for a matched set) and a
 * ruling per claimed line; the refund is worked out to the cent before it is
 * recorded. Recording is final: the money moves and both parties are e-mailed.
 */
export function DecisionForm({
  caseId,
  lines,
  claimed,
  defaults,
  canDecide,
  why,
  heldLines,
  wholeLotAsked,
  releasedEarly,
}: {
  caseId: string;
  lines: DecisionLine[];
  claimed: Claimed[];
  defaults: { itemId: string; valueCents: number; singleValueCents?: number }[];
  canDecide: boolean;
  why: string | null;
  /** Line values fixed by an early release of the undisputed share (null: none yet). */
  heldLines: { itemId: string; valueCents: number; singleValueCents?: number }[] | null;
  wholeLotAsked: boolean;
  releasedEarly: { payoutCents: number; hammerCents: number } | null;
}) {
  const router = useRouter();
  const byItem = new Map((heldLines ?? defaults).map((d) => [d.itemId, d]));
  const locked = heldLines !== null;
  const { register, control, handleSubmit, setError, formState, getValues } = useForm<Values>({
    defaultValues: {
      outcome: "partial-refund",
      reasons: "",
      lines: lines.map((l) => ({
        value: dollars(byItem.get(l.id)?.valueCents),
        single: dollars(byItem.get(l.id)?.singleValueCents),
      })),
      rulings: claimed.map((c) => ({ upheld: c.supported, tubes: c.tubes, worth: "" })),
    },
  });
  const { message, run } = useApiSubmit<Values>(setError);
  const [preview, setPreview] = useState<Preview | null>(null);
  const outcome = useWatch({ control, name: "outcome" });

  /** Form text to the schema's shape; money problems become field errors. */
  function payload(v: Values):
    | {
        ok: true;
        lines: { itemId: string; valueCents: number; singleValueCents?: number }[];
        rulings: { itemId: string; upheld: boolean; tubes: number; worthCents?: number }[];
      }
    | { ok: false } {
    let bad = false;
    const cents = (text: string, path: Path<Values>, optional: boolean) => {
      if (optional && text.trim() === "") return undefined;
      try {
        return parseMoneyToCents(text);
      } catch {
        bad = true;
        setError(path, { message: "Enter an amount like 12.50" });
        return 0;
      }
    };
    const outLines = lines.map((l, i) => ({
      itemId: l.id,
      valueCents: cents(v.lines[i]!.value, `lines.${i}.value`, false)!,
      ...(l.soldAsSet && l.quantity >= 2
        ? { singleValueCents: cents(v.lines[i]!.single, `lines.${i}.single`, true) }
        : {}),
    }));
    const outRulings = claimed.map((c, i) => ({
      itemId: c.itemId,
      upheld: v.rulings[i]!.upheld,
      tubes: Number(v.rulings[i]!.tubes),
      worthCents: cents(v.rulings[i]!.worth, `rulings.${i}.worth`, true),
    }));
    return bad ? { ok: false } : { ok: true, lines: outLines, rulings: outRulings };
  }

  async function workOut() {
    const p = payload(getValues());
    if (!p.ok) return;
    const checked = RefundPreviewSchema.safeParse({ lines: p.lines, rulings: p.rulings });
    if (!checked.success) {
      setPreview(null);
      await run(async () => {
        throw new Error(checked.error.issues[0]?.message ?? "Check the values");
      });
      return;
    }
    await run(async () => {
      setPreview(
        (await apiFetch<{ settlement: Preview }>(`/api/disputes/${caseId}/refund-preview`, { json: checked.data }))
          .settlement,
      );
    });
  }

  async function releaseShare() {
    const p = payload(getValues());
    if (!p.ok) return;
    if (
      await run(async () => {
        const { release } = await apiFetch<{ release: { payoutCents: number } }>(
          `/api/disputes/${caseId}/release-undisputed`,
          { json: { lines: p.lines } },
        );
        return `Released ${formatCents(release.payoutCents)} to the consignor; the claimed lines' share stays held.`;
      })
    )
      router.refresh();
  }

  async function onSubmit(v: Values) {
    const p = v.outcome === "partial-refund" ? payload(v) : { ok: true as const, lines: [], rulings: [] };
    if (!p.ok) return;
    const body =
      v.outcome === "partial-refund"
        ? { outcome: v.outcome, reasons: v.reasons, lines: p.lines, rulings: p.rulings }
        : { outcome: v.outcome, reasons: v.reasons };
    const checked = DecisionSchema.safeParse(body);
    if (!checked.success) {
      for (const issue of checked.error.issues)
        setError((issue.path[0] === "reasons" ? "reasons" : "root") as Path<Values>, { message: issue.message });
      return;
    }
    if (
      await run(async () => {
        await apiFetch(`/api/disputes/${caseId}/decision`, { json: checked.data });
        return "Decision recorded; the money has moved and both parties have the written decision.";
      })
    )
      router.refresh();
  }

  const e = formState.errors;
  if (!canDecide) return <p className="card text-sm text-flash-700">{why}</p>;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-4" noValidate aria-label="Decide the claim">
      <h2 className="text-lg font-semibold">Decision</h2>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      {e.root?.message ? <FormAlert>{e.root.message}</FormAlert> : null}
      <fieldset className="space-y-1">
        <legend className="label">Outcome</legend>
        {OUTCOMES.map((o) => (
          <label key={o} className="flex items-center gap-2 text-sm">
            <input type="radio" value={o} disabled={locked && o === "refund-on-return"} {...register("outcome")} />{" "}
            {OUTCOME_WORDS[o]}
            {locked && o === "refund-on-return" ? (
              <span className="text-flash-500">(not after the undisputed share was released)</span>
            ) : null}
          </label>
        ))}
      </fieldset>
      {outcome === "partial-refund" ? (
        <>
          <fieldset className="space-y-2">
            <legend className="label">Value of each line as listed</legend>
            <p className="text-sm text-flash-600">
              The refund is the claimed share of the lot&apos;s value, applied to the hammer price, premium and
              commission. Start values split the price evenly per tube: replace them with each line&apos;s trade value.
              A matched set is one line: give the set&apos;s value and one of its tubes&apos; value alone.
            </p>
            <table className="w-full text-sm">
              <thead>
                <tr className="text-left text-flash-600">
                  <th>Line</th>
                  <th>Listed as</th>
                  <th>Value ($)</th>
                  <th>One tube alone ($)</th>
                </tr>
              </thead>
              <tbody>
                {lines.map((l, i) => (
                  <tr key={l.id} className="border-t border-flash-100">
                    <td className="py-1">{l.position}</td>
                    <td>
                      <span className="code">{l.designation}</span> × {l.quantity} ·{" "}
                      {l.makerName ?? `label ${l.labelBrand || "none"}`}
                      {l.soldAsSet ? " · matched set" : ""}
                    </td>
                    <td>
                      <label className="sr-only" htmlFor={`line-${l.position}-value`}>
                        Line {l.position} value {l.soldAsSet ? "of the set" : "per tube"}
                      </label>
                      <input
                        id={`line-${l.position}-value`}
                        className="input code w-28 py-1 read-only:bg-flash-100 read-only:text-flash-600"
                        inputMode="decimal"
                        readOnly={locked}
                        {...register(`lines.${i}.value`)}
                      />
                      <span className="ml-1 text-xs text-flash-500">
                        {l.soldAsSet && l.quantity >= 2 ? "the set" : "per tube"}
                      </span>
                      {e.lines?.[i]?.value ? (
                        <p role="alert" className="field-error">
                          {e.lines[i]!.value!.message}
                        </p>
                      ) : null}
                    </td>
                    <td>
                      {l.soldAsSet && l.quantity >= 2 ? (
                        <>
                          <label className="sr-only" htmlFor={`line-${l.position}-single`}>
                            Line {l.position} one tube alone
                          </label>
                          <input
                            id={`line-${l.position}-single`}
                            className="input code w-28 py-1 read-only:bg-flash-100 read-only:text-flash-600"
                            inputMode="decimal"
                            readOnly={locked}
                            {...register(`lines.${i}.single`)}
                          />
                        </>
                      ) : (
                        "—"
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {releasedEarly ? (
              <p className="text-sm text-sound-700">
                The undisputed share is released: {formatCents(releasedEarly.payoutCents)} paid to the consignor (
                {formatCents(releasedEarly.hammerCents)} of the hammer). These line values are now fixed for the
                decision.
              </p>
            ) : !wholeLotAsked ? (
              <div className="flex flex-wrap items-center gap-3 text-sm">
                <button type="button" className="btn-quiet" onClick={() => void releaseShare()}>
                  Release the undisputed share now
                </button>
                <span className="text-flash-600">
                  Pays the consignor for the lines and tubes the claim does not cover, on these values; the claimed
                  share stays held.
                </span>
              </div>
            ) : null}
          </fieldset>
          <fieldset className="space-y-2">
            <legend className="label">Ruling on each claimed line</legend>
            {claimed.map((c, i) => (
              <div key={c.itemId} className="flex flex-wrap items-end gap-3 text-sm">
                <label className="flex items-center gap-2">
                  <input type="checkbox" {...register(`rulings.${i}.upheld`)} /> Uphold line {c.position}
                </label>
                <Field id={`ruling-${c.position}-tubes`} label={c.soldAsSet ? "Bad tubes in the set" : "Tubes upheld"}>
                  <input
                    id={`ruling-${c.position}-tubes`}
                    type="number"
                    min={0}
                    max={c.tubes}
                    className="input w-24 py-1"
                    {...register(`rulings.${i}.tubes`, { valueAsNumber: true })}
                  />
                </Field>
                <Field
                  id={`ruling-${c.position}-worth`}
                  label={c.soldAsSet ? "Set worth as delivered ($)" : "Worth per tube as delivered ($)"}
                  hint={c.soldAsSet ? "Blank: its good tubes as singles" : "Blank: nothing"}
                  error={e.rulings?.[i]?.worth?.message}
                >
                  <input
                    id={`ruling-${c.position}-worth`}
                    className="input code w-28 py-1"
                    inputMode="decimal"
                    {...register(`rulings.${i}.worth`)}
                  />
                </Field>
              </div>
            ))}
          </fieldset>
          <div className="space-y-2">
            <button type="button" className="btn-quiet" onClick={() => void workOut()}>
              Work out the refund
            </button>
            {preview ? (
              <dl className="grid max-w-md grid-cols-2 gap-x-4 gap-y-1 text-sm" aria-label="Refund worked out">
                <dt>Claimed share of value</dt>
                <dd className="code text-right">
                  {formatCents(preview.claimValueCents)} of {formatCents(preview.lotValueCents)}
                </dd>
                <dt>Hammer refunded</dt>
                <dd className="code text-right">{formatCents(preview.hammerRefundCents)}</dd>
                <dt>Premium refunded</dt>
                <dd className="code text-right">{formatCents(preview.premiumRefundCents)}</dd>
                <dt className="font-semibold">Refund to the buyer</dt>
                <dd data-testid="preview-refund" className="code text-right font-semibold">
                  {formatCents(preview.buyerRefundCents)}
                </dd>
                <dt>Commission given back</dt>
                <dd className="code text-right">{formatCents(preview.commissionReductionCents)}</dd>
                <dt>Consignor&apos;s payout changes by</dt>
                <dd className="code text-right">{formatCents(preview.consignorChangeCents)}</dd>
                <dt>House&apos;s income changes by</dt>
                <dd className="code text-right">{formatCents(preview.houseChangeCents)}</dd>
              </dl>
            ) : null}
          </div>
        </>
      ) : null}
      <Field id="reasons" label="Reasons (both parties receive them)" error={e.reasons?.message}>
        <textarea id="reasons" rows={5} className="input" {...register("reasons")} />
      </Field>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Record the decision and move the money
      </button>
    </form>
  );
}
