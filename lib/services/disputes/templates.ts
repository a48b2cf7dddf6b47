/**
 * Every e-mail and notice a claim sends, worded in one place. Each template
 * takes plain facts and returns the subject and body (or the notice's text);
 * ./mail.ts adds the greeting and sends.
 */
import { env } from "../../config/env";
import { OUTCOME_WORDS, REASON_WORDS, REMEDY_WORDS, STANCE_WORDS } from "../../disputes/rules";
import type { DisputeReason, Outcome, Remedy, Stance } from "../../disputes/rules";
import { formatCents } from "../../money/cents";
import type { StoredSettlement } from "./tables/disputes";

/** An e-mail's subject and body (without greeting and signature). */
export type Letter = { subject: string; body: string };

/** The case page, absolute, for e-mails. */
export const caseUrl = (id: string) => `${env().NEXTAUTH_URL}/disputes/${id}`;
/** The case page, relative, for notices. */
export const casePath = (id: string) => `/disputes/${id}`;
/** A time in e-mails: minutes, UTC, named. */
export const utc = (d: Date) => `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;

type Opened = { id: string; number: string; invoiceNumber: string; due: Date };

/** The notice to the consignor when a claim is opened. */
export const openedNotice = (c: Opened) => `Claim ${c.number} on invoice ${c.invoiceNumber}: answer by ${utc(c.due)}`;

/** To the consignor: a buyer has opened a claim. */
export const openedToConsignor = (
  c: Opened & { reason: DisputeReason; remedy: Remedy; lines: number; tubes: number },
): Letter => ({
  subject: `A buyer has opened a claim (${c.number})`,
  body: `The buyer of invoice ${c.invoiceNumber} says the lot is not as listed: ${REASON_WORDS[c.reason]}, on ${c.lines} line(s) and ${c.tubes} tube(s). They ask for: ${REMEDY_WORDS[c.remedy]}.\n\nPayment for the lot stays held while the claim is open. Please answer by ${utc(c.due)}; after that a mediator decides on the buyer's evidence.\n\nRead the claim and answer: ${caseUrl(c.id)}`,
});

/** To the buyer: their claim is open. */
export const openedToBuyer = (c: Opened): Letter => ({
  subject: `Your claim ${c.number} is open`,
  body: `We have told the consignor and are holding the payment. They have until ${utc(c.due)} to answer; a mediator then compares the evidence and decides. Add photos and messages at ${caseUrl(c.id)}.`,
});

/** The notice of a new message. */
export const messageNotice = (number: string, answered: boolean) =>
  `New message in claim ${number}${answered ? ": the consignor has answered" : ""}`;

/** To the buyer: the consignor has answered. */
export const answeredToBuyer = (c: { id: string; number: string; stance: Stance }): Letter => ({
  subject: `The consignor has answered your claim ${c.number}`,
  body: `Their answer: ${STANCE_WORDS[c.stance]}. A mediator will compare the evidence and decide. Read it at ${caseUrl(c.id)}.`,
});

/** The notice to the buyer that the undisputed share was paid out. */
export const undisputedReleasedNotice = (number: string) =>
  `Claim ${number}: the share of the lot the claim does not cover has been paid to the consignor; the rest stays held`;

/** What happens next after a refund-on-return decision. */
export const returnNext = (due: Date, receiptConfirmDays: number) =>
  `Ship the whole lot back by ${utc(due)} and enter the carrier and tracking number on the case page. The refund of the hammer price and premium is paid when the consignor confirms receipt, or ${receiptConfirmDays} days after the return ships if they do not.`;

/** What happens next after a dismissal or a partial refund. */
export const settledNext = (outcome: Outcome, buyerRefundCents: number | null) =>
  outcome === "dismissed"
    ? "The payment for the lot has been released to the consignor."
    : `The buyer is refunded ${formatCents(buyerRefundCents ?? 0)} to the card used; the rest of the payment has been released to the consignor.`;

type Decided = {
  id: string;
  number: string;
  invoiceNumber: string;
  reason: DisputeReason;
  outcome: Outcome;
  reasons: string;
  mediatorName: string | null;
  decidedAt: Date;
  settlement: StoredSettlement | undefined;
  next: string;
};

const decisionHead = (c: Decided) =>
  `Decision on claim ${c.number} (invoice ${c.invoiceNumber}, ${REASON_WORDS[c.reason]}): ${OUTCOME_WORDS[c.outcome]}.\nDecided by ${c.mediatorName ?? "a mediator"} on ${utc(c.decidedAt)}.\n\nReasons:\n${c.reasons}\n`;

/** To the buyer: the written decision. */
export const decisionToBuyer = (c: Decided): Letter => {
  const s = c.settlement;
  const money = s
    ? `\nRefund to you: ${formatCents(s.buyerRefundCents)} (hammer ${formatCents(s.hammerRefundCents)} + buyer's premium ${formatCents(s.premiumRefundCents)}).\n`
    : "";
  return {
    subject: `Decision on your claim ${c.number}`,
    body: `${decisionHead(c)}${money}\n${c.next}\n\nThe case: ${caseUrl(c.id)}`,
  };
};

/** To the consignor: the written decision. */
export const decisionToConsignor = (c: Decided): Letter => {
  const s = c.settlement;
  const money = s
    ? `\nYour payout changes by ${formatCents(s.consignorChangeCents)}: the hammer refunded (${formatCents(s.hammerRefundCents)}) less the commission the house gives back (${formatCents(s.commissionReductionCents)}).\n`
    : "";
  return {
    subject: `Decision on claim ${c.number}`,
    body: `${decisionHead(c)}${money}\n${c.next}\n\nThe case: ${caseUrl(c.id)}`,
  };
};

/** The notice to both parties of a decision. */
export const decidedNotice = (number: string, outcome: Outcome) => `Claim ${number} decided: ${OUTCOME_WORDS[outcome]}`;

type Shipped = { id: string; number: string; carrier: string; tracking: string };

/** The notice to the consignor that the lot is coming back. */
export const returnShippedNotice = (c: Shipped) =>
  `Claim ${c.number}: the lot is on its way back (${c.carrier} ${c.tracking})`;

/** To the consignor: the lot is coming back. */
export const returnShippedToConsignor = (c: Shipped & { receiptConfirmDays: number }): Letter => ({
  subject: `The lot of claim ${c.number} is on its way back`,
  body: `The buyer has shipped the lot back with ${c.carrier}, tracking ${c.tracking}. Confirm receipt on the case page when it arrives: ${caseUrl(c.id)}. If you do not, the buyer is refunded ${c.receiptConfirmDays} days after shipment.`,
});

type Refunded = { id: string; number: string; why: string; buyerRefundCents: number };

/** To the buyer: the returned lot is refunded. */
export const returnRefundedToBuyer = (c: Refunded): Letter => ({
  subject: `Claim ${c.number} closed: refund paid`,
  body: `The returned lot is settled (${c.why}): ${formatCents(c.buyerRefundCents)} is refunded to your card.\n\nThe case: ${caseUrl(c.id)}`,
});

/** To the consignor: the returned lot is refunded. */
export const returnRefundedToConsignor = (c: Refunded): Letter => ({
  subject: `Claim ${c.number} closed: refund paid`,
  body: `The returned lot is settled (${c.why}): the buyer is refunded ${formatCents(c.buyerRefundCents)}; no payout is due on this lot, and no commission is charged.\n\nThe case: ${caseUrl(c.id)}`,
});
