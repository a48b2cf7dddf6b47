import type Stripe from "stripe";
import { db } from "../../models";
import { recordPaymentFailed, recordPaymentSucceeded } from "./payments";

/**
 * Handle one verified processor event once: its id is recorded in the same
 * breath as it is handled, so a redelivery changes nothing; handlers only
 * move states forward, so events arriving out of order are harmless.
 */
export async function handleStripeEvent(event: Stripe.Event): Promise<"handled" | "duplicate" | "ignored"> {
  const [rows] = (await db().query(
    `INSERT INTO payment_events (event_id, type, received_at) VALUES (:id, :type, now()) ON CONFLICT (event_id) DO NOTHING RETURNING event_id`,
    { replacements: { id: event.id, type: event.type } },
  )) as [unknown[], unknown];
  if (!rows.length) return "duplicate";
  try {
    switch (event.type) {
      case "payment_intent.succeeded":
        await recordPaymentSucceeded(event.data.object as Stripe.PaymentIntent);
        return "handled";
      case "payment_intent.payment_failed":
        await recordPaymentFailed(event.data.object as Stripe.PaymentIntent);
        return "handled";
      default:
        return "ignored";
    }
  } catch (e) {
    // Let the processor retry: forget that we saw it.
    await db().query(`DELETE FROM payment_events WHERE event_id = :id`, { replacements: { id: event.id } });
    throw e;
  }
}
