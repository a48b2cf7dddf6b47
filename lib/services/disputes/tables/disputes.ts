/**
 * Typed access to the `disputes` table: the one place that reads or writes a
 * claim's row. Every step is a guarded update whose starting states come from
 * the transition table in lib/disputes/states.ts.
 */
import type { Transaction } from "sequelize";
import type { LineValue, Ruling } from "../../../disputes/manifest";
import type { DisputeReason, DisputeState, Outcome, Remedy, Stance } from "../../../disputes/rules";
import { DISPUTE_TRANSITIONS, statesBefore } from "../../../disputes/states";
import type { SettlementFigures } from "../../../money/refunds";
import { columns, exec, select } from "./query";

/** The money a decision moved, as recorded on it. */
export type StoredSettlement = SettlementFigures;

/** What else a returned lot's refund repaid: its shipping and tax on the card, the return postage by transfer. */
export type StoredReturnExtras = { shippingCents?: number; taxCents?: number; postageCents?: number };

/** The decision as recorded: outcome, reasons, the mediator's values and rulings, and the money it moved. */
export type StoredDecision = {
  outcome: Outcome;
  reasons: string;
  lines?: LineValue[];
  rulings?: Ruling[];
  settlement?: StoredSettlement & StoredReturnExtras;
  closingNote?: string;
};

/** One row of `disputes`. */
export type DisputeRow = {
  id: string;
  number: string;
  invoice_id: string;
  lot_id: string;
  buyer_id: string;
  consignor_id: string;
  reason: DisputeReason;
  remedy: Remedy;
  state: DisputeState;
  answer_due_at: Date;
  answered_at: Date | null;
  consignor_stance: Stance | null;
  mediator_id: string | null;
  taken_at: Date | null;
  outcome: Outcome | null;
  decided_by: string | null;
  decided_at: Date | null;
  decision: StoredDecision | null;
  buyer_refund_cents: number;
  refund_id: string | null;
  upheld_tubes: number;
  return_due_at: Date | null;
  return_carrier: string | null;
  return_tracking: string | null;
  return_shipped_at: Date | null;
  return_received_at: Date | null;
  closed_at: Date | null;
  created_at: Date;
  updated_at: Date;
  held_lines: LineValue[] | null;
  undisputed_released_at: Date | null;
  return_postage_cents: number;
  return_postage_receipt: string | null;
  postage_transfer_id: string | null;
};

/** A row whose decision has been recorded. */
export type DecidedDisputeRow = DisputeRow & { decision: StoredDecision; decided_at: Date; outcome: Outcome };

export const DISPUTE_COLUMNS = [
  "id",
  "number",
  "invoice_id",
  "lot_id",
  "buyer_id",
  "consignor_id",
  "reason",
  "remedy",
  "state",
  "answer_due_at",
  "answered_at",
  "consignor_stance",
  "mediator_id",
  "taken_at",
  "outcome",
  "decided_by",
  "decided_at",
  "decision",
  "buyer_refund_cents",
  "refund_id",
  "upheld_tubes",
  "return_due_at",
  "return_carrier",
  "return_tracking",
  "return_shipped_at",
  "return_received_at",
  "closed_at",
  "created_at",
  "updated_at",
  "held_lines",
  "undisputed_released_at",
  "return_postage_cents",
  "return_postage_receipt",
  "postage_transfer_id",
] as const satisfies readonly (keyof DisputeRow)[];

const ALL = columns(DISPUTE_COLUMNS);

/** True when the row carries a recorded decision. */
export const isDecided = (d: DisputeRow): d is DecidedDisputeRow =>
  d.decision !== null && d.decided_at !== null && d.outcome !== null;

/** One claim by id, optionally locked for update inside `t`. */
export async function findDispute(
  id: string,
  opts: { t?: Transaction; lock?: boolean } = {},
): Promise<DisputeRow | undefined> {
  const [d] = await select<DisputeRow>(
    `SELECT ${ALL} FROM disputes WHERE id = :id ${opts.lock ? "FOR UPDATE" : ""}`,
    { id },
    opts.t,
  );
  return d;
}

/** The claim already opened on an invoice, if any. */
export async function findDisputeForInvoice(
  invoiceId: string,
  t: Transaction,
): Promise<Pick<DisputeRow, "id" | "number" | "buyer_id"> | undefined> {
  const [d] = await select<Pick<DisputeRow, "id" | "number" | "buyer_id">>(
    `SELECT id, number, buyer_id FROM disputes WHERE invoice_id = :invoiceId`,
    { invoiceId },
    t,
  );
  return d;
}

/** The next claim number's serial part. */
export async function nextDisputeSerial(t: Transaction): Promise<string> {
  const [row] = await select<{ n: string }>(`SELECT nextval('dispute_numbers') AS n`, {}, t);
  if (!row) throw new Error("dispute_numbers gave no value");
  return row.n;
}

/** A new claim, waiting for the consignor's answer. */
export async function insertDispute(
  d: Pick<
    DisputeRow,
    "id" | "number" | "invoice_id" | "lot_id" | "buyer_id" | "consignor_id" | "reason" | "remedy" | "answer_due_at"
  >,
  t: Transaction,
): Promise<void> {
  await exec(
    `INSERT INTO disputes (id, number, invoice_id, lot_id, buyer_id, consignor_id, reason, remedy, state, answer_due_at, created_at, updated_at)
     VALUES (:id, :number, :invoiceId, :lotId, :buyer, :consignor, :reason, :remedy, 'awaiting-answer', :due, now(), now())`,
    {
      id: d.id,
      number: d.number,
      invoiceId: d.invoice_id,
      lotId: d.lot_id,
      buyer: d.buyer_id,
      consignor: d.consignor_id,
      reason: d.reason,
      remedy: d.remedy,
      due: d.answer_due_at,
    },
    t,
  );
}

/** The consignor's answer: their stance, and the state moves on if it was waiting for it. */
export async function recordAnswer(id: string, stance: Stance | undefined, t: Transaction): Promise<void> {
  await exec(
    `UPDATE disputes SET answered_at = now(), consignor_stance = :stance,
            state = CASE WHEN state IN (:from) THEN :to ELSE state END, updated_at = now() WHERE id = :id`,
    { stance, id, from: statesBefore("answer"), to: DISPUTE_TRANSITIONS.answer.to },
    t,
  );
}

/** Marks the claim as touched (a new message). */
export async function touchDispute(id: string, t?: Transaction): Promise<void> {
  await exec(`UPDATE disputes SET updated_at = now() WHERE id = :id`, { id }, t);
}

/** A mediator takes the case; true unless another mediator has it or it is past taking. */
export async function takeDispute(id: string, mediatorId: string): Promise<boolean> {
  const from = statesBefore("take");
  const [row] = await select<{ id: string }>(
    `UPDATE disputes SET mediator_id = :me, taken_at = now(), state = :to, updated_at = now()
      WHERE id = :id AND (mediator_id IS NULL OR mediator_id = :me) AND state IN (:from) RETURNING id`,
    { me: mediatorId, id, from, to: DISPUTE_TRANSITIONS.take.to },
  );
  return Boolean(row);
}

/** The one guarded update that records a decision; false when it was already decided. */
export async function claimDecision(
  id: string,
  mediatorId: string,
  decision: StoredDecision,
  upheldTubes: number,
): Promise<boolean> {
  const [won] = await select<{ id: string }>(
    `UPDATE disputes SET outcome = :outcome, decided_by = :me, decided_at = now(), decision = :decision::jsonb, upheld_tubes = :upheld,
            state = :to, updated_at = now()
      WHERE id = :id AND mediator_id = :me AND decided_at IS NULL RETURNING id`,
    {
      outcome: decision.outcome,
      me: mediatorId,
      decision: JSON.stringify(decision),
      upheld: upheldTubes,
      id,
      to: DISPUTE_TRANSITIONS.decide.to,
    },
  );
  return Boolean(won);
}

/** Fixes the line values of an early release; false when some were fixed before (or it is decided). */
export async function holdLines(id: string, lines: readonly LineValue[]): Promise<boolean> {
  const [row] = await select<{ id: string }>(
    `UPDATE disputes SET held_lines = :lines::jsonb, updated_at = now() WHERE id = :id AND held_lines IS NULL AND decided_at IS NULL RETURNING id`,
    { lines: JSON.stringify(lines), id },
  );
  return Boolean(row);
}

/** Undoes {@link holdLines} when the release could not be worked out. */
export async function clearHeldLines(id: string): Promise<void> {
  await exec(`UPDATE disputes SET held_lines = NULL WHERE id = :id AND undisputed_released_at IS NULL`, { id });
}

/** Records when the undisputed share was released (the first time only). */
export async function markUndisputedReleased(id: string): Promise<void> {
  await exec(
    `UPDATE disputes SET undisputed_released_at = COALESCE(undisputed_released_at, now()), updated_at = now() WHERE id = :id`,
    { id },
  );
}

/** Records the processor's refund on the claim. */
export async function recordRefund(id: string, refundId: string, buyerRefundCents: number, t: Transaction) {
  await exec(
    `UPDATE disputes SET refund_id = :r, buyer_refund_cents = :b, updated_at = now() WHERE id = :id`,
    { r: refundId, b: buyerRefundCents, id },
    t,
  );
}

/** Records the settlement a returned lot was refunded on. */
export async function recordSettlement(id: string, settlement: object, t: Transaction): Promise<void> {
  await exec(
    `UPDATE disputes SET decision = jsonb_set(decision, '{settlement}', :s::jsonb), updated_at = now() WHERE id = :id`,
    { s: JSON.stringify(settlement), id },
    t,
  );
}

/** Closes the claim from `from`, with an optional note on the decision; false when it was not in that state. */
export async function closeDispute(id: string, from: DisputeState, note?: string): Promise<boolean> {
  if (!DISPUTE_TRANSITIONS.close.from.includes(from)) throw new RangeError(`a claim is not closed from ${from}`);
  const [row] = await select<{ id: string }>(
    `UPDATE disputes SET state = :to, closed_at = now(), updated_at = now()
            ${note ? ", decision = jsonb_set(decision, '{closingNote}', to_jsonb(:note::text))" : ""}
      WHERE id = :id AND state = :from RETURNING id`,
    { id, from, note: note ?? null, to: DISPUTE_TRANSITIONS.close.to },
  );
  return Boolean(row);
}

/** A refund-on-return decision starts waiting for the lot; false when another run moved it first. */
export async function awaitReturn(id: string, due: Date): Promise<boolean> {
  const [row] = await select<{ id: string }>(
    `UPDATE disputes SET state = :to, return_due_at = :due, updated_at = now() WHERE id = :id AND state IN (:from) RETURNING id`,
    { due, id, to: DISPUTE_TRANSITIONS["await-return"].to, from: statesBefore("await-return") },
  );
  return Boolean(row);
}

/** The buyer's return shipment and the postage they paid, recorded once. */
export async function recordReturnShipment(
  id: string,
  ship: { carrier: string; tracking: string; postageCents: number; postageReceipt: string | null },
): Promise<void> {
  await exec(
    `UPDATE disputes SET return_carrier = :carrier, return_tracking = :tracking, return_postage_cents = :postage, return_postage_receipt = :receipt,
            return_shipped_at = now(), updated_at = now() WHERE id = :id AND return_shipped_at IS NULL`,
    { carrier: ship.carrier, tracking: ship.tracking, postage: ship.postageCents, receipt: ship.postageReceipt, id },
  );
}

/** Records the processor transfer that repaid the return postage. */
export async function recordPostageTransfer(id: string, transferId: string, t: Transaction): Promise<void> {
  await exec(
    `UPDATE disputes SET postage_transfer_id = :tr, updated_at = now() WHERE id = :id`,
    { tr: transferId, id },
    t,
  );
}

/** The consignor's confirmation that the return arrived; false when it was confirmed before. */
export async function markReturnReceived(id: string): Promise<boolean> {
  const [row] = await select<{ id: string }>(
    `UPDATE disputes SET return_received_at = now(), updated_at = now() WHERE id = :id AND return_received_at IS NULL AND state = 'awaiting-return' RETURNING id`,
    { id },
  );
  return Boolean(row);
}

/** A claim with its lot's title, invoice number and mediator's name, for lists. */
export type DisputeSummaryRow = DisputeRow & {
  lot_title: string;
  invoice_number: string;
  mediator_name: string | null;
};

const SUMMARY_SQL = `SELECT ${columns(DISPUTE_COLUMNS, "d")}, l.title AS lot_title, i.number AS invoice_number, m.display_name AS mediator_name
  FROM disputes d JOIN lots l ON l.id = d.lot_id JOIN invoices i ON i.id = d.invoice_id LEFT JOIN users m ON m.id = d.mediator_id`;

/** A person's own claims, as buyer or consignor, newest first. */
export async function summariesForParty(userId: string): Promise<DisputeSummaryRow[]> {
  return select<DisputeSummaryRow>(
    `${SUMMARY_SQL} WHERE d.buyer_id = :me OR d.consignor_id = :me ORDER BY d.created_at DESC LIMIT 200`,
    { me: userId },
  );
}

/** Claims nobody has taken and those the mediator has, oldest first. */
export async function summariesForMediator(mediatorId: string): Promise<DisputeSummaryRow[]> {
  return select<DisputeSummaryRow>(
    `${SUMMARY_SQL} WHERE d.mediator_id IS NULL OR d.mediator_id = :me ORDER BY d.created_at LIMIT 500`,
    { me: mediatorId },
  );
}

/** The sale behind a claim: lot title and the invoice's figures. */
export type CaseHeadRow = {
  lot_title: string;
  invoice_number: string;
  hammer_cents: number;
  premium_cents: number;
  commission_cents: number;
  tube_count: number;
  inspection_ends_at: Date | null;
  invoice_state: string;
  released_hammer_cents: number;
  released_premium_cents: number;
  released_commission_cents: number;
};

/** The sale behind a claim. */
export async function caseHead(id: string): Promise<CaseHeadRow | undefined> {
  const [head] = await select<CaseHeadRow>(
    `SELECT l.title AS lot_title, i.number AS invoice_number, i.hammer_cents, i.premium_cents, i.commission_cents, i.tube_count, i.inspection_ends_at, i.state AS invoice_state,
            i.released_hammer_cents, i.released_premium_cents, i.released_commission_cents
       FROM disputes d JOIN lots l ON l.id = d.lot_id JOIN invoices i ON i.id = d.invoice_id WHERE d.id = :id`,
    { id },
  );
  return head;
}
