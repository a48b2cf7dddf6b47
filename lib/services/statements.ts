import PDFDocument from "pdfkit";
import { QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { formatCents } from "../money/cents";
import { db } from "../../models";

export type StatementLine = {
  invoiceNumber: string;
  lotTitle: string;
  state: string;
  hammerCents: number;
  commissionCents: number;
  feesCents: number;
  refundsCents: number;
  payoutCents: number;
  paidOutCents: number;
  releasedAt: string | null;
  transferId: string | null;
};
export type Statement = {
  consignor: string;
  saleTitle: string;
  saleId: string;
  generatedAt: string;
  lines: StatementLine[];
  totals: {
    hammerCents: number;
    commissionCents: number;
    feesCents: number;
    refundsCents: number;
    payoutCents: number;
    paidOutCents: number;
  };
};

/**
 * A consignor's settlement statement for one sale: per sold lot, hammer less
 * commission, fees and refunds, and what was transferred. The consignor sees
 * their own; the house any consignor's.
 */
export async function statementFor(viewer: Viewer, saleId: string, consignorId?: string): Promise<Statement> {
  const who = consignorId && viewer.roles.includes("admin") ? consignorId : viewer.id;
  const rows = await db().query<{
    number: string;
    title: string;
    state: string;
    hammer_cents: number;
    commission_cents: number;
    hammer_refunded_cents: number;
    commission_returned_cents: number;
    released_hammer_cents: number;
    released_commission_cents: number;
    released_at: Date | null;
    transfer_id: string | null;
    consignor: string;
    sale_title: string;
  }>(
    `SELECT i.number, l.title, i.state, i.hammer_cents, i.commission_cents, i.hammer_refunded_cents, i.commission_returned_cents, i.released_hammer_cents, i.released_commission_cents, i.released_at, i.transfer_id, u.display_name AS consignor, s.title AS sale_title
       FROM invoices i JOIN lots l ON l.id = i.lot_id JOIN sale_lots sl ON sl.id = i.sale_lot_id JOIN sales s ON s.id = sl.sale_id JOIN users u ON u.id = i.consignor_id
      WHERE sl.sale_id = :saleId AND i.consignor_id = :who ORDER BY sl.position`,
    { replacements: { saleId, who }, type: QueryTypes.SELECT },
  );
  if (!rows.length) throw new ApiError("not_found", "No sold lots of yours in this sale");
  const lines: StatementLine[] = rows.map((r) => {
    const fees = 0;
    // A refund to the buyer takes its share of the hammer from the consignor, who gets that share's commission back.
    const refunds = r.hammer_refunded_cents - r.commission_returned_cents;
    return {
      invoiceNumber: r.number,
      lotTitle: r.title,
      state: r.state,
      hammerCents: r.hammer_cents,
      commissionCents: r.commission_cents,
      feesCents: fees,
      refundsCents: refunds,
      payoutCents: r.hammer_cents - r.commission_cents - fees - refunds,
      // Paid so far: everything once released; before that, any undisputed share released early under a claim.
      paidOutCents:
        r.state === "released"
          ? r.hammer_cents - r.commission_cents - fees - refunds
          : r.released_hammer_cents - r.released_commission_cents,
      releasedAt: r.released_at?.toISOString() ?? null,
      transferId: r.transfer_id,
    };
  });
  const sum = (k: keyof StatementLine) => lines.reduce((n, l) => n + (l[k] as number), 0);
  return {
    consignor: rows[0]!.consignor,
    saleTitle: rows[0]!.sale_title,
    saleId,
    generatedAt: new Date().toISOString(),
    lines,
    totals: {
      hammerCents: sum("hammerCents"),
      commissionCents: sum("commissionCents"),
      feesCents: sum("feesCents"),
      refundsCents: sum("refundsCents"),
      payoutCents: sum("payoutCents"),
      paidOutCents: lines.reduce((n, l) => n + l.paidOutCents, 0),
    },
  };
}

/** CSV cells that a spreadsheet would read as a formula are prefixed with a quote mark. */
const cell = (v: string | number | null) => {
  const s = v == null ? "" : String(v);
  const safe = /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
  return /[",\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
};
const dollars = (c: number) => (c / 100).toFixed(2);

export function statementCsv(st: Statement): string {
  const head = [
    "invoice",
    "lot",
    "state",
    "hammer",
    "commission",
    "fees",
    "refunds",
    "payout",
    "released_at",
    "transfer",
  ];
  const body = st.lines.map((l) => [
    l.invoiceNumber,
    l.lotTitle,
    l.state,
    dollars(l.hammerCents),
    dollars(l.commissionCents),
    dollars(l.feesCents),
    dollars(l.refundsCents),
    dollars(l.payoutCents),
    l.releasedAt ?? "",
    l.transferId ?? "",
  ]);
  const total = [
    "TOTAL",
    "",
    "",
    dollars(st.totals.hammerCents),
    dollars(st.totals.commissionCents),
    dollars(st.totals.feesCents),
    dollars(st.totals.refundsCents),
    dollars(st.totals.payoutCents),
    "",
    "",
  ];
  return [head, ...body, total].map((r) => r.map(cell).join(",")).join("\r\n") + "\r\n";
}

export function statementPdf(st: Statement): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      size: "A4",
      margin: 48,
      info: { Title: `Settlement statement: ${st.saleTitle}`, Author: "Getterline Exchange" },
    });
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
    doc.font("Helvetica-Bold").fontSize(16).text("Getterline Exchange: settlement statement");
    doc
      .moveDown(0.3)
      .font("Helvetica")
      .fontSize(10)
      .text(`Consignor: ${st.consignor}`)
      .text(`Sale: ${st.saleTitle}`)
      .text(`Prepared: ${st.generatedAt.slice(0, 16).replace("T", " ")} UTC`);
    doc.moveDown();
    const cols = [48, 120, 300, 360, 420, 480];
    const row = (vals: string[], bold = false) => {
      const y = doc.y;
      doc.font(bold ? "Helvetica-Bold" : "Helvetica").fontSize(9);
      vals.forEach((v, i) =>
        doc.text(v, cols[i]!, y, { width: (cols[i + 1] ?? 560) - cols[i]! - 6, align: i >= 2 ? "right" : "left" }),
      );
      doc.moveDown(0.4);
    };
    row(["Invoice", "Lot", "Hammer", "Commission", "Refunds", "Payout"], true);
    for (const l of st.lines)
      row([
        l.invoiceNumber,
        l.lotTitle,
        formatCents(l.hammerCents),
        formatCents(l.commissionCents),
        formatCents(l.refundsCents),
        formatCents(l.payoutCents),
      ]);
    row(
      [
        "Total",
        "",
        formatCents(st.totals.hammerCents),
        formatCents(st.totals.commissionCents),
        formatCents(st.totals.refundsCents),
        formatCents(st.totals.payoutCents),
      ],
      true,
    );
    doc
      .moveDown()
      .font("Helvetica")
      .fontSize(9)
      .text(
        `Paid out so far: ${formatCents(st.totals.paidOutCents)}. Lots not yet released are paid when the buyer's inspection window ends without a claim.`,
        48,
      );
    doc.end();
  });
}
