"use client";

import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { Field } from "@/components/forms/Field";
import { OUTCOMES, OUTCOME_WORDS } from "@/lib/disputes/rules";
import { formatCents } from "@/lib/money/cents";
import type { ClaimedLine, DecisionValues, RefundWorkedOut } from "./useDecisionDraft";

type FormParts = { register: UseFormRegister<DecisionValues>; errors: FieldErrors<DecisionValues> };

/** The outcome radios; refund-on-return is closed once the undisputed share was released. */
export function OutcomeChoice({ register, locked }: Pick<FormParts, "register"> & { locked: boolean }) {
  return (
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
  );
}

/** Uphold or not each claimed line: how many tubes, and what they are worth as delivered. */
export function ClaimRulings({ claimed, register, errors: e }: FormParts & { claimed: ClaimedLine[] }) {
  return (
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
  );
}

/** The button that works the refund out, and the figures once it has. */
export function RefundWorkOut({ preview, onWorkOut }: { preview: RefundWorkedOut | null; onWorkOut: () => void }) {
  return (
    <div className="space-y-2">
      <button type="button" className="btn-quiet" onClick={onWorkOut}>
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
  );
}
