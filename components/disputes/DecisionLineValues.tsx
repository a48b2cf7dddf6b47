"use client";

import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { formatCents } from "@/lib/money/cents";
import { isMatchedSet, type DecisionLine, type DecisionValues } from "./useDecisionDraft";

type LineValueRowProps = {
  line: DecisionLine;
  index: number;
  locked: boolean;
  register: UseFormRegister<DecisionValues>;
  errors: FieldErrors<DecisionValues>;
};

/** One line of the lot as listed, with its value (per tube or for the set) and, for a matched set, one tube's. */
function LineValueRow({ line: l, index: i, locked, register, errors: e }: LineValueRowProps) {
  return (
    <tr className="border-t border-flash-100">
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
        <span className="ml-1 text-xs text-flash-500">{isMatchedSet(l) ? "the set" : "per tube"}</span>
        {e.lines?.[i]?.value ? (
          <p role="alert" className="field-error">
            {e.lines[i]!.value!.message}
          </p>
        ) : null}
      </td>
      <td>
        {isMatchedSet(l) ? (
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
  );
}

type EarlyReleaseProps = {
  releasedEarly: { payoutCents: number; hammerCents: number } | null;
  wholeLotAsked: boolean;
  onRelease: () => void;
};

/** The undisputed share: already released (values fixed), or a button to release it now. */
function EarlyRelease({ releasedEarly, wholeLotAsked, onRelease }: EarlyReleaseProps) {
  if (releasedEarly)
    return (
      <p className="text-sm text-sound-700">
        The undisputed share is released: {formatCents(releasedEarly.payoutCents)} paid to the consignor (
        {formatCents(releasedEarly.hammerCents)} of the hammer). These line values are now fixed for the decision.
      </p>
    );
  if (wholeLotAsked) return null;
  return (
    <div className="flex flex-wrap items-center gap-3 text-sm">
      <button type="button" className="btn-quiet" onClick={onRelease}>
        Release the undisputed share now
      </button>
      <span className="text-flash-600">
        Pays the consignor for the lines and tubes the claim does not cover, on these values; the claimed share stays
        held.
      </span>
    </div>
  );
}

type LineValuesProps = Omit<LineValueRowProps, "line" | "index"> & EarlyReleaseProps & { lines: DecisionLine[] };

/** The value of each line as listed, from which the claimed share of the lot's value is worked out. */
export function LineValuesFieldset({ lines, releasedEarly, wholeLotAsked, onRelease, ...row }: LineValuesProps) {
  return (
    <fieldset className="space-y-2">
      <legend className="label">Value of each line as listed</legend>
      <p className="text-sm text-flash-600">
        The refund is the claimed share of the lot&apos;s value, applied to the hammer price, premium and commission.
        Start values split the price evenly per tube: replace them with each line&apos;s trade value. A matched set is
        one line: give the set&apos;s value and one of its tubes&apos; value alone.
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
            <LineValueRow key={l.id} line={l} index={i} {...row} />
          ))}
        </tbody>
      </table>
      <EarlyRelease releasedEarly={releasedEarly} wholeLotAsked={wholeLotAsked} onRelease={onRelease} />
    </fieldset>
  );
}
