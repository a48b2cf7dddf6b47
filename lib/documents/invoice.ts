/** The buyer's invoice as a PDF: what was bought, the money lines as the invoice row holds them, and the total. */
import { formatCents } from "../money/cents";
import { INVOICE_STATE_WORDS } from "../../components/invoices/words";
import { addresses, facts, heading, para, paperTime, renderPdf, table, type AddressBlock } from "./layout";

export type InvoiceDoc = {
  number: string;
  state: string;
  lotTitle: string;
  saleTitle: string;
  tubeCount: number;
  issuedAt: string;
  dueAt: string;
  paidAt: string | null;
  hammerCents: number;
  premiumBp: number;
  premiumCents: number;
  shippingCents: number;
  taxCents: number;
  totalCents: number;
  refundedCents: number;
  buyerName: string;
  /** Postal blocks per party, rendered only when present. */
  addresses: { buyer: AddressBlock; house: AddressBlock };
};

/** Basis points as a percentage without trailing zeros: 1000 → "10", 1250 → "12.5". */
const percent = (bp: number) => String(Number((bp / 100).toFixed(2)));

export function invoicePdf(inv: InvoiceDoc): Promise<Buffer> {
  return renderPdf({ title: `Invoice ${inv.number}`, subtitle: inv.lotTitle }, (doc) => {
    addresses(doc, [
      { caption: "From", block: inv.addresses.house },
      { caption: "Bill to", block: inv.addresses.buyer },
    ]);
    facts(doc, [
      ["Invoice", inv.number],
      ["Buyer", inv.buyerName],
      ["Sale", inv.saleTitle],
      ["Lot", `${inv.lotTitle} (${inv.tubeCount} tube${inv.tubeCount === 1 ? "" : "s"})`],
      ["Issued", paperTime(inv.issuedAt)],
      ["Due", paperTime(inv.dueAt)],
      ["State", INVOICE_STATE_WORDS[inv.state] ?? inv.state],
      ...(inv.paidAt ? ([["Paid", paperTime(inv.paidAt)]] as [string, string][]) : []),
    ]);
    heading(doc, "Amounts");
    table(
      doc,
      [
        { label: "Line", width: 3 },
        { label: "Amount", width: 1, align: "right" },
      ],
      [
        { cells: ["Hammer price", formatCents(inv.hammerCents)] },
        { cells: [`Buyer's premium (${percent(inv.premiumBp)} % of the hammer)`, formatCents(inv.premiumCents)] },
        { cells: ["Shipping", formatCents(inv.shippingCents)] },
        { cells: ["Tax", formatCents(inv.taxCents)] },
        { cells: ["Total due", formatCents(inv.totalCents)], bold: true },
      ],
    );
    if (inv.refundedCents > 0) para(doc, `Refunded to the buyer after a claim: ${formatCents(inv.refundedCents)}.`);
    doc.moveDown(0.5);
    para(
      doc,
      "The house holds the payment in escrow until the buyer has received and inspected the tubes; the consignor is paid when the inspection window ends without a claim.",
      { size: 8.5 },
    );
  });
}
