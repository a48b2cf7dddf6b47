/** A printable lot sheet: the evidence summary a dealer reads first, item by item, with the cautions. */
import { BASIS_WORDS, CONDITION_WORDS } from "../../components/lots/words";
import { formatCents } from "../money/cents";
import { cautions, facts, heading, para, paperTime, renderPdf, table } from "./layout";

export type LotSheetDoc = {
  lotId: string;
  title: string;
  provenance: string;
  shippingOrigin: string;
  preparedAt: string;
  estimate: { lowCents: number; highCents: number } | null;
  tubeCount: number;
  items: {
    designation: string;
    quantity: number;
    condition: string;
    basis: string;
    maker: string | null;
    codes: string;
    readings: number;
    vacuumLoss: boolean;
    checkType: boolean;
  }[];
  families: {
    label: string;
    tubes: number;
    tested: number;
    strong: number;
    good: number;
    fair: number;
    weak: number;
    reject: number;
    pairs: number;
    quads: number;
  }[];
  vacuumLossTubes: number;
  testedNotGraded: number;
  attribution: Record<string, number>;
  cautions: { title: string; text: string }[];
};

export function lotSheetPdf(s: LotSheetDoc): Promise<Buffer> {
  return renderPdf({ title: `Lot sheet: ${s.title}`, subtitle: `Lot ${s.lotId.slice(0, 8)}` }, (doc) => {
    facts(doc, [
      ["Tubes", String(s.tubeCount)],
      [
        "Estimate",
        s.estimate ? `${formatCents(s.estimate.lowCents)} to ${formatCents(s.estimate.highCents)}` : "Not set",
      ],
      ...(s.provenance ? ([["Provenance", s.provenance]] as [string, string][]) : []),
      ...(s.shippingOrigin ? ([["Ships from", s.shippingOrigin]] as [string, string][]) : []),
      ["Prepared", paperTime(s.preparedAt)],
    ]);
    heading(doc, "Items");
    table(
      doc,
      [
        { label: "Type", width: 1.3 },
        { label: "Qty", width: 0.5, align: "right" },
        { label: "Condition", width: 1.2 },
        { label: "Who made them", width: 2 },
        { label: "Codes", width: 1.2 },
        { label: "Readings", width: 0.8, align: "right" },
        { label: "Getter", width: 0.9 },
      ],
      s.items.map((i) => ({
        cells: [
          i.designation + (i.checkType ? " (check type)" : ""),
          String(i.quantity),
          CONDITION_WORDS[i.condition] ?? i.condition,
          `${BASIS_WORDS[i.basis] ?? i.basis}${i.maker ? `: ${i.maker}` : ""}`,
          i.codes || "-",
          String(i.readings),
          i.vacuumLoss ? "WHITE" : "silver",
        ],
      })),
    );
    heading(doc, "Test readings graded, by type family");
    table(
      doc,
      [
        { label: "Family", width: 2 },
        { label: "Tubes", width: 0.7, align: "right" },
        { label: "Tested", width: 0.7, align: "right" },
        { label: "Strong", width: 0.7, align: "right" },
        { label: "Good", width: 0.7, align: "right" },
        { label: "Fair", width: 0.7, align: "right" },
        { label: "Weak", width: 0.7, align: "right" },
        { label: "Reject", width: 0.7, align: "right" },
        { label: "Pairs / quads", width: 1, align: "right" },
      ],
      s.families.map((f) => ({
        cells: [
          f.label,
          ...[f.tubes, f.tested, f.strong, f.good, f.fair, f.weak, f.reject].map(String),
          `${f.pairs} / ${f.quads}`,
        ],
      })),
    );
    if (s.testedNotGraded)
      para(doc, `${s.testedNotGraded} tested tube(s) have no tester chart value to grade against.`);
    para(
      doc,
      s.vacuumLossTubes
        ? `Vacuum loss: ${s.vacuumLossTubes} tube(s) show a white getter (air has leaked in; the tube is dead).`
        : "Vacuum loss: no white getters declared.",
      { bold: s.vacuumLossTubes > 0 },
    );
    heading(doc, "Attribution evidence");
    table(
      doc,
      [
        { label: "Basis", width: 3 },
        { label: "Tubes", width: 1, align: "right" },
      ],
      Object.entries(BASIS_WORDS).map(([k, words]) => ({ cells: [words, String(s.attribution[k] ?? 0)] })),
    );
    cautions(doc, s.cautions);
  });
}
