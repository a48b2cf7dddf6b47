/**
 * Ledger accounts named in words for people: the finance page and statements show these, never the code.
 * Our own wording [SUG]; the codes stay the ledger's keys (lib/money/ledger.ts).
 */
import type { AccountName } from "./ledger";

export const ACCOUNT_WORDS: Readonly<Record<AccountName, string>> = {
  cash: "Cash at the bank and processor",
  "buyer-receivable": "Owed by buyers (invoiced, unpaid)",
  "awaiting-payment": "Invoiced, awaiting payment",
  "escrow-held": "Held in escrow for buyers",
  "consignor-payable": "Owed to consignors",
  "shipping-payable": "Shipping collected for carriers",
  "tax-payable": "Sales tax collected",
  "house-revenue-premium": "House income: buyer's premium",
  "house-revenue-commission": "House income: seller's commission",
  "house-revenue-fees": "House income: consignor fees",
  "processor-fees": "Payment processor fees",
  "refunds-paid": "Premium and commission given back",
  "unexpected-charges-payable": "Charges not owed, to refund",
};

/**
 * Words for an account code; a code we have no words for yet (a newer account) reads as its code with
 * spaces, capitalised, so nothing shows blank.
 */
export function accountWords(code: string): string {
  const known = (ACCOUNT_WORDS as Record<string, string>)[code];
  if (known) return known;
  const spaced = code.replace(/-/g, " ").trim();
  return spaced ? spaced[0]!.toUpperCase() + spaced.slice(1) : code;
}
