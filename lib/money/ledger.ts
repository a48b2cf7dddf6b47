/**
 * Double-entry bookkeeping for a lot's money, from invoice to payout.
 * Each builder returns one balanced set of entries (debits = credits).
 * Flow [SUG]: invoice issued → payment captured into escrow → (refunds
 * while held) → escrow released → payout sent → (refunds after release).
 * Premium and commission are recognised as house revenue only on release,
 * so a refund while funds are held simply returns escrowed money.
 */
import { assertCents } from "./cents";
import type { InvoiceBreakdown } from "./fees";
import type { RefundSettlement } from "./refunds";

/** The ledger's accounts (our own chart). */
export const ACCOUNTS = [
  "cash", // asset: the house's bank and processor balance
  "buyer-receivable", // asset: invoiced, not yet paid
  "awaiting-payment", // clearing: invoiced hammer + premium not yet paid into escrow
  "escrow-held", // liability: buyer money held until inspection ends
  "consignor-payable", // liability: owed to consignors (debit balance = consignor owes)
  "shipping-payable", // liability: shipping collected for the carrier
  "tax-payable", // liability: sales tax collected
  "house-revenue-premium", // revenue: buyer's premium
  "house-revenue-commission", // revenue: seller's commission
  "house-revenue-fees", // revenue: lot and other consignor fees
  "processor-fees", // expense: card/payment processor charges
  "refunds-paid", // contra-revenue: premium and commission given back after release
  "unexpected-charges-payable", // liability: a charge the buyer did not owe (a second payment), until refunded
] as const;

/** One of {@link ACCOUNTS}. */
export type AccountName = (typeof ACCOUNTS)[number];

/** One side of a posting: a positive whole number of cents debited or credited to an account. */
export type LedgerEntry =
  | { account: AccountName; debitCents: number; creditCents?: undefined }
  | { account: AccountName; creditCents: number; debitCents?: undefined };

/**
 * Throws unless the set is non-empty, every entry is exactly one positive
 * safe-integer debit or credit, and debits equal credits. Returns the total.
 */
export function assertBalanced(entries: readonly LedgerEntry[]): number {
  if (entries.length === 0) throw new RangeError("an entry set must not be empty");
  let debits = 0;
  let credits = 0;
  for (const entry of entries) {
    const hasDebit = entry.debitCents !== undefined;
    const hasCredit = entry.creditCents !== undefined;
    if (hasDebit === hasCredit) throw new RangeError(`${entry.account}: give exactly one of debit or credit`);
    const amount = assertCents((entry.debitCents ?? entry.creditCents) as number, entry.account);
    if (amount === 0) throw new RangeError(`${entry.account}: zero entries are not posted`);
    if (hasDebit) debits += amount;
    else credits += amount;
  }
  if (debits !== credits) throw new RangeError(`unbalanced: debits ${debits} ≠ credits ${credits}`);
  return debits;
}

/** Builds entries from signed amounts (positive = debit, negative = credit), drops zeros, and checks balance. */
export function entriesFrom(amounts: ReadonlyArray<readonly [AccountName, number]>): LedgerEntry[] {
  const entries: LedgerEntry[] = [];
  for (const [account, signed] of amounts) {
    assertCents(signed, account, { allowNegative: true });
    if (signed > 0) entries.push({ account, debitCents: signed });
    else if (signed < 0) entries.push({ account, creditCents: -signed });
  }
  assertBalanced(entries);
  return entries;
}

/** Net debit balance (debits − credits) per account over any number of entry sets; untouched accounts are 0. */
export function accountBalances(sets: ReadonlyArray<readonly LedgerEntry[]>): Record<AccountName, number> {
  const balances = Object.fromEntries(ACCOUNTS.map((a) => [a, 0])) as Record<AccountName, number>;
  for (const entries of sets) {
    for (const e of entries) balances[e.account] += (e.debitCents ?? 0) - (e.creditCents ?? 0);
  }
  return balances;
}

/** Invoice issued: the buyer owes the total; hammer + premium await payment, shipping and tax are owed onward. */
export function invoiceIssuedEntries(invoice: InvoiceBreakdown): LedgerEntry[] {
  return entriesFrom([
    ["buyer-receivable", invoice.totalCents],
    ["awaiting-payment", -(invoice.hammerCents + invoice.premiumCents)],
    ["shipping-payable", -invoice.shippingCents],
    ["tax-payable", -invoice.taxCents],
  ]);
}

/**
 * Payment captured into escrow: the full invoice total is received (less the
 * processor's fee, a house expense) and hammer + premium move into escrow.
 */
export function paymentCapturedEntries(invoice: InvoiceBreakdown, processorFeeCents = 0): LedgerEntry[] {
  const fee = assertCents(processorFeeCents, "processorFeeCents");
  const held = invoice.hammerCents + invoice.premiumCents;
  return entriesFrom([
    ["cash", invoice.totalCents - fee],
    ["processor-fees", fee],
    ["buyer-receivable", -invoice.totalCents],
    ["awaiting-payment", held],
    ["escrow-held", -held],
  ]);
}

/**
 * Escrow released for what remains of a sale (see figuresAfterRefunds):
 * hammer − commission − fees becomes payable to the consignor, commission,
 * fees and premium become house revenue.
 */
export function escrowReleasedEntries(release: {
  hammerCents: number;
  premiumCents: number;
  commissionCents: number;
  feesCents?: number;
}): LedgerEntry[] {
  assertCents(release.hammerCents, "hammerCents");
  assertCents(release.premiumCents, "premiumCents");
  assertCents(release.commissionCents, "commissionCents");
  const fees = assertCents(release.feesCents ?? 0, "feesCents");
  return entriesFrom([
    ["escrow-held", release.hammerCents + release.premiumCents],
    ["consignor-payable", -(release.hammerCents - release.commissionCents - fees)],
    ["house-revenue-commission", -release.commissionCents],
    ["house-revenue-fees", -fees],
    ["house-revenue-premium", -release.premiumCents],
  ]);
}

/** Payout sent to the consignor. */
export function payoutSentEntries(payoutCents: number): LedgerEntry[] {
  return entriesFrom([
    ["consignor-payable", assertCents(payoutCents, "payoutCents")],
    ["cash", -payoutCents],
  ]);
}

/**
 * A refund paid to the buyer (partial or whole lot). While funds are held
 * ("held") it comes straight out of escrow; after release ("released") the
 * consignor's share is charged to consignor-payable and the house's share
 * (premium + commission given back) to refunds-paid.
 */
export function refundEntries(refund: RefundSettlement, phase: "held" | "released"): LedgerEntry[] {
  if (phase === "held") {
    return entriesFrom([
      ["escrow-held", refund.buyerRefundCents],
      ["cash", -refund.buyerRefundCents],
    ]);
  }
  return entriesFrom([
    ["consignor-payable", -refund.consignorChangeCents],
    ["refunds-paid", -refund.houseChangeCents],
    ["cash", -refund.buyerRefundCents],
  ]);
}

/**
 * A charge the buyer did not owe (a second payment for one invoice, or one of the wrong amount) arrived:
 * the cash is in, less the processor's fee, and the whole amount is owed back to the buyer.
 */
export function unexpectedChargeReceivedEntries(amountCents: number, processorFeeCents: number): LedgerEntry[] {
  const amount = assertCents(amountCents, "amountCents");
  const fee = assertCents(processorFeeCents, "processorFeeCents");
  return entriesFrom([
    ["cash", amount - fee],
    ["processor-fees", fee],
    ["unexpected-charges-payable", -amount],
  ]);
}

/** That charge refunded in full: the debt to the buyer is paid. The processor keeps its fee, a house expense. */
export function unexpectedChargeRefundedEntries(amountCents: number): LedgerEntry[] {
  const amount = assertCents(amountCents, "amountCents");
  return entriesFrom([
    ["unexpected-charges-payable", amount],
    ["cash", -amount],
  ]);
}
