import { randomUUID } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import type { Viewer } from "../auth/guards";
import { can } from "../auth/roles";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import {
  buildManifest,
  claimsFromRulings,
  defaultLineValues,
  undisputedShare,
  type LineValue,
  type ManifestItem,
  type Ruling,
} from "../disputes/manifest";
import {
  answerDueAt,
  DISPUTE_SETTINGS,
  misattributionRefusal,
  openingRefusal,
  OUTCOME_WORDS,
  REASON_WORDS,
  REMEDY_WORDS,
  STANCE_WORDS,
  type DisputeReason,
  type DisputeState,
  type Outcome,
  type Stance,
} from "../disputes/rules";
import { weighItem, weighingSummary, type BuyerReport, type ItemWeighing } from "../disputes/weigh";
import type { TubeReading } from "../lots/item";
import { lookupSourceCode } from "../valves/source-code";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { refundEntries } from "../money/ledger";
import { settleLotRejection, settlePartialRefund, type RefundSettlement } from "../money/refunds";
import { MAX_PHOTO_BYTES } from "../photos/formats";
import { PhotoRejected, processPhoto } from "../photos/process";
import { claimPhotoObjectKeys } from "../storage/keys";
import { deleteObject, getObject, putObject } from "../storage/objects";
import { stripe } from "../stripe/client";
import type {
  DecisionInput,
  DisputeMessageInput,
  LineValuesInput,
  OpenDisputeInput,
  RefundPreviewInput,
  ReturnShipmentInput,
} from "../validation/disputes";
import { db, User } from "../../models";
import { release, releaseUndisputed } from "./escrow";
import type { InvoiceRow } from "./invoices";
import { settingsForInvoice } from "./house-settings";
import { post } from "./ledger";
import { registryEntries } from "./makers";
import { notify } from "./notices";
import { referenceProfiles } from "./shelf";
import { flagExtraReview } from "./track-record";
import { currentReferenceTable } from "./reference-table";

/** A case party's or official's role in one dispute. */
export type CaseRole = "buyer" | "consignor" | "mediator" | "house";

type DisputeRow = {
  id: string;
  number: string;
  invoice_id: string;
  lot_id: string;
  buyer_id: string;
  consignor_id: string;
  reason: DisputeReason;
  remedy: string;
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
};

type ItemRow = {
  id: string;
  position: number;
  designation: string;
  quantity: number;
  label_brand: string;
  maker_name: string | null;
  maker_basis: string;
  source_code: string | null;
  date_code: string | null;
  features: Record<string, string>;
  vacuum_loss: boolean;
  readings: TubeReading[];
  sold_as_set: boolean;
};

/** The decision as recorded: outcome, reasons, the mediator's values and rulings, and the money it moved. */
type StoredDecision = {
  outcome: Outcome;
  reasons: string;
  lines?: LineValue[];
  rulings?: Ruling[];
  settlement?: Pick<
    RefundSettlement,
    | "lotValueCents"
    | "claimValueCents"
    | "hammerRefundCents"
    | "premiumRefundCents"
    | "commissionReductionCents"
    | "buyerRefundCents"
    | "consignorChangeCents"
    | "houseChangeCents"
  >;
  closingNote?: string;
};

const DAY_MS = 86_400_000;
const q = <T extends object>(sql: string, replacements: Record<string, unknown> = {}, transaction?: Transaction) =>
  db().query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });

/** The viewer's role in a case, or null when the case is none of theirs. Mediators may read every case to triage it. */
export function roleIn(
  d: Pick<DisputeRow, "buyer_id" | "consignor_id" | "mediator_id">,
  viewer: Viewer,
): CaseRole | null {
  if (d.buyer_id === viewer.id) return "buyer";
  if (d.consignor_id === viewer.id) return "consignor";
  if (can(viewer.roles, "disputes.mediate")) return "mediator";
  if (can(viewer.roles, "house.manage")) return "house";
  return null;
}

async function loadCase(
  viewer: Viewer,
  id: string,
  t?: Transaction,
  lock = false,
): Promise<{ d: DisputeRow; role: CaseRole }> {
  const [d] = await q<DisputeRow>(`SELECT * FROM disputes WHERE id = :id ${lock ? "FOR UPDATE" : ""}`, { id }, t);
  const role = d ? roleIn(d, viewer) : null;
  if (!d || !role) throw new ApiError("not_found", "No such case");
  return { d, role };
}

async function lotItems(lotId: string, t?: Transaction): Promise<ItemRow[]> {
  return q<ItemRow>(
    `SELECT id, position, designation, quantity, label_brand, maker_name, maker_basis, source_code, date_code, features, vacuum_loss, readings, sold_as_set
       FROM lot_items WHERE lot_id = :lotId ORDER BY position`,
    { lotId },
    t,
  );
}

async function mail(userId: string, subject: string, body: string): Promise<void> {
  const u = await User.findByPk(userId, { attributes: ["email", "displayName"] });
  if (!u) return;
  await sendMail({ to: u.email, subject, text: `Hello ${u.displayName},\n\n${body}\n\nGetterline Exchange` }).catch(
    (e: Error) => console.error("[mail]", e.message),
  );
}

/** A lot item as the refund arithmetic sees it. */
const asManifestItem = (i: ItemRow): ManifestItem => ({
  id: i.id,
  position: i.position,
  quantity: i.quantity,
  soldAsSet: i.sold_as_set,
});

const caseUrl = (id: string) => `${env().NEXTAUTH_URL}/disputes/${id}`;
const utc = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

/**
 * The buyer opens a claim on a delivered lot inside its inspection window.
 * The invoice moves to "disputed", so escrow is not released while the case
 * is open; the consignor is told and has until the answer deadline. A retry
 * of the same claim returns the open case.
 */
export async function openDispute(
  viewer: Viewer,
  invoiceId: string,
  input: OpenDisputeInput,
): Promise<{ id: string; number: string }> {
  const s = db();
  const created = await s.transaction(async (t) => {
    const [inv] = await q<InvoiceRow>(`SELECT * FROM invoices WHERE id = :invoiceId FOR UPDATE`, { invoiceId }, t);
    if (!inv || inv.buyer_id !== viewer.id) throw new ApiError("not_found", "No such invoice");
    const [existing] = await q<{ id: string; number: string; buyer_id: string }>(
      `SELECT id, number, buyer_id FROM disputes WHERE invoice_id = :invoiceId`,
      { invoiceId },
      t,
    );
    if (existing) return { ...existing, fresh: false };
    const { claims } = await settingsForInvoice(invoiceId, t); // the sale's frozen settings
    const refusal = openingRefusal(
      {
        state: inv.state,
        deliveredAtMs: inv.delivered_at?.getTime() ?? null,
        inspectionEndsAtMs: inv.inspection_ends_at?.getTime() ?? null,
      },
      Date.now(),
      input.reason,
      claims.breakageClaimHours,
    );
    if (refusal) throw new ApiError("conflict", refusal);

    const items = new Map((await lotItems(inv.lot_id, t)).map((i) => [i.id, i]));
    const fields: Record<string, string> = {};
    input.items.forEach((c, k) => {
      const item = items.get(c.itemId);
      if (!item) {
        fields[`items.${k}.itemId`] = "That item is not in this lot";
        return;
      }
      if (c.tubes > item.quantity)
        fields[`items.${k}.tubes`] =
          `Line ${item.position} holds ${item.quantity} tube${item.quantity === 1 ? "" : "s"}`;
      if (input.reason === "maker-misattributed") {
        const why = misattributionRefusal({
          position: item.position,
          designation: item.designation,
          labelBrand: item.label_brand,
          makerName: item.maker_name,
          makerBasis: item.maker_basis,
        });
        if (why) fields[`items.${k}.itemId`] = why;
      }
      c.readings.forEach((r, j) => {
        if (r.tubeNo > item.quantity)
          fields[`items.${k}.readings.${j}.tubeNo`] = `Line ${item.position} has tubes 1–${item.quantity}`;
      });
    });
    const problems = Object.values(fields);
    if (problems.length) {
      throw new ApiError(
        "validation_failed",
        problems.length === 1 ? problems[0]! : `${problems[0]} (and ${problems.length - 1} more: see the lines)`,
        fields,
      );
    }

    const id = randomUUID();
    const [{ n }] = (await q<{ n: string }>(`SELECT nextval('dispute_numbers') AS n`, {}, t)) as [{ n: string }];
    const number = `CL-${new Date().getUTCFullYear()}-${n}`;
    const due = new Date(answerDueAt(Date.now(), claims.answerBusinessDays));
    await s.query(
      `INSERT INTO disputes (id, number, invoice_id, lot_id, buyer_id, consignor_id, reason, remedy, state, answer_due_at, created_at, updated_at)
       VALUES (:id, :number, :invoiceId, :lotId, :buyer, :consignor, :reason, :remedy, 'awaiting-answer', :due, now(), now())`,
      {
        replacements: {
          id,
          number,
          invoiceId,
          lotId: inv.lot_id,
          buyer: inv.buyer_id,
          consignor: inv.consignor_id,
          reason: input.reason,
          remedy: input.remedy,
          due,
        },
        transaction: t,
      },
    );
    for (const c of input.items) {
      const report: BuyerReport = {
        tubes: c.tubes,
        sourceCode: c.sourceCode ?? null,
        dateCode: c.dateCode ?? null,
        designationSeen: c.designationSeen ?? null,
        tubesReceived: c.tubesReceived ?? null,
        vacuumLoss: c.vacuumLoss ?? false,
        features: c.features,
        readings: c.readings as TubeReading[],
        note: c.note ?? "",
      };
      await s.query(
        `INSERT INTO dispute_items (dispute_id, lot_item_id, tubes, report) VALUES (:id, :itemId, :tubes, :report::jsonb)`,
        { replacements: { id, itemId: c.itemId, tubes: c.tubes, report: JSON.stringify(report) }, transaction: t },
      );
    }
    await s.query(
      `INSERT INTO dispute_messages (id, dispute_id, author_id, author_role, body, created_at) VALUES (:mid, :id, :me, 'buyer', :body, now())`,
      { replacements: { mid: randomUUID(), id, me: viewer.id, body: input.statement }, transaction: t },
    );
    await s.query(`UPDATE invoices SET state = 'disputed', updated_at = now() WHERE id = :invoiceId`, {
      replacements: { invoiceId },
      transaction: t,
    });
    return {
      id,
      number,
      buyer_id: inv.buyer_id,
      fresh: true,
      consignor: inv.consignor_id,
      invoiceNumber: inv.number,
      due,
    };
  });
  if (created.fresh && "consignor" in created) {
    const tubes = input.items.reduce((n, i) => n + i.tubes, 0);
    await notify(
      created.consignor!,
      `Claim ${created.number} on invoice ${created.invoiceNumber}: answer by ${utc(created.due!)}`,
      `/disputes/${created.id}`,
    ).catch(() => undefined);
    await mail(
      created.consignor!,
      `A buyer has opened a claim (${created.number})`,
      `The buyer of invoice ${created.invoiceNumber} says the lot is not as listed: ${REASON_WORDS[input.reason]}, on ${input.items.length} line(s) and ${tubes} tube(s). They ask for: ${REMEDY_WORDS[input.remedy]}.\n\nPayment for the lot stays held while the claim is open. Please answer by ${utc(created.due!)}; after that a mediator decides on the buyer's evidence.\n\nRead the claim and answer: ${caseUrl(created.id)}`,
    );
    await mail(
      created.buyer_id,
      `Your claim ${created.number} is open`,
      `We have told the consignor and are holding the payment. They have until ${utc(created.due!)} to answer; a mediator then compares the evidence and decides. Add photos and messages at ${caseUrl(created.id)}.`,
    );
  }
  return { id: created.id, number: created.number };
}

/** Add a photo to a case's evidence: checked by content, re-encoded without metadata, kept for good. */
export async function addDisputePhoto(
  viewer: Viewer,
  disputeId: string,
  file: { name: string; bytes: Buffer },
  opts: { itemId: string | null; caption: string },
) {
  const { d, role } = await loadCase(viewer, disputeId);
  if (role === "house" || (role === "mediator" && d.mediator_id !== viewer.id))
    throw new ApiError("forbidden", "Only the parties and the case's mediator add evidence");
  if (d.state === "closed") throw new ApiError("conflict", "The case is closed");
  if (
    opts.itemId &&
    !(
      await q(`SELECT 1 FROM lot_items WHERE id = :itemId AND lot_id = :lotId`, {
        itemId: opts.itemId,
        lotId: d.lot_id,
      })
    ).length
  ) {
    throw new ApiError("validation_failed", "That item is not in this lot", { itemId: "Choose an item of this lot" });
  }
  let processed;
  try {
    processed = await processPhoto(file.bytes, file.name, { maxBytes: MAX_PHOTO_BYTES });
  } catch (e) {
    if (e instanceof PhotoRejected)
      throw new ApiError(
        e.code === "too-large" ? "payload_too_large" : e.code === "empty" ? "bad_request" : "unsupported_media_type",
        e.message,
      );
    throw e;
  }
  const [seen] = await q<{ id: string }>(
    `SELECT id FROM dispute_evidence WHERE dispute_id = :disputeId AND sha256 = :sha`,
    { disputeId, sha: processed.sha256 },
  );
  if (seen) return { id: seen.id };
  const id = randomUUID();
  const keys = claimPhotoObjectKeys(disputeId, id);
  try {
    await putObject(keys.full, processed.full.buffer, "image/jpeg");
    await putObject(keys.thumb, processed.thumb.buffer, "image/jpeg");
    await db().query(
      `INSERT INTO dispute_evidence (id, dispute_id, author_id, author_role, lot_item_id, caption, full_key, thumb_key, width, height, sha256, created_at)
       VALUES (:id, :disputeId, :me, :role, :itemId, :caption, :full, :thumb, :w, :h, :sha, now())`,
      {
        replacements: {
          id,
          disputeId,
          me: viewer.id,
          role,
          itemId: opts.itemId,
          caption: opts.caption.slice(0, 200),
          full: keys.full,
          thumb: keys.thumb,
          w: processed.full.width,
          h: processed.full.height,
          sha: processed.sha256,
        },
      },
    );
    return { id };
  } catch (e) {
    await Promise.allSettled([deleteObject(keys.full), deleteObject(keys.thumb)]);
    const [raced] = await q<{ id: string }>(
      `SELECT id FROM dispute_evidence WHERE dispute_id = :disputeId AND sha256 = :sha`,
      { disputeId, sha: processed.sha256 },
    );
    if (raced) return { id: raced.id };
    throw e;
  }
}

/** A photo of a case's evidence, for those who may read the case. */
export async function readDisputePhoto(viewer: Viewer, evidenceId: string, size: "thumb" | "full") {
  const [e] = await q<{ dispute_id: string; full_key: string; thumb_key: string }>(
    `SELECT dispute_id, full_key, thumb_key FROM dispute_evidence WHERE id = :evidenceId`,
    { evidenceId },
  );
  if (!e) throw new ApiError("not_found", "No such photo");
  await loadCase(viewer, e.dispute_id);
  const obj = await getObject(size === "thumb" ? e.thumb_key : e.full_key);
  if (!obj) throw new ApiError("not_found", "The photo's file is missing");
  return obj;
}

/**
 * Post to a case's conversation. The consignor's first message is their
 * answer (with a stance); the mediator posts once the case is theirs.
 * Messages cannot be edited or deleted; a retry with the same key posts once.
 */
export async function postMessage(
  viewer: Viewer,
  disputeId: string,
  input: DisputeMessageInput,
): Promise<{ id: string }> {
  const s = db();
  const out = await s.transaction(async (t) => {
    const { d, role } = await loadCase(viewer, disputeId, t, true);
    if (role === "house")
      throw new ApiError("forbidden", "The house reads cases; the parties and the mediator write in them");
    if (role === "mediator" && d.mediator_id !== viewer.id)
      throw new ApiError("forbidden", "Take the case from the queue before writing in it");
    if (d.state === "closed") throw new ApiError("conflict", "The case is closed");
    if (input.clientKey) {
      const [seen] = await q<{ id: string }>(
        `SELECT id FROM dispute_messages WHERE dispute_id = :disputeId AND author_id = :me AND client_key = :k`,
        { disputeId, me: viewer.id, k: input.clientKey },
        t,
      );
      if (seen) return { id: seen.id, answered: false, d };
    }
    const answering = role === "consignor" && !d.answered_at;
    if (answering && !input.stance)
      throw new ApiError("validation_failed", "Say whether you accept or contest the claim", {
        stance: "Choose your answer",
      });
    const id = randomUUID();
    await s.query(
      `INSERT INTO dispute_messages (id, dispute_id, author_id, author_role, body, client_key, created_at) VALUES (:id, :disputeId, :me, :role, :body, :k, now())`,
      {
        replacements: { id, disputeId, me: viewer.id, role, body: input.body, k: input.clientKey ?? null },
        transaction: t,
      },
    );
    if (answering) {
      await s.query(
        `UPDATE disputes SET answered_at = now(), consignor_stance = :stance, state = CASE WHEN state = 'awaiting-answer' THEN 'answered' ELSE state END, updated_at = now() WHERE id = :disputeId`,
        { replacements: { stance: input.stance, disputeId }, transaction: t },
      );
    } else
      await s.query(`UPDATE disputes SET updated_at = now() WHERE id = :disputeId`, {
        replacements: { disputeId },
        transaction: t,
      });
    return { id, answered: answering, d };
  });
  const d = out.d;
  const others = [d.buyer_id, d.consignor_id, d.mediator_id].filter((u): u is string => Boolean(u) && u !== viewer.id);
  for (const u of others)
    await notify(
      u,
      `New message in claim ${d.number}${out.answered ? ": the consignor has answered" : ""}`,
      `/disputes/${d.id}`,
    ).catch(() => undefined);
  if (out.answered)
    await mail(
      d.buyer_id,
      `The consignor has answered your claim ${d.number}`,
      `Their answer: ${STANCE_WORDS[input.stance!]}. A mediator will compare the evidence and decide. Read it at ${caseUrl(d.id)}.`,
    );
  return { id: out.id };
}

/** A case in a list. */
export type CaseSummary = {
  id: string;
  number: string;
  state: DisputeState;
  reason: DisputeReason;
  remedy: string;
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

const SUMMARY_SQL = `SELECT d.*, l.title AS lot_title, i.number AS invoice_number, m.display_name AS mediator_name
  FROM disputes d JOIN lots l ON l.id = d.lot_id JOIN invoices i ON i.id = d.invoice_id LEFT JOIN users m ON m.id = d.mediator_id`;

function summarise(
  r: DisputeRow & { lot_title: string; invoice_number: string; mediator_name: string | null },
  viewer: Viewer,
): CaseSummary {
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

/** The viewer's own cases, as buyer or consignor. */
export async function myCases(viewer: Viewer): Promise<CaseSummary[]> {
  const rows = await q<DisputeRow & { lot_title: string; invoice_number: string; mediator_name: string | null }>(
    `${SUMMARY_SQL} WHERE d.buyer_id = :me OR d.consignor_id = :me ORDER BY d.created_at DESC LIMIT 200`,
    { me: viewer.id },
  );
  return rows.map((r) => summarise(r, viewer));
}

/** The mediators' queue: open cases nobody has taken, oldest first, and the viewer's own open cases. */
export async function mediationQueue(
  viewer: Viewer,
): Promise<{ waiting: CaseSummary[]; mine: CaseSummary[]; recent: CaseSummary[] }> {
  if (!can(viewer.roles, "disputes.mediate")) throw new ApiError("forbidden", "Only mediators see the queue");
  const rows = await q<DisputeRow & { lot_title: string; invoice_number: string; mediator_name: string | null }>(
    `${SUMMARY_SQL} WHERE d.mediator_id IS NULL OR d.mediator_id = :me ORDER BY d.created_at LIMIT 500`,
    { me: viewer.id },
  );
  const all = rows.map((r) => summarise(r, viewer));
  return {
    waiting: all.filter((c) => !c.mediator && c.state !== "closed"),
    mine: all.filter((c) => c.mine && c.state !== "closed"),
    recent: all
      .filter((c) => c.mine && c.state === "closed")
      .reverse()
      .slice(0, 20),
  };
}

/** One case in full, for its parties, the mediators and the house. */
export async function getCase(viewer: Viewer, id: string) {
  const { d, role } = await loadCase(viewer, id);
  const [[head], items, messages, photos, users] = await Promise.all([
    q<{
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
    }>(
      `SELECT l.title AS lot_title, i.number AS invoice_number, i.hammer_cents, i.premium_cents, i.commission_cents, i.tube_count, i.inspection_ends_at, i.state AS invoice_state,
              i.released_hammer_cents, i.released_premium_cents, i.released_commission_cents
         FROM disputes d JOIN lots l ON l.id = d.lot_id JOIN invoices i ON i.id = d.invoice_id WHERE d.id = :id`,
      { id },
    ),
    q<ItemRow & { tubes: number; report: BuyerReport }>(
      `SELECT li.id, li.position, li.designation, li.quantity, li.label_brand, li.maker_name, li.maker_basis, li.source_code, li.date_code, li.features, li.vacuum_loss,
              li.readings, li.sold_as_set, di.tubes, di.report
         FROM dispute_items di JOIN lot_items li ON li.id = di.lot_item_id WHERE di.dispute_id = :id ORDER BY li.position`,
      { id },
    ),
    q<{ id: string; author_role: CaseRole; author_name: string | null; body: string; created_at: Date }>(
      `SELECT m.id, m.author_role, u.display_name AS author_name, m.body, m.created_at FROM dispute_messages m LEFT JOIN users u ON u.id = m.author_id
        WHERE m.dispute_id = :id ORDER BY m.created_at, m.id`,
      { id },
    ),
    q<{
      id: string;
      author_role: CaseRole;
      lot_item_id: string | null;
      caption: string;
      width: number;
      height: number;
      created_at: Date;
    }>(
      `SELECT id, author_role, lot_item_id, caption, width, height, created_at FROM dispute_evidence WHERE dispute_id = :id ORDER BY created_at`,
      { id },
    ),
    q<{ id: string; display_name: string }>(`SELECT id, display_name FROM users WHERE id IN (:ids)`, {
      ids: [d.buyer_id, d.consignor_id, d.decided_by ?? d.buyer_id],
    }),
  ]);
  const name = (uid: string | null) => users.find((u) => u.id === uid)?.display_name ?? null;
  const moneyView = role !== "buyer"; // the buyer does not see the consignor's commission
  const decision = d.decision;
  return {
    id: d.id,
    number: d.number,
    role,
    state: d.state,
    reason: d.reason,
    remedy: d.remedy,
    lotId: d.lot_id,
    invoiceId: d.invoice_id,
    lotTitle: head!.lot_title,
    invoiceNumber: head!.invoice_number,
    invoiceState: head!.invoice_state,
    buyer: name(d.buyer_id),
    consignor: name(d.consignor_id),
    answerDueAt: d.answer_due_at.toISOString(),
    answeredAt: d.answered_at?.toISOString() ?? null,
    stance: d.consignor_stance,
    deadlinePassed: !d.answered_at && d.answer_due_at.getTime() <= Date.now(),
    mediatorId: d.mediator_id,
    takenAt: d.taken_at?.toISOString() ?? null,
    outcome: d.outcome,
    decidedBy: name(d.decided_by),
    decidedAt: d.decided_at?.toISOString() ?? null,
    decision: decision
      ? {
          outcome: decision.outcome,
          reasons: decision.reasons,
          closingNote: decision.closingNote ?? null,
          buyerRefundCents: decision.settlement?.buyerRefundCents ?? null,
          consignorChangeCents: moneyView ? (decision.settlement?.consignorChangeCents ?? null) : null,
          commissionReductionCents: moneyView ? (decision.settlement?.commissionReductionCents ?? null) : null,
        }
      : null,
    buyerRefundCents: d.buyer_refund_cents,
    refundId: role === "house" || role === "mediator" ? d.refund_id : null,
    returnDueAt: d.return_due_at?.toISOString() ?? null,
    returnCarrier: d.return_carrier,
    returnTracking: d.return_tracking,
    heldLines: d.held_lines,
    undisputedReleasedAt: d.undisputed_released_at?.toISOString() ?? null,
    returnShippedAt: d.return_shipped_at?.toISOString() ?? null,
    returnReceivedAt: d.return_received_at?.toISOString() ?? null,
    closedAt: d.closed_at?.toISOString() ?? null,
    sale: {
      hammerCents: head!.hammer_cents,
      premiumCents: head!.premium_cents,
      commissionCents: moneyView ? head!.commission_cents : null,
      tubeCount: head!.tube_count,
    },
    releasedEarly:
      moneyView && head!.released_hammer_cents + head!.released_premium_cents > 0
        ? {
            hammerCents: head!.released_hammer_cents,
            premiumCents: head!.released_premium_cents,
            commissionCents: head!.released_commission_cents,
            payoutCents: head!.released_hammer_cents - head!.released_commission_cents,
          }
        : null,
    items: items.map((i) => ({
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
    })),
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
export type CaseView = Awaited<ReturnType<typeof getCase>>;

/** A mediator takes a case from the queue; a second mediator is refused, the same one may retry. */
export async function takeCase(viewer: Viewer, id: string): Promise<void> {
  if (!can(viewer.roles, "disputes.mediate")) throw new ApiError("forbidden", "Only mediators take cases");
  const [row] = await q<{ id: string }>(
    `UPDATE disputes SET mediator_id = :me, taken_at = now(), state = CASE WHEN state IN ('awaiting-answer','answered') THEN 'with-mediator' ELSE state END, updated_at = now()
      WHERE id = :id AND (mediator_id IS NULL OR mediator_id = :me) AND state IN ('awaiting-answer','answered','with-mediator') RETURNING id`,
    { me: viewer.id, id },
  );
  if (row) return;
  const { d } = await loadCase(viewer, id);
  if (d.state === "closed") throw new ApiError("conflict", "The case is closed");
  throw new ApiError("conflict", "Another mediator has already taken this case");
}

/**
 * The mediator's workspace: per claimed item, listing against report, ranked
 * and graded, with default line values for a refund. A page that has already
 * read the case passes it in.
 */
export async function workspace(viewer: Viewer, id: string, read?: CaseView) {
  const c = read ?? (await getCase(viewer, id));
  if (c.role !== "mediator" && c.role !== "house") throw new ApiError("not_found", "No such case");
  const [profiles, registry] = await Promise.all([referenceProfiles(), registryEntries()]);
  const makerFor = (code: string | null | undefined) => {
    if (!code) return null;
    const r = lookupSourceCode(code, registry);
    return r.ok && r.found ? r.entries.map((e) => e.makerName).join(" / ") : null;
  };
  const weighings: (ItemWeighing & { itemId: string; tubes: number })[] = [];
  const table = await currentReferenceTable();
  for (const i of c.items) {
    const w = weighItem(
      table,
      c.reason,
      {
        position: i.position,
        designation: i.designation,
        quantity: i.quantity,
        labelBrand: i.listing.labelBrand,
        makerName: i.listing.makerName,
        makerBasis: i.listing.makerBasis,
        sourceCode: i.listing.sourceCode,
        dateCode: i.listing.dateCode,
        features: i.listing.features,
        vacuumLoss: i.listing.vacuumLoss,
        readings: i.listing.readings,
      },
      i.report,
      profiles,
      { listing: makerFor(i.listing.sourceCode), buyer: makerFor(i.report.sourceCode) },
    );
    weighings.push({ ...w, itemId: i.id, tubes: i.tubes });
  }
  const all = await lotItems(c.lotId);
  const manifestItems = all.map(asManifestItem);
  return {
    weighings,
    summary: weighingSummary(weighings),
    lines: all.map((i) => ({
      id: i.id,
      position: i.position,
      designation: i.designation,
      quantity: i.quantity,
      soldAsSet: i.sold_as_set,
      labelBrand: i.label_brand,
      makerName: i.maker_name,
    })),
    defaults: defaultLineValues(manifestItems, c.sale.hammerCents),
  };
}

/** The refund a partial-refund decision would pay, for the mediator's screen (no money moves). */
export async function refundPreview(viewer: Viewer, id: string, input: RefundPreviewInput) {
  const { d, role } = await loadCase(viewer, id);
  if (role !== "mediator") throw new ApiError("not_found", "No such case");
  const [inv] = await q<InvoiceRow>(`SELECT * FROM invoices WHERE id = :id`, { id: d.invoice_id });
  const s = await previewRefund(
    d.lot_id,
    { hammerCents: inv!.hammer_cents, premiumCents: inv!.premium_cents, commissionCents: inv!.commission_cents },
    input.lines,
    input.rulings,
  );
  return { ...s, items: undefined };
}

/** The refund arithmetic for a partial-refund decision (no money moves). */
async function previewRefund(
  lotId: string,
  sale: { hammerCents: number; premiumCents: number; commissionCents: number },
  lines: LineValue[],
  rulings: Ruling[],
) {
  const all = await lotItems(lotId);
  const manifestItems = all.map(asManifestItem);
  try {
    const manifest = buildManifest(manifestItems, lines);
    const claims = claimsFromRulings(manifestItems, manifest, rulings);
    return settlePartialRefund(sale, manifest, claims);
  } catch (e) {
    if (e instanceof RangeError)
      throw new ApiError("validation_failed", `The refund cannot be worked out: ${e.message}`);
    throw e;
  }
}

/**
 * The case's mediator decides, once. The decision is claimed by one guarded
 * update (a second mediator, or a second click, gets 409), recorded with who
 * and when, and the money then moves through the processor and the ledger.
 */
export async function decide(viewer: Viewer, id: string, input: DecisionInput) {
  const { d } = await loadCase(viewer, id);
  if (!can(viewer.roles, "disputes.mediate")) throw new ApiError("forbidden", "Only mediators decide cases");
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
  const [inv] = await q<InvoiceRow>(`SELECT * FROM invoices WHERE id = :invoiceId`, { invoiceId: d.invoice_id });
  const claimed = await q<{ lot_item_id: string; tubes: number }>(
    `SELECT lot_item_id, tubes FROM dispute_items WHERE dispute_id = :id`,
    { id },
  );
  const decision: StoredDecision = { outcome: input.outcome, reasons: input.reasons };
  let upheld = 0;
  if (input.outcome === "partial-refund") {
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
    const s = await previewRefund(
      d.lot_id,
      { hammerCents: inv!.hammer_cents, premiumCents: inv!.premium_cents, commissionCents: inv!.commission_cents },
      input.lines,
      input.rulings,
    );
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
    upheld = input.rulings.filter((r) => r.upheld).reduce((n, r) => n + r.tubes, 0);
  } else if (input.outcome === "refund-on-return") {
    upheld = claimed.reduce((n, c) => n + c.tubes, 0);
  }
  const [won] = await q<{ id: string }>(
    `UPDATE disputes SET outcome = :outcome, decided_by = :me, decided_at = now(), decision = :decision::jsonb, upheld_tubes = :upheld,
            state = 'settling', updated_at = now()
      WHERE id = :id AND mediator_id = :me AND decided_at IS NULL RETURNING id`,
    { outcome: input.outcome, me: viewer.id, decision: JSON.stringify(decision), upheld, id },
  );
  if (!won) throw new ApiError("conflict", "This case was already decided");
  await settleDecision(id);
  await flagExtraReview(d.consignor_id);
  return getCase(viewer, id);
}

const lineKey = (l: LineValue) => `${l.itemId}:${l.valueCents}:${l.singleValueCents ?? ""}`;
function sameLines(a: readonly LineValue[], b: readonly LineValue[]): boolean {
  const x = a.map(lineKey).sort();
  const y = b.map(lineKey).sort();
  return x.length === y.length && x.every((k, i) => k === y[i]);
}

/**
 * The case's mediator releases the share of the lot the claim does not touch
 * [SUG], on line values they set now and keep for the decision. Not
 * when the buyer asks to return the whole lot. Once per case; a retry
 * finishes an interrupted release.
 */
export async function releaseUndisputedShare(viewer: Viewer, id: string, input: LineValuesInput) {
  const { d } = await loadCase(viewer, id);
  if (d.mediator_id !== viewer.id)
    throw new ApiError("forbidden", "Only the case's mediator releases part of the payment");
  if (d.decided_at) throw new ApiError("conflict", "The case is decided; the decision released what was due");
  if (d.remedy === "return-whole-lot")
    throw new ApiError("conflict", "The buyer asks to return the whole lot: no share of it is undisputed");
  const [claimedLine] = await db().query<{ id: string }>(
    `UPDATE disputes SET held_lines = :lines::jsonb, updated_at = now() WHERE id = :id AND held_lines IS NULL AND decided_at IS NULL RETURNING id`,
    { replacements: { lines: JSON.stringify(input.lines), id }, type: QueryTypes.SELECT },
  );
  const [fresh] = await q<DisputeRow>(`SELECT * FROM disputes WHERE id = :id`, { id });
  if (!claimedLine && !sameLines(fresh!.held_lines ?? [], input.lines))
    throw new ApiError("conflict", "The undisputed share was already released on other line values");
  const [inv] = await q<InvoiceRow>(`SELECT * FROM invoices WHERE id = :id`, { id: d.invoice_id });
  const items = await lotItems(d.lot_id);
  const claimed = await q<{ lot_item_id: string; tubes: number }>(
    `SELECT lot_item_id, tubes FROM dispute_items WHERE dispute_id = :id`,
    { id },
  );
  let share;
  try {
    share = undisputedShare(
      { hammerCents: inv!.hammer_cents, premiumCents: inv!.premium_cents, commissionCents: inv!.commission_cents },
      items.map(asManifestItem),
      fresh!.held_lines!,
      claimed.map((c) => ({ itemId: c.lot_item_id, tubes: c.tubes })),
    );
  } catch (e) {
    if (claimedLine)
      await db().query(`UPDATE disputes SET held_lines = NULL WHERE id = :id AND undisputed_released_at IS NULL`, {
        replacements: { id },
      });
    if (e instanceof RangeError)
      throw new ApiError("validation_failed", `The share cannot be worked out: ${e.message}`);
    throw e;
  }
  const { payoutCents: payout, done } = await releaseUndisputed(
    inv!.id,
    share.undisputed,
    `claim ${d.number} covers only part of the lot`,
  );
  if (!done && !claimedLine) {
    throw new ApiError(
      "conflict",
      `The undisputed share was already released${fresh!.undisputed_released_at ? ` on ${fresh!.undisputed_released_at.toISOString().slice(0, 10)}` : ""}: ${formatCents(payout)} to the consignor`,
      undefined,
      undefined,
      { state: d.state, payoutCents: payout },
    );
  }
  await db().query(
    `UPDATE disputes SET undisputed_released_at = COALESCE(undisputed_released_at, now()), updated_at = now() WHERE id = :id`,
    { replacements: { id } },
  );
  await notify(
    d.buyer_id,
    `Claim ${d.number}: the share of the lot the claim does not cover has been paid to the consignor; the rest stays held`,
    `/disputes/${d.id}`,
  ).catch(() => undefined);
  return { payoutCents: payout, held: share.held, undisputed: share.undisputed };
}

/** Pay a refund out of held escrow through the processor and post it, once per case. */
async function payRefund(
  d: DisputeRow,
  inv: InvoiceRow,
  s: Pick<
    RefundSettlement,
    | "buyerRefundCents"
    | "hammerRefundCents"
    | "premiumRefundCents"
    | "commissionReductionCents"
    | "consignorChangeCents"
    | "houseChangeCents"
  >,
): Promise<void> {
  if (s.buyerRefundCents <= 0) return;
  if (!inv.payment_intent_id) throw new Error(`invoice ${inv.number} has no payment to refund`);
  const [paid] = await q<{ n: number }>(
    `SELECT 1 AS n FROM ledger_entries WHERE invoice_id = :id AND txn_kind = 'dispute-refund' LIMIT 1`,
    { id: inv.id },
  );
  if (paid) return; // paid before: a retry, or a second click that raced the first
  const heldHammer = inv.hammer_cents - inv.hammer_refunded_cents - inv.released_hammer_cents;
  const heldPremium = inv.premium_cents - inv.premium_refunded_cents - inv.released_premium_cents;
  if (s.hammerRefundCents > heldHammer || s.premiumRefundCents > heldPremium) {
    throw new ApiError(
      "conflict",
      `Invoice ${inv.number}: the refund exceeds what is still held`,
      undefined,
      undefined,
      { state: inv.state },
    );
  }
  const refund = await stripe().refunds.create(
    {
      payment_intent: inv.payment_intent_id,
      amount: s.buyerRefundCents,
      reason: "requested_by_customer",
      metadata: { invoice_id: inv.id, dispute_id: d.id },
    },
    { idempotencyKey: `dispute:${d.id}:refund` },
  );
  await db().transaction(async (t) => {
    await q(`SELECT id FROM invoices WHERE id = :id FOR UPDATE`, { id: inv.id }, t);
    const posted = await post(t, "dispute-refund", inv.id, refundEntries(s as RefundSettlement, "held"), refund.id);
    if (!posted) return;
    await db().query(
      `UPDATE invoices SET hammer_refunded_cents = hammer_refunded_cents + :h, premium_refunded_cents = premium_refunded_cents + :p,
              commission_returned_cents = commission_returned_cents + :c, updated_at = now() WHERE id = :id`,
      {
        replacements: { h: s.hammerRefundCents, p: s.premiumRefundCents, c: s.commissionReductionCents, id: inv.id },
        transaction: t,
      },
    );
    await db().query(`UPDATE disputes SET refund_id = :r, buyer_refund_cents = :b, updated_at = now() WHERE id = :id`, {
      replacements: { r: refund.id, b: s.buyerRefundCents, id: d.id },
      transaction: t,
    });
  });
}

async function closeCase(d: DisputeRow, from: DisputeState, note?: string): Promise<boolean> {
  const [row] = await q<{ id: string }>(
    `UPDATE disputes SET state = 'closed', closed_at = now(), updated_at = now()
            ${note ? ", decision = jsonb_set(decision, '{closingNote}', to_jsonb(:note::text))" : ""}
      WHERE id = :id AND state = :from RETURNING id`,
    { id: d.id, from, note: note ?? null },
  );
  return Boolean(row);
}

/**
 * Move the money a decision calls for. Safe to run again after a crash:
 * every processor call carries a key tied to the case and every posting is
 * once per invoice. Dismissed: escrow released. Partial refund: the refund
 * from escrow, then the rest released to the consignor. Refund on return:
 * the case waits for the return.
 */
export async function settleDecision(id: string): Promise<void> {
  const [d] = await q<DisputeRow>(`SELECT * FROM disputes WHERE id = :id`, { id });
  if (!d || d.state !== "settling" || !d.decision) return;
  const [inv] = await q<InvoiceRow>(`SELECT * FROM invoices WHERE id = :id`, { id: d.invoice_id });
  const decision = d.decision;
  if (decision.outcome === "refund-on-return") {
    const due = new Date(Date.now() + DISPUTE_SETTINGS.returnShipDays * DAY_MS);
    const [moved] = await q<{ id: string }>(
      `UPDATE disputes SET state = 'awaiting-return', return_due_at = :due, updated_at = now() WHERE id = :id AND state = 'settling' RETURNING id`,
      { due, id },
    );
    if (moved)
      await mailDecision(
        d,
        inv!,
        `Ship the whole lot back by ${utc(due)} and enter the carrier and tracking number on the case page. The refund of the hammer price and premium is paid when the consignor confirms receipt, or ${DISPUTE_SETTINGS.receiptConfirmDays} days after the return ships if they do not.`,
      );
    return;
  }
  if (decision.outcome === "partial-refund" && decision.settlement) await payRefund(d, inv!, decision.settlement);
  await release(
    inv!.id,
    decision.outcome === "dismissed" ? `claim ${d.number} dismissed` : `claim ${d.number} settled by a partial refund`,
    { fromDispute: true },
  );
  if (await closeCase(d, "settling")) {
    await mailDecision(
      d,
      inv!,
      decision.outcome === "dismissed"
        ? "The payment for the lot has been released to the consignor."
        : `The buyer is refunded ${formatCents(decision.settlement!.buyerRefundCents)} to the card used; the rest of the payment has been released to the consignor.`,
    );
  }
}

/** The written decision, to both parties. */
async function mailDecision(d: DisputeRow, inv: InvoiceRow, next: string): Promise<void> {
  const [fresh] = await q<DisputeRow>(`SELECT * FROM disputes WHERE id = :id`, { id: d.id });
  const dec = fresh!.decision!;
  const [mediator] = await q<{ display_name: string }>(`SELECT display_name FROM users WHERE id = :id`, {
    id: fresh!.decided_by,
  });
  const s = dec.settlement;
  const head = `Decision on claim ${d.number} (invoice ${inv.number}, ${REASON_WORDS[d.reason]}): ${OUTCOME_WORDS[dec.outcome]}.\nDecided by ${mediator?.display_name ?? "a mediator"} on ${utc(fresh!.decided_at!)}.\n\nReasons:\n${dec.reasons}\n`;
  const buyerMoney = s
    ? `\nRefund to you: ${formatCents(s.buyerRefundCents)} (hammer ${formatCents(s.hammerRefundCents)} + buyer's premium ${formatCents(s.premiumRefundCents)}).\n`
    : "";
  const consignorMoney = s
    ? `\nYour payout changes by ${formatCents(s.consignorChangeCents)}: the hammer refunded (${formatCents(s.hammerRefundCents)}) less the commission the house gives back (${formatCents(s.commissionReductionCents)}).\n`
    : "";
  await mail(
    d.buyer_id,
    `Decision on your claim ${d.number}`,
    `${head}${buyerMoney}\n${next}\n\nThe case: ${caseUrl(d.id)}`,
  );
  await mail(
    d.consignor_id,
    `Decision on claim ${d.number}`,
    `${head}${consignorMoney}\n${next}\n\nThe case: ${caseUrl(d.id)}`,
  );
  for (const u of [d.buyer_id, d.consignor_id])
    await notify(u, `Claim ${d.number} decided: ${OUTCOME_WORDS[dec.outcome]}`, `/disputes/${d.id}`).catch(
      () => undefined,
    );
}

/** The buyer records the return shipment (refund-on-return). */
export async function recordReturn(viewer: Viewer, id: string, input: ReturnShipmentInput): Promise<void> {
  const { d, role } = await loadCase(viewer, id);
  if (role !== "buyer") throw new ApiError("forbidden", "Only the buyer records the return");
  if (d.state !== "awaiting-return") throw new ApiError("conflict", "No return is expected on this case");
  if (d.return_shipped_at) {
    if (d.return_tracking === input.tracking) return; // a retry
    throw new ApiError("conflict", "The return is already recorded");
  }
  await db().query(
    `UPDATE disputes SET return_carrier = :carrier, return_tracking = :tracking, return_shipped_at = now(), updated_at = now() WHERE id = :id AND return_shipped_at IS NULL`,
    { replacements: { ...input, id } },
  );
  await notify(
    d.consignor_id,
    `Claim ${d.number}: the lot is on its way back (${input.carrier} ${input.tracking})`,
    `/disputes/${d.id}`,
  ).catch(() => undefined);
  await mail(
    d.consignor_id,
    `The lot of claim ${d.number} is on its way back`,
    `The buyer has shipped the lot back with ${input.carrier}, tracking ${input.tracking}. Confirm receipt on the case page when it arrives: ${caseUrl(d.id)}. If you do not, the buyer is refunded ${DISPUTE_SETTINGS.receiptConfirmDays} days after shipment.`,
  );
}

/** Pay the full refund on a returned lot and close the case (the consignor confirmed, or the deadline passed). */
async function refundReturnedLot(d: DisputeRow, why: string): Promise<void> {
  const [inv] = await q<InvoiceRow>(`SELECT * FROM invoices WHERE id = :id`, { id: d.invoice_id });
  const items = await lotItems(d.lot_id);
  const manifestItems = items.map(asManifestItem);
  const s = settleLotRejection(
    { hammerCents: inv!.hammer_cents, premiumCents: inv!.premium_cents, commissionCents: inv!.commission_cents },
    buildManifest(manifestItems, defaultLineValues(manifestItems, inv!.hammer_cents)),
  );
  await payRefund(d, inv!, s);
  await db().transaction(async (t) => {
    await db().query(
      `UPDATE invoices SET state = 'refunded', updated_at = now() WHERE id = :id AND state = 'disputed'`,
      { replacements: { id: inv!.id }, transaction: t },
    );
    await db().query(
      `UPDATE disputes SET decision = jsonb_set(decision, '{settlement}', :s::jsonb), updated_at = now() WHERE id = :id`,
      { replacements: { s: JSON.stringify({ ...s, items: undefined }), id: d.id }, transaction: t },
    );
  });
  if (await closeCase(d, "awaiting-return", why)) {
    for (const [u, text] of [
      [
        d.buyer_id,
        `The returned lot is settled (${why}): ${formatCents(s.buyerRefundCents)} is refunded to your card.`,
      ],
      [
        d.consignor_id,
        `The returned lot is settled (${why}): the buyer is refunded ${formatCents(s.buyerRefundCents)}; no payout is due on this lot, and no commission is charged.`,
      ],
    ] as const) {
      await mail(u, `Claim ${d.number} closed: refund paid`, `${text}\n\nThe case: ${caseUrl(d.id)}`);
    }
  }
}

/** The consignor confirms the returned lot arrived; the refund is paid at once. */
export async function confirmReturnReceived(viewer: Viewer, id: string): Promise<void> {
  const { d, role } = await loadCase(viewer, id);
  if (role !== "consignor") throw new ApiError("forbidden", "Only the consignor confirms receipt");
  if (d.state !== "awaiting-return" || !d.return_shipped_at || d.return_received_at) throw returnConflict(d);
  const [claimed] = await q<{ id: string }>(
    `UPDATE disputes SET return_received_at = now(), updated_at = now() WHERE id = :id AND return_received_at IS NULL AND state = 'awaiting-return' RETURNING id`,
    { id },
  );
  if (!claimed) {
    const [now] = await q<DisputeRow>(`SELECT * FROM disputes WHERE id = :id`, { id });
    throw returnConflict(now ?? d);
  }
  await refundReturnedLot(d, "the consignor confirmed receipt");
}

/** A second confirmation of a return (a double click, or two tabs): 409 with the case as it stands. */
function returnConflict(d: DisputeRow): ApiError {
  const message = d.return_received_at
    ? `Receipt of the return was already confirmed on ${d.return_received_at.toISOString().slice(0, 10)}; the refund ${d.state === "closed" ? "has been paid" : "is being paid"}`
    : "The buyer has not recorded a return shipment yet";
  return new ApiError("conflict", message, undefined, undefined, {
    state: d.state,
    returnReceivedAt: d.return_received_at?.toISOString() ?? null,
  });
}

/**
 * The dispute sweeper (every instance runs it; each step is guarded):
 * resume decisions whose money movement was interrupted, refund returns the
 * consignor has not confirmed in time, and release lots the buyer did not
 * send back by the return deadline.
 */
export async function disputeSweep(): Promise<number> {
  let n = 0;
  const stuck = await q<{ id: string }>(
    `SELECT id FROM disputes WHERE state = 'settling' AND updated_at < now() - interval '30 seconds' LIMIT 20`,
  );
  for (const s of stuck) {
    await settleDecision(s.id).catch((e: Error) => console.error("[disputes] resume failed", e.message));
    n++;
  }
  const unconfirmed = await q<DisputeRow>(
    `SELECT * FROM disputes WHERE state = 'awaiting-return' AND return_shipped_at IS NOT NULL
      AND return_shipped_at + (:days || ' days')::interval <= now() LIMIT 20`,
    { days: String(DISPUTE_SETTINGS.receiptConfirmDays) },
  );
  for (const d of unconfirmed) {
    await refundReturnedLot(d, "receipt was not confirmed in time").catch((e: Error) =>
      console.error("[disputes] refund failed", e.message),
    );
    n++;
  }
  const notReturned = await q<DisputeRow>(
    `SELECT * FROM disputes WHERE state = 'awaiting-return' AND return_shipped_at IS NULL AND return_due_at <= now() LIMIT 20`,
  );
  for (const d of notReturned) {
    await release(d.invoice_id, `claim ${d.number}: the lot was not returned in time`, { fromDispute: true }).catch(
      (e: Error) => console.error("[disputes] release failed", e.message),
    );
    if (
      await closeCase(
        d,
        "awaiting-return",
        "the buyer did not ship the lot back by the return deadline; payment released to the consignor",
      )
    )
      n++;
  }
  return n;
}
