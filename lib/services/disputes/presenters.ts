/**
 * What leaves the server about a claim: one summary shape for lists and one
 * full shape for the case page, never a raw row. The buyer does not see the
 * consignor's commission; only officials see the processor's refund id.
 */
import type { Viewer } from "../../auth/guards";
import type { DisputeReason, DisputeState, Outcome, Remedy } from "../../disputes/rules";
import type { CaseRole } from "./permissions";
import type { CaseHeadRow, DisputeRow, DisputeSummaryRow } from "./tables/disputes";
import type { ClaimedLineRow } from "./tables/dispute-items";
import type { EvidenceViewRow } from "./tables/dispute-evidence";
import type { MessageViewRow } from "./tables/dispute-messages";

/** A case in a list. */
export type CaseSummary = {
  id: string;
  number: string;
  state: DisputeState;
  reason: DisputeReason;
  remedy: Remedy;
  lotTitle: string;
  invoiceNumber: string;
  answerDueAt: string;
  answered: boolean;
  deadlinePassed: boolean;
  mediator: string | null;
  mine: boolean;
  createdAt: string;
  outcome: Outcome | null;
};

/** A claim as a line of a list. */
export function presentSummary(r: DisputeSummaryRow, viewer: Viewer): CaseSummary {
  return {
    id: r.id,
    number: r.number,
    state: r.state,
    reason: r.reason,
    remedy: r.remedy,
    lotTitle: r.lot_title,
    invoiceNumber: r.invoice_number,
    answerDueAt: r.answer_due_at.toISOString(),
    answered: Boolean(r.answered_at),
    deadlinePassed: !r.answered_at && r.answer_due_at.getTime() <= Date.now(),
    mediator: r.mediator_name,
    mine: r.mediator_id === viewer.id,
    createdAt: r.created_at.toISOString(),
    outcome: r.outcome,
  };
}

/** Everything the case page shows, read for one viewer. */
export type CaseParts = {
  d: DisputeRow;
  role: CaseRole;
  head: CaseHeadRow;
  items: ClaimedLineRow[];
  messages: MessageViewRow[];
  photos: EvidenceViewRow[];
  names: Map<string, string>;
};

const iso = (d: Date | null) => d?.toISOString() ?? null;

/** The decision as the viewer may see it. */
function presentDecision(d: DisputeRow, moneyView: boolean) {
  const decision = d.decision;
  if (!decision) return null;
  return {
    outcome: decision.outcome,
    reasons: decision.reasons,
    closingNote: decision.closingNote ?? null,
    // Everything repaid to the buyer: hammer and premium, and for a returned lot its shipping, tax and return postage.
    buyerRefundCents: decision.settlement
      ? decision.settlement.buyerRefundCents +
        (decision.settlement.shippingCents ?? 0) +
        (decision.settlement.taxCents ?? 0) +
        (decision.settlement.postageCents ?? 0)
      : null,
    consignorChangeCents: moneyView ? (decision.settlement?.consignorChangeCents ?? null) : null,
    commissionReductionCents: moneyView ? (decision.settlement?.commissionReductionCents ?? null) : null,
  };
}

/** A claimed line: the listing beside the buyer's report. */
const presentLine = (i: ClaimedLineRow) => ({
  id: i.id,
  position: i.position,
  designation: i.designation,
  quantity: i.quantity,
  soldAsSet: i.sold_as_set,
  tubes: i.tubes,
  listing: {
    labelBrand: i.label_brand,
    makerName: i.maker_name,
    makerBasis: i.maker_basis,
    sourceCode: i.source_code,
    dateCode: i.date_code,
    features: i.features,
    vacuumLoss: i.vacuum_loss,
    readings: i.readings,
  },
  report: i.report,
});

/** One case in full, shaped for its viewer. */
export function presentCase({ d, role, head, items, messages, photos, names }: CaseParts) {
  const name = (uid: string | null) => (uid ? (names.get(uid) ?? null) : null);
  const moneyView = role !== "buyer"; // the buyer does not see the consignor's commission
  return {
    id: d.id,
    number: d.number,
    role,
    state: d.state,
    reason: d.reason,
    remedy: d.remedy,
    lotId: d.lot_id,
    invoiceId: d.invoice_id,
    lotTitle: head.lot_title,
    invoiceNumber: head.invoice_number,
    invoiceState: head.invoice_state,
    buyer: name(d.buyer_id),
    consignor: name(d.consignor_id),
    answerDueAt: d.answer_due_at.toISOString(),
    answeredAt: iso(d.answered_at),
    stance: d.consignor_stance,
    deadlinePassed: !d.answered_at && d.answer_due_at.getTime() <= Date.now(),
    mediatorId: d.mediator_id,
    takenAt: iso(d.taken_at),
    outcome: d.outcome,
    decidedBy: name(d.decided_by),
    decidedAt: iso(d.decided_at),
    decision: presentDecision(d, moneyView),
    buyerRefundCents: d.buyer_refund_cents,
    refundId: role === "house" || role === "mediator" ? d.refund_id : null,
    returnDueAt: iso(d.return_due_at),
    returnCarrier: d.return_carrier,
    returnTracking: d.return_tracking,
    returnPostageCents: d.return_postage_cents,
    heldLines: d.held_lines,
    undisputedReleasedAt: iso(d.undisputed_released_at),
    returnShippedAt: iso(d.return_shipped_at),
    returnReceivedAt: iso(d.return_received_at),
    closedAt: iso(d.closed_at),
    sale: {
      hammerCents: head.hammer_cents,
      premiumCents: head.premium_cents,
      commissionCents: moneyView ? head.commission_cents : null,
      tubeCount: head.tube_count,
    },
    releasedEarly:
      moneyView && head.released_hammer_cents + head.released_premium_cents > 0
        ? {
            hammerCents: head.released_hammer_cents,
            premiumCents: head.released_premium_cents,
            commissionCents: head.released_commission_cents,
            payoutCents: head.released_hammer_cents - head.released_commission_cents,
          }
        : null,
    items: items.map(presentLine),
    messages: messages.map((m) => ({
      id: m.id,
      role: m.author_role,
      author: m.author_name ?? "Getterline",
      body: m.body,
      at: m.created_at.toISOString(),
    })),
    photos: photos.map((p) => ({
      id: p.id,
      role: p.author_role,
      itemId: p.lot_item_id,
      caption: p.caption,
      width: p.width,
      height: p.height,
      at: p.created_at.toISOString(),
    })),
  };
}

/** The case page's data. */
export type CaseView = ReturnType<typeof presentCase>;
