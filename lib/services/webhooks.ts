import { QueryTypes } from "sequelize";
import { db } from "../../models";
import { OurPaymentMetadataSchema, ProcessorEventSchema, ProcessorIntentSchema } from "../validation/payments";
import { recordPaymentFailed, recordPaymentSucceeded, type EventOutcome } from "./payment-events";

const ignored = (reason: string): EventOutcome => ({ outcome: "ignored", reason });

/**
 * What one verified event means to us. Its signature proves it came from the processor, not that it is
 * ours: every field we use is parsed, and an event that is not ours (another integration on the same
 * account, an invoice we do not have, a type we do not act on) is ignored with the reason.
 */
async function dispatch(type: string, object: Record<string, unknown>): Promise<EventOutcome> {
  if (type !== "payment_intent.succeeded" && type !== "payment_intent.payment_failed")
    return ignored(`we do not act on ${type} events`);
  const pi = ProcessorIntentSchema.safeParse(object);
  if (!pi.success)
    return ignored(
      `the payment in the event could not be read: ${pi.error.issues[0]?.path.join(".")} ${pi.error.issues[0]?.message}`,
    );
  const ours = OurPaymentMetadataSchema.safeParse(pi.data.metadata);
  if (!ours.success) {
    const named = pi.data.metadata.invoice_id;
    return ignored(
      named === undefined
        ? "not ours: the payment names no invoice"
        : `not ours: invoice_id ${JSON.stringify(named.slice(0, 80))} is not one of our invoice ids`,
    );
  }
  return type === "payment_intent.succeeded"
    ? recordPaymentSucceeded(pi.data, ours.data.invoice_id)
    : recordPaymentFailed(pi.data, ours.data.invoice_id);
}

/**
 * Handle one verified processor event once. Its id is recorded before it is handled, so a redelivery
 * changes nothing; what we did with it (handled, or ignored and why) is kept for audit. Handlers only
 * move states forward, so events arriving out of order are harmless. Only a failure of our own (the
 * database) lets the processor retry: the row is forgotten and the error goes up.
 */
export async function handleStripeEvent(raw: unknown): Promise<"handled" | "duplicate" | "ignored"> {
  const event = ProcessorEventSchema.safeParse(raw);
  if (!event.success) {
    console.warn(
      `[webhook] ignored an event we cannot read: ${event.error.issues[0]?.path.join(".")} ${event.error.issues[0]?.message}`,
    );
    return "ignored";
  }
  const { id, type, data } = event.data;
  const objectId = typeof data.object.id === "string" ? data.object.id.slice(0, 64) : null;
  const [rows] = (await db().query(
    `INSERT INTO payment_events (event_id, type, outcome, object_id, received_at) VALUES (:id, :type, 'processing', :objectId, now()) ON CONFLICT (event_id) DO NOTHING RETURNING event_id`,
    { replacements: { id, type, objectId } },
  )) as [unknown[], unknown];
  if (!rows.length) return "duplicate";
  try {
    const result = await dispatch(type, data.object);
    await db().query(`UPDATE payment_events SET outcome = :outcome, reason = :reason WHERE event_id = :id`, {
      replacements: { outcome: result.outcome, reason: result.reason?.slice(0, 300) ?? null, id },
    });
    return result.outcome;
  } catch (e) {
    await db()
      .query(`DELETE FROM payment_events WHERE event_id = :id`, { replacements: { id } })
      .catch(() => undefined);
    throw e;
  }
}

export type StoredEvent = {
  eventId: string;
  type: string;
  outcome: string;
  reason: string | null;
  objectId: string | null;
  receivedAt: string;
};

/** The latest payment events we set aside (not ours, or unreadable), with the reason (finance page). */
export async function recentIgnoredEvents(limit = 20): Promise<StoredEvent[]> {
  const rows = await db().query<{
    event_id: string;
    type: string;
    outcome: string;
    reason: string | null;
    object_id: string | null;
    received_at: Date;
  }>(
    `SELECT event_id, type, outcome, reason, object_id, received_at FROM payment_events WHERE outcome = 'ignored' AND type LIKE 'payment_intent.%' ORDER BY received_at DESC LIMIT :limit`,
    { replacements: { limit }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    eventId: r.event_id,
    type: r.type,
    outcome: r.outcome,
    reason: r.reason,
    objectId: r.object_id,
    receivedAt: r.received_at.toISOString(),
  }));
}
