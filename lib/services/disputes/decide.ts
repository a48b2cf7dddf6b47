/** The mediator's decision: validated, claimed once by a guarded update, then settled. */
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import type { DecisionInput } from "../../validation/disputes";
import { flagExtraReview } from "../track-record";
import { getCase } from "./cases";
import { previewRefund, saleOf } from "./mediation";
import { loadCase, requireMediator } from "./permissions";
import { settleDecision } from "./settle";
import { sameLines } from "./shared";
import { claimDecision, type DisputeRow, type StoredDecision } from "./tables/disputes";
import { claimedTubes } from "./tables/dispute-items";
import { claimInvoice } from "./tables/invoices";
import { utc } from "./templates";

/** Refuses a decision the case cannot take now. */
function refuseEarly(d: DisputeRow, viewer: Viewer, input: DecisionInput): void {
  requireMediator(viewer, "Only mediators decide cases");
  if (d.decided_at) throw new ApiError("conflict", `This case was already decided on ${utc(d.decided_at)}`);
  if (d.mediator_id !== viewer.id)
    throw new ApiError(
      "conflict",
      d.mediator_id ? "Another mediator has this case" : "Take the case from the queue first",
    );
  if (!d.answered_at && d.answer_due_at.getTime() > Date.now())
    throw new ApiError(
      "conflict",
      `The consignor has until ${utc(d.answer_due_at)} to answer; decide after they answer or the deadline passes`,
    );
  if (d.held_lines && input.outcome === "refund-on-return") {
    throw new ApiError(
      "conflict",
      "The undisputed share has been released, so the buyer keeps those tubes: refund the claimed ones with a partial refund (worth nothing, for a full refund of them), or dismiss",
    );
  }
  if (d.held_lines && input.outcome === "partial-refund" && !sameLines(d.held_lines, input.lines)) {
    throw new ApiError("validation_failed", "Use the line values the undisputed share was released on", {
      lines: "The line values are fixed since the early release",
    });
  }
}

/** The decision to record and how many tubes it upholds. */
async function decisionFor(d: DisputeRow, input: DecisionInput): Promise<{ decision: StoredDecision; upheld: number }> {
  const claimed = await claimedTubes(d.id);
  const decision: StoredDecision = { outcome: input.outcome, reasons: input.reasons };
  if (input.outcome === "refund-on-return") return { decision, upheld: claimed.reduce((n, c) => n + c.tubes, 0) };
  if (input.outcome !== "partial-refund") return { decision, upheld: 0 };
  const claimedById = new Map(claimed.map((c) => [c.lot_item_id, c.tubes]));
  for (const r of input.rulings) {
    const max = claimedById.get(r.itemId);
    if (max === undefined)
      throw new ApiError("validation_failed", "A ruling names an item outside the claim", {
        rulings: "Rule only on claimed items",
      });
    if (r.upheld && r.tubes > max)
      throw new ApiError("validation_failed", `At most ${max} tube(s) were claimed on that line`, {
        rulings: "Too many tubes upheld",
      });
  }
  const inv = await claimInvoice(d.invoice_id);
  const s = await previewRefund(d.lot_id, saleOf(inv), input.lines, input.rulings);
  decision.lines = input.lines;
  decision.rulings = input.rulings;
  decision.settlement = {
    lotValueCents: s.lotValueCents,
    claimValueCents: s.claimValueCents,
    hammerRefundCents: s.hammerRefundCents,
    premiumRefundCents: s.premiumRefundCents,
    commissionReductionCents: s.commissionReductionCents,
    buyerRefundCents: s.buyerRefundCents,
    consignorChangeCents: s.consignorChangeCents,
    houseChangeCents: s.houseChangeCents,
  };
  return { decision, upheld: input.rulings.filter((r) => r.upheld).reduce((n, r) => n + r.tubes, 0) };
}

/**
 * The case's mediator decides, once. The decision is claimed by one guarded
 * update (a second mediator, or a second click, gets 409), recorded with who
 * and when, and the money then moves through the processor and the ledger.
 */
export async function decide(viewer: Viewer, id: string, input: DecisionInput) {
  const { d } = await loadCase(viewer, id);
  refuseEarly(d, viewer, input);
  const { decision, upheld } = await decisionFor(d, input);
  if (!(await claimDecision(id, viewer.id, decision, upheld)))
    throw new ApiError("conflict", "This case was already decided");
  await settleDecision(id);
  await flagExtraReview(d.consignor_id);
  return getCase(viewer, id);
}
