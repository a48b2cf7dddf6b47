"use client";

import { Field, FormAlert } from "@/components/forms/Field";
import { LineValuesFieldset } from "./DecisionLineValues";
import { ClaimRulings, OutcomeChoice, RefundWorkOut } from "./DecisionRulings";
import { useDecisionDraft, type ClaimedLine, type DecisionLine, type LineValue } from "./useDecisionDraft";

export type { DecisionLine } from "./useDecisionDraft";

type Props = {
  caseId: string;
  lines: DecisionLine[];
  claimed: ClaimedLine[];
  defaults: LineValue[];
  canDecide: boolean;
  why: string | null;
  /** Line values fixed by an early release of the undisputed share (null: none yet). */
  heldLines: LineValue[] | null;
  wholeLotAsked: boolean;
  releasedEarly: { payoutCents: number; hammerCents: number } | null;
};

/**
 * The mediator's decision. For a partial refund: each line's value (per tube,
 * or the set's value and one tube's value alone for a matched set) and a
 * ruling per claimed line; the refund is worked out to the cent before it is
 * recorded. Recording is final: the money moves and both parties are e-mailed.
 */
export function DecisionForm({ caseId, lines, claimed, defaults, canDecide, why, ...release }: Props) {
  const { heldLines, wholeLotAsked, releasedEarly } = release;
  const draft = useDecisionDraft({ caseId, lines, claimed, defaults, heldLines });
  const { register, handleSubmit, formState } = draft.form;
  const locked = heldLines !== null;
  const e = formState.errors;
  if (!canDecide) return <p className="card text-sm text-flash-700">{why}</p>;
  return (
    <form onSubmit={handleSubmit(draft.record)} className="card space-y-4" noValidate aria-label="Decide the claim">
      <h2 className="text-lg font-semibold">Decision</h2>
      {draft.message ? <FormAlert tone={draft.message.tone}>{draft.message.text}</FormAlert> : null}
      {e.root?.message ? <FormAlert>{e.root.message}</FormAlert> : null}
      <OutcomeChoice register={register} locked={locked} />
      {draft.outcome === "partial-refund" ? (
        <>
          <LineValuesFieldset
            lines={lines}
            locked={locked}
            register={register}
            errors={e}
            releasedEarly={releasedEarly}
            wholeLotAsked={wholeLotAsked}
            onRelease={() => void draft.releaseShare()}
          />
          <ClaimRulings claimed={claimed} register={register} errors={e} />
          <RefundWorkOut preview={draft.preview} onWorkOut={() => void draft.workOut()} />
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
