import { randomUUID } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import { unexpectedChargeReceivedEntries, unexpectedChargeRefundedEntries } from "../money/ledger";
import { UNEXPECTED_WHY_WORDS, type UnexpectedWhy } from "../money/unexpected";
import { stripe } from "../stripe/client";
import { db } from "../../models";
import { post } from "./ledger";
import { notify } from "./notices";

/**
 * Defence in depth: a successful charge an invoice does not owe. One payment intent per invoice makes a
 * second charge impossible through our own pay path; should one arrive all the same (another integration,
 * an intent made before that rule, a wrong amount), it is recorded here, posted, refunded in full through
 * the processor with a key tied to the charge, and the house and the buyer are told.
 */
export type UnexpectedCharge = {
  id: string;
  invoiceId: string;
  invoiceNumber: string;
  paymentIntentId: string;
  chargeId: string | null;
  amountCents: number;
  feeCents: number;
  why: UnexpectedWhy;
  state: "refund-due" | "refunded";
  refundId: string | null;
  lastError: string | null;
  detectedAt: string;
  refundedAt: string | null;
};

type Row = {
  id: string;
  invoice_id: string;
  number: string;
  buyer_id: string;
  payment_intent_id: string;
  charge_id: string | null;
  amount_cents: number;
  fee_cents: number;
  why: UnexpectedWhy;
  state: "refund-due" | "refunded";
  refund_id: string | null;
  last_error: string | null;
  detected_at: Date;
  refunded_at: Date | null;
};

const SELECT_ROWS = `SELECT u.id, u.invoice_id, u.payment_intent_id, u.charge_id, u.amount_cents, u.fee_cents, u.why, u.state, u.refund_id, u.last_error,
       u.detected_at, u.refunded_at, i.number, i.buyer_id FROM unexpected_charges u JOIN invoices i ON i.id = u.invoice_id`;

/** Record the charge and post it, inside the caller's transaction. Returns false when it was recorded already. */
export async function recordUnexpectedCharge(
  t: Transaction,
  c: {
    invoiceId: string;
    paymentIntentId: string;
    chargeId: string | null;
    amountCents: number;
    feeCents: number;
    why: UnexpectedWhy;
  },
): Promise<boolean> {
  const [row] = await db().query<{ id: string }>(
    `INSERT INTO unexpected_charges (id, invoice_id, payment_intent_id, charge_id, amount_cents, fee_cents, why, state, detected_at)
     VALUES (:id, :invoiceId, :paymentIntentId, :chargeId, :amountCents, :feeCents, :why, 'refund-due', now())
     ON CONFLICT (payment_intent_id) DO NOTHING RETURNING id`,
    { replacements: { id: randomUUID(), ...c }, type: QueryTypes.SELECT, transaction: t },
  );
  if (!row) return false;
  await post(
    t,
    `unexpected-charge:${c.paymentIntentId}`,
    c.invoiceId,
    unexpectedChargeReceivedEntries(c.amountCents, c.feeCents),
    c.paymentIntentId,
  );
  return true;
}

/**
 * Refund an unexpected charge in full, once: the processor call carries a key tied to the charge, the
 * posting is once per charge, and the state moves under the row's lock. The buyer and the house are told
 * when it is done. Returns true when this call completed the refund.
 */
export async function refundUnexpectedCharge(paymentIntentId: string): Promise<boolean> {
  const [u] = await db().query<Row>(`${SELECT_ROWS} WHERE u.payment_intent_id = :paymentIntentId`, {
    replacements: { paymentIntentId },
    type: QueryTypes.SELECT,
  });
  if (!u || u.state !== "refund-due") return false;
  let refundId: string;
  try {
    const refund = await stripe().refunds.create(
      {
        payment_intent: paymentIntentId,
        amount: u.amount_cents,
        reason: "duplicate",
        metadata: { invoice_id: u.invoice_id, unexpected_charge_id: u.id },
      },
      { idempotencyKey: `unexpected-charge:${paymentIntentId}:refund` },
    );
    refundId = refund.id;
  } catch (e) {
    await db().query(`UPDATE unexpected_charges SET last_error = :msg WHERE id = :id`, {
      replacements: { msg: (e as Error).message.slice(0, 300), id: u.id },
    });
    throw e;
  }
  const done = await db().transaction(async (t) => {
    const [locked] = await db().query<{ state: string }>(
      `SELECT state FROM unexpected_charges WHERE id = :id FOR UPDATE`,
      { replacements: { id: u.id }, type: QueryTypes.SELECT, transaction: t },
    );
    if (locked?.state !== "refund-due") return false;
    await post(
      t,
      `unexpected-refund:${paymentIntentId}`,
      u.invoice_id,
      unexpectedChargeRefundedEntries(u.amount_cents),
      refundId,
    );
    await db().query(
      `UPDATE unexpected_charges SET state = 'refunded', refund_id = :refundId, refunded_at = now(), last_error = NULL WHERE id = :id`,
      { replacements: { refundId, id: u.id }, transaction: t },
    );
    return true;
  });
  if (done)
    await tellParties(u).catch((e: Error) => console.error("[payments] notice of a refunded charge failed", e.message));
  return done;
}

async function tellParties(u: Row): Promise<void> {
  const amount = formatCents(u.amount_cents);
  const invoiceUrl = `/invoices/${u.invoice_id}`;
  const buyerText = `A payment of ${amount} for invoice ${u.number} was not owed (${UNEXPECTED_WHY_WORDS[u.why]}). It has been refunded to your card in full; your bank may take a few days to show it.`;
  await notify(u.buyer_id, buyerText, invoiceUrl);
  const [buyer] = await db().query<{ email: string; display_name: string }>(
    `SELECT email, display_name FROM users WHERE id = :id`,
    { replacements: { id: u.buyer_id }, type: QueryTypes.SELECT },
  );
  if (buyer)
    await sendMail({
      to: buyer.email,
      subject: `Refunded: a payment of ${amount} for invoice ${u.number} that was not owed`,
      text: `Hello ${buyer.display_name},\n\n${buyerText}\n\nThe invoice: ${env().NEXTAUTH_URL}${invoiceUrl}\n\nGetterline Exchange`,
    });
  const house = await db().query<{ id: string; email: string }>(
    `SELECT id, email FROM users WHERE 'admin' = ANY(roles) AND disabled_at IS NULL`,
    { type: QueryTypes.SELECT },
  );
  const houseText = `Unexpected charge refunded: ${amount} on invoice ${u.number} (${UNEXPECTED_WHY_WORDS[u.why]}), payment ${u.payment_intent_id}. The processor's fee of ${formatCents(u.fee_cents)} is not returned.`;
  for (const h of house) {
    await notify(h.id, houseText, "/house/finance");
    await sendMail({
      to: h.email,
      subject: `Unexpected charge refunded on invoice ${u.number}`,
      text: `${houseText}\n\nFinance: ${env().NEXTAUTH_URL}/house/finance\n\nGetterline`,
    });
  }
}

/** Retry refunds that did not go through at once (the processor was unreachable). */
export async function refundDueUnexpectedCharges(): Promise<number> {
  const due = await db().query<{ payment_intent_id: string }>(
    `SELECT payment_intent_id FROM unexpected_charges WHERE state = 'refund-due' AND detected_at < now() - interval '20 seconds' LIMIT 20`,
    { type: QueryTypes.SELECT },
  );
  let n = 0;
  for (const d of due) if (await refundUnexpectedCharge(d.payment_intent_id).catch(() => false)) n++;
  return n;
}

/** Every unexpected charge, newest first, for the finance page. */
export async function listUnexpectedCharges(limit = 100): Promise<UnexpectedCharge[]> {
  const rows = await db().query<Row>(`${SELECT_ROWS} ORDER BY u.detected_at DESC LIMIT :limit`, {
    replacements: { limit },
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => ({
    id: r.id,
    invoiceId: r.invoice_id,
    invoiceNumber: r.number,
    paymentIntentId: r.payment_intent_id,
    chargeId: r.charge_id,
    amountCents: r.amount_cents,
    feeCents: r.fee_cents,
    why: r.why,
    state: r.state,
    refundId: r.refund_id,
    lastError: r.last_error,
    detectedAt: r.detected_at.toISOString(),
    refundedAt: r.refunded_at?.toISOString() ?? null,
  }));
}
