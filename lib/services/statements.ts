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
  /** The card processor's fee on the buyer's payment, as the ledger records it; a house expense, not deducted. */
  processorFeesCents: number;
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
    processorFeesCents: number;
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
    id: string;
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
    `SELECT i.id, i.number, l.title, i.state, i.hammer_cents, i.commission_cents, i.hammer_refunded_cents, i.commission_returned_cents, i.released_hammer_cents, i.released_commission_cents, i.released_at, i.transfer_id, u.display_name AS consignor, s.title AS sale_title
       FROM invoices i JOIN lots l ON l.id = i.lot_id JOIN sale_lots sl ON sl.id = i.sale_lot_id JOIN sales s ON s.id = sl.sale_id JOIN users u ON u.id = i.consignor_id
      WHERE sl.sale_id = :saleId AND i.consignor_id = :who ORDER BY sl.position`,
    { replacements: { saleId, who }, type: QueryTypes.SELECT },
  );
  if (!rows.length) throw new ApiError("not_found", "No sold lots of yours in this sale");
  const posted = await ledgerFigures(rows.map((r) => r.id));
  const lines: StatementLine[] = rows.map((r) => {
    const led = posted.get(r.id);
    const fees = led?.consignorFeesCents ?? 0;
    // A refund to the buyer takes its share of the hammer from the consignor, who gets that share's commission back;
    // return postage repaid under an upheld claim is charged to the consignor too [SUG].
    const refunds = r.hammer_refunded_cents - r.commission_returned_cents + (led?.postageCents ?? 0);
    return {
      invoiceNumber: r.number,
      lotTitle: r.title,
      state: r.state,
      hammerCents: r.hammer_cents,
      commissionCents: r.commission_cents,
      feesCents: fees,
      processorFeesCents: led?.processorFeesCents ?? 0,
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
      processorFeesCents: sum("processorFeesCents"),
      refundsCents: sum("refundsCents"),
      payoutCents: sum("payoutCents"),
      paidOutCents: lines.reduce((n, l) => n + l.paidOutCents, 0),
    },
  };
}

/** Per invoice, from the ledger's postings: consignor fees charged, the processor's fee, return postage charged. */
async function ledgerFigures(
  invoiceIds: string[],
): Promise<Map<string, { consignorFeesCents: number; processorFeesCents: number; postageCents: number }>> {
  const rows = await db().query<{
    invoice_id: string;
    consignor_fees: string;
    processor_fees: string;
    postage: string;
  }>(
    `SELECT invoice_id,
            COALESCE(SUM(credit_cents - debit_cents) FILTER (WHERE account = 'house-revenue-fees'), 0) AS consignor_fees,
            COALESCE(SUM(debit_cents - credit_cents) FILTER (WHERE account = 'processor-fees'), 0) AS processor_fees,
            COALESCE(SUM(debit_cents - credit_cents) FILTER (WHERE account = 'consignor-payable' AND txn_kind = 'dispute-return-postage'), 0) AS postage
       FROM ledger_entries WHERE invoice_id IN (:invoiceIds) GROUP BY invoice_id`,
    { replacements: { invoiceIds }, type: QueryTypes.SELECT },
  );
  return new Map(
    rows.map((r) => [
      r.invoice_id,
      {
        consignorFeesCents: Number(r.consignor_fees),
        processorFeesCents: Number(r.processor_fees),
        postageCents: Number(r.postage),
      },
    ]),
  );
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
    "processor_fee_borne_by_house",
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
    dollars(l.processorFeesCents),
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
    dollars(st.totals.processorFeesCents),
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
        `Paid out so far: ${formatCents(st.totals.paidOutCents)}. Lots not yet released are paid when the buyer's inspection window ends without a claim. Card processing fees on the buyers' payments (${formatCents(st.totals.processorFeesCents)}) are borne by the house and not deducted.`,
        48,
      );
    doc.end();
  });
}
