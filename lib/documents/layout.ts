/**
 * The one page layout every printable document shares (invoice, packing slip, lot sheet, sale catalogue):
 * a header with the house name and the document's title, a footer with "page n of m", simple tables that
 * break across pages and repeat their heading row, and an address block. Uses pdfkit's built-in
 * Helvetica, so nothing is fetched or embedded; text is kept to characters that font can show.
 */
import PDFDocument from "pdfkit";
import { formatWhen } from "../time/format";

export type Pdf = PDFKit.PDFDocument;

/** A party's postal block, when one is known: a name and the lines under it. */
export type AddressBlock = { name: string; lines: string[] } | null;

/** One column of a table: heading, share of the page width, alignment. */
export type Column = { label: string; width: number; align?: "left" | "right" };

export const HOUSE_NAME = "Getterline Exchange";
const MARGIN = 48;
const FOOTER_SPACE = 36;

/** Times on paper are in UTC, named, so a printed sheet reads the same anywhere. */
export const paperTime = (iso: string, style: "date" | "datetime" = "datetime") => formatWhen(iso, "UTC", style);

/** Replace characters Helvetica (WinAnsi) cannot show with plain equivalents, so no glyph prints as garbage. */
export function plain(s: string): string {
  return s
    .replace(/[\u2264]/g, "<=")
    .replace(/[\u2265]/g, ">=")
    .replace(/[\u2212]/g, "-")
    .replace(/[\u2192]/g, "->")
    .replace(/[\u00a0\u202f]/g, " ")
    .replace(/[^\u0009\u000a\u0020-\u007e\u00a1-\u00ff\u2013\u2014\u2018\u2019\u201c\u201d\u2022\u2026\u00b7]/g, "?");
}

/**
 * Render a document to a Buffer: `draw` writes the body after the header; the footer (page numbers) is
 * written on every page once the body is done.
 */
export function renderPdf(meta: { title: string; subtitle?: string }, draw: (doc: Pdf) => void): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      size: "A4",
      margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: MARGIN + FOOTER_SPACE },
      bufferPages: true,
      info: { Title: plain(meta.title), Author: HOUSE_NAME },
    });
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
    try {
      header(doc, meta.title, meta.subtitle);
      draw(doc);
      footer(doc, meta.title);
      doc.end();
    } catch (e) {
      reject(e);
    }
  });
}

function header(doc: Pdf, title: string, subtitle?: string) {
  doc.font("Helvetica").fontSize(9).fillColor("#444444").text(HOUSE_NAME.toUpperCase(), { characterSpacing: 1 });
  doc.font("Helvetica-Bold").fontSize(17).fillColor("black").text(plain(title));
  if (subtitle) doc.font("Helvetica").fontSize(10).text(plain(subtitle));
  const y = doc.y + 4;
  doc
    .moveTo(MARGIN, y)
    .lineTo(doc.page.width - MARGIN, y)
    .lineWidth(0.8)
    .stroke();
  doc.y = y + 10;
}

function footer(doc: Pdf, title: string) {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.height - MARGIN - 14;
    // Writing inside the bottom margin: lift the margin for this line so pdfkit does not add a page.
    const saved = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font("Helvetica").fontSize(8).fillColor("#444444");
    doc.text(`${HOUSE_NAME} · ${plain(title)}`, MARGIN, bottom, { width: 360, lineBreak: false });
    doc.text(`Page ${i - range.start + 1} of ${range.count}`, doc.page.width - MARGIN - 120, bottom, {
      width: 120,
      align: "right",
      lineBreak: false,
    });
    doc.page.margins.bottom = saved;
    doc.fillColor("black");
  }
}

const contentWidth = (doc: Pdf) => doc.page.width - doc.page.margins.left - doc.page.margins.right;
const pageBottom = (doc: Pdf) => doc.page.height - doc.page.margins.bottom;

/** A section heading, moved to a new page when too little room is left for it and a line or two. */
export function heading(doc: Pdf, text: string) {
  if (doc.y + 60 > pageBottom(doc)) doc.addPage();
  doc.moveDown(0.6).font("Helvetica-Bold").fontSize(12).text(plain(text), MARGIN);
  doc.moveDown(0.2).font("Helvetica").fontSize(9.5);
}

/** A paragraph of body text. */
export function para(doc: Pdf, text: string, opts: { bold?: boolean; size?: number } = {}) {
  doc
    .font(opts.bold ? "Helvetica-Bold" : "Helvetica")
    .fontSize(opts.size ?? 9.5)
    .text(plain(text), MARGIN, doc.y, { width: contentWidth(doc) });
}

/** Label and value pairs, two columns. */
export function facts(doc: Pdf, pairs: [string, string][]) {
  for (const [k, v] of pairs) {
    const y = doc.y;
    doc.font("Helvetica-Bold").fontSize(9.5).text(plain(k), MARGIN, y, { width: 130 });
    const after = doc.y;
    doc.font("Helvetica").text(plain(v), MARGIN + 136, y, { width: contentWidth(doc) - 136 });
    doc.y = Math.max(after, doc.y) + 2;
  }
}

/** Address blocks side by side (each only when given), under their captions. */
export function addresses(doc: Pdf, blocks: { caption: string; block: AddressBlock }[]) {
  const shown = blocks.filter((b): b is { caption: string; block: NonNullable<AddressBlock> } => Boolean(b.block));
  if (!shown.length) return;
  const top = doc.y;
  const width = contentWidth(doc) / shown.length;
  let lowest = top;
  shown.forEach(({ caption, block }, i) => {
    const x = MARGIN + i * width;
    doc.font("Helvetica").fontSize(8).fillColor("#444444").text(plain(caption).toUpperCase(), x, top, { width });
    doc
      .fillColor("black")
      .font("Helvetica-Bold")
      .fontSize(10)
      .text(plain(block.name), x, doc.y, { width: width - 8 });
    doc.font("Helvetica").fontSize(9.5);
    for (const line of block.lines) doc.text(plain(line), x, doc.y, { width: width - 8 });
    lowest = Math.max(lowest, doc.y);
  });
  doc.y = lowest + 8;
  doc.x = MARGIN;
}

/**
 * A table: widths are shares of the page width; rows break onto a new page, which repeats the heading row.
 * `bold` rows (totals) are set in bold with a rule above.
 */
export function table(doc: Pdf, columns: Column[], rows: { cells: string[]; bold?: boolean }[]) {
  const total = columns.reduce((n, c) => n + c.width, 0);
  const widths = columns.map((c) => (c.width / total) * contentWidth(doc));
  const lefts = widths.map((_, i) => MARGIN + widths.slice(0, i).reduce((n, w) => n + w, 0));
  const heightOf = (cells: string[], font: string) => {
    doc.font(font).fontSize(9);
    return Math.max(...cells.map((c, i) => doc.heightOfString(plain(c), { width: widths[i]! - 6 })), 10) + 5;
  };
  const line = (cells: string[], font: string) => {
    const y = doc.y;
    doc.font(font).fontSize(9);
    cells.forEach((c, i) =>
      doc.text(plain(c), lefts[i]!, y, { width: widths[i]! - 6, align: columns[i]!.align ?? "left" }),
    );
    doc.y = y + heightOf(cells, font);
  };
  const rule = (weight: number) => {
    doc
      .moveTo(MARGIN, doc.y - 2)
      .lineTo(MARGIN + contentWidth(doc), doc.y - 2)
      .lineWidth(weight)
      .stroke();
  };
  const head = () => {
    line(
      columns.map((c) => c.label),
      "Helvetica-Bold",
    );
    rule(0.6);
    doc.y += 2;
  };
  head();
  for (const row of rows) {
    const font = row.bold ? "Helvetica-Bold" : "Helvetica";
    if (doc.y + heightOf(row.cells, font) > pageBottom(doc)) {
      doc.addPage();
      head();
    }
    if (row.bold) {
      doc.y += 2;
      rule(0.6);
      doc.y += 2;
    }
    line(row.cells, font);
  }
  doc.x = MARGIN;
  doc.moveDown(0.4);
}

/** Handling cautions: a boxed list, each with its title; always ends by deferring to local rules. */
export function cautions(doc: Pdf, items: { title: string; text: string }[]) {
  heading(doc, "Handling cautions");
  for (const c of items) {
    para(doc, c.title, { bold: true });
    para(doc, c.text);
    doc.moveDown(0.3);
  }
  para(
    doc,
    "These are reminders, not safety instructions: follow local codes, your carrier's rules and licensed practice.",
    { size: 8.5 },
  );
}
