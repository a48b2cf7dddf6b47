/** A packing slip for one invoice: what goes in the parcel, by type and count, with handling cautions. No prices. */
import { CONDITION_WORDS } from "../../components/lots/words";
import { addresses, cautions, facts, heading, para, paperTime, renderPdf, table, type AddressBlock } from "./layout";

export type PackingDoc = {
  invoiceNumber: string;
  lotTitle: string;
  saleTitle: string;
  buyerName: string;
  shipTo: AddressBlock;
  /** The house as sender: where the paperwork comes from and where questions about the parcel go. */
  from: AddressBlock;
  preparedAt: string;
  /** One line per type and condition, in the lot's order. */
  lines: { designation: string; condition: string; tubes: number }[];
  cautions: { title: string; text: string }[];
};

export function packingSlipPdf(p: PackingDoc): Promise<Buffer> {
  return renderPdf({ title: `Packing slip ${p.invoiceNumber}`, subtitle: p.lotTitle }, (doc) => {
    addresses(doc, [
      { caption: "From", block: p.from },
      { caption: "Ship to", block: p.shipTo },
    ]);
    facts(doc, [
      ["Invoice", p.invoiceNumber],
      ["Buyer", p.buyerName],
      ["Sale", p.saleTitle],
      ["Lot", p.lotTitle],
      ["Prepared", paperTime(p.preparedAt)],
    ]);
    heading(doc, "Contents");
    const total = p.lines.reduce((n, l) => n + l.tubes, 0);
    table(
      doc,
      [
        { label: "Type", width: 2 },
        { label: "Condition", width: 2 },
        { label: "Tubes", width: 1, align: "right" },
        { label: "Packed", width: 1, align: "right" },
      ],
      [
        ...p.lines.map((l) => ({
          cells: [l.designation, CONDITION_WORDS[l.condition] ?? l.condition, String(l.tubes), "[   ]"],
        })),
        { cells: ["Total", "", String(total), ""], bold: true },
      ],
    );
    para(doc, "Check each line off as it is packed. Pack each tube boxed or sleeved, no tube touching another.", {
      size: 8.5,
    });
    cautions(doc, p.cautions);
  });
}
