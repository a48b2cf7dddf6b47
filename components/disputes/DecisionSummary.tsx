import { OUTCOME_WORDS } from "@/lib/disputes/rules";
import { formatCents } from "@/lib/money/cents";
import type { CaseView } from "@/lib/services/disputes/presenters";
import { utcText } from "./words";

/** The written decision: outcome, reasons, who decided and when, and the money it moved. */
export function DecisionSummary({ c }: { c: CaseView }) {
  const d = c.decision!;
  return (
    <section aria-labelledby="decision-h" className="card space-y-2 border-sound-600">
      <h2 id="decision-h" className="text-lg font-semibold">
        Decision: {OUTCOME_WORDS[d.outcome]}
      </h2>
      <p className="text-sm text-flash-700">
        Decided by {c.decidedBy} on {c.decidedAt ? utcText(c.decidedAt) : ""}.
      </p>
      <p className="whitespace-pre-wrap text-sm">{d.reasons}</p>
      <dl className="grid max-w-lg grid-cols-2 gap-x-4 gap-y-1 text-sm">
        {d.buyerRefundCents != null ? (
          <>
            <dt>Refund to the buyer</dt>
            <dd data-testid="decision-refund" className="code text-right">
              {formatCents(d.buyerRefundCents)}
            </dd>
          </>
        ) : null}
        {d.consignorChangeCents != null ? (
          <>
            <dt>Change to the consignor&apos;s payout</dt>
            <dd data-testid="decision-consignor-change" className="code text-right">
              {formatCents(d.consignorChangeCents)}
            </dd>
          </>
        ) : null}
        {d.commissionReductionCents != null ? (
          <>
            <dt>Commission given back</dt>
            <dd className="code text-right">{formatCents(d.commissionReductionCents)}</dd>
          </>
        ) : null}
        {c.refundId ? (
          <>
            <dt>Processor refund</dt>
            <dd className="code text-right">{c.refundId}</dd>
          </>
        ) : null}
      </dl>
      {d.closingNote ? <p className="text-sm text-flash-700">Closed: {d.closingNote}.</p> : null}
    </section>
  );
}
