/**
 * The states of an invoice and of the money it holds in escrow, with the
 * moves allowed between them [SUG: our own product rules]. The database keeps
 * the same list in the `invoices_state` CHECK constraint; services move an
 * invoice only along INVOICE_TRANSITIONS, with a guarded update or under the
 * invoice's row lock.
 */

/** Every invoice state, in the order a sale usually passes through them. */
export const INVOICE_STATES = [
  "awaiting-payment",
  "paid-held",
  "shipped",
  "delivered",
  "disputed",
  "released",
  "refunded",
  "cancelled",
] as const;

export type InvoiceState = (typeof INVOICE_STATES)[number];

/**
 * Where each state may go next. Payment arrives only by a verified webhook;
 * an unpaid invoice may be cancelled for a second-chance offer; a claim is
 * opened only on a delivered lot; a claim ends in a release (dismissed,
 * partly refunded) or a full refund.
 */
export const INVOICE_TRANSITIONS: Readonly<Record<InvoiceState, readonly InvoiceState[]>> = {
  "awaiting-payment": ["paid-held", "cancelled"],
  "paid-held": ["shipped"],
  shipped: ["delivered"],
  delivered: ["released", "disputed"],
  disputed: ["released", "refunded"],
  released: [],
  refunded: [],
  cancelled: [],
};

/** Whether a string is one of our invoice states (for rows read as text). */
export function isInvoiceState(s: string): s is InvoiceState {
  return (INVOICE_STATES as readonly string[]).includes(s);
}

/** Whether an invoice may move from one state to another. */
export function canMoveInvoice(from: InvoiceState, to: InvoiceState): boolean {
  return INVOICE_TRANSITIONS[from].includes(to);
}

/** States after which nothing more happens to the invoice. */
export function isFinalInvoiceState(s: InvoiceState): boolean {
  return INVOICE_TRANSITIONS[s].length === 0;
}

/**
 * What the house holds for the buyer's payment: nothing yet (or never),
 * held, held under a claim (frozen until a decision), paid out to the
 * consignor, or handed back to the buyer.
 */
export const ESCROW_STATES = ["none", "held", "frozen", "paid-out", "returned"] as const;

export type EscrowState = (typeof ESCROW_STATES)[number];

/** The escrow state that goes with each invoice state. */
export const ESCROW_STATE_OF: Readonly<Record<InvoiceState, EscrowState>> = {
  "awaiting-payment": "none",
  cancelled: "none",
  "paid-held": "held",
  shipped: "held",
  delivered: "held",
  disputed: "frozen",
  released: "paid-out",
  refunded: "returned",
};

/** Where held money may go next: only forward, never back to "none". */
export const ESCROW_TRANSITIONS: Readonly<Record<EscrowState, readonly EscrowState[]>> = {
  none: ["held"],
  held: ["frozen", "paid-out"],
  frozen: ["paid-out", "returned"],
  "paid-out": [],
  returned: [],
};

/** Whether escrow may move from one state to another. */
export function canMoveEscrow(from: EscrowState, to: EscrowState): boolean {
  return ESCROW_TRANSITIONS[from].includes(to);
}

/** Whether the payment is in the house's hands (it may neither be charged again nor simply cancelled). */
export function holdsMoney(s: InvoiceState): boolean {
  const e = ESCROW_STATE_OF[s];
  return e === "held" || e === "frozen";
}
