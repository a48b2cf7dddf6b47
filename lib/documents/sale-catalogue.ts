/** A sale's printed catalogue: every lot in order with what it holds and the figures shown publicly. */
import { formatCents } from "../money/cents";
import { facts, heading, para, paperTime, renderPdf, table } from "./layout";

export type SaleCatalogueDoc = {
  title: string;
  startsAt: string;
  preparedAt: string;
  lots: {
    position: number;
    title: string;
    tubes: number;
    /** e.g. "4 x 12AX7, 2 x EL34". */
    contents: string;
    estimate: { lowCents: number; highCents: number } | null;
    openingCents: number;
    closesAt: string;
    outcome: string;
  }[];
};

export function saleCataloguePdf(c: SaleCatalogueDoc): Promise<Buffer> {
  return renderPdf({ title: `Sale catalogue: ${c.title}`, subtitle: `Opens ${paperTime(c.startsAt)}` }, (doc) => {
    facts(doc, [
      ["Lots", String(c.lots.length)],
      ["Tubes", String(c.lots.reduce((n, l) => n + l.tubes, 0))],
      ["Prepared", paperTime(c.preparedAt)],
    ]);
    heading(doc, "Lots");
    table(
      doc,
      [
        { label: "No.", width: 0.4 },
        { label: "Lot", width: 2.2 },
        { label: "Contents", width: 2.2 },
        { label: "Estimate", width: 1.4, align: "right" },
        { label: "Opens at", width: 0.9, align: "right" },
        { label: "Closes (UTC)", width: 1.3, align: "right" },
      ],
      c.lots.map((l) => ({
        cells: [
          String(l.position),
          l.outcome ? `${l.title} (${l.outcome})` : l.title,
          `${l.tubes} tube${l.tubes === 1 ? "" : "s"}: ${l.contents}`,
          l.estimate ? `${formatCents(l.estimate.lowCents)}-${formatCents(l.estimate.highCents)}` : "-",
          formatCents(l.openingCents),
          paperTime(l.closesAt),
        ],
      })),
    );
    para(
      doc,
      "Estimates are the house's guide from past sales, not a promise. A bid in a lot's last minutes extends that lot's close. Each lot's page carries its full evidence: readings, photos and attribution.",
      { size: 8.5 },
    );
  });
}
