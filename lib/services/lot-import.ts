import { Op } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { DEFAULT_MAX_BYTES, parseLotCsv, type ParsedRow } from "../lots/csv-import";
import { db, Lot, LotEvent, LotImport, LotItem } from "../../models";
import { assertConsignorCanEdit } from "./lot-access";
import { normaliseFeatures } from "./lots";
import { currentReferenceTable } from "./reference-table";

export type ImportPreviewRow = {
  line: number;
  designation: string;
  flagged: boolean;
  quantity: number;
  label: string | null;
  tested: boolean;
  alreadyImported: boolean;
};
export type ImportReport = {
  fingerprint: string | null;
  rows: ImportPreviewRow[];
  errors: { line: number; column?: string; message: string }[];
  warnings: { line: number; column?: string; message: string }[];
  unknownColumns: string[];
  counts: { new: number; alreadyImported: number; withErrors: number };
  fileSeenBefore: boolean;
};

/** A checked row as a lot_items row: its values passed the item form's schema, so each fits its column. */
function toValues(lotId: string, row: ParsedRow, position: number) {
  const i = row.input;
  const d = row.item.designation;
  return {
    lotId,
    position,
    importKey: row.key,
    designationTyped: i.designation,
    designation: d.normalised ?? i.designation.toUpperCase(),
    designationKnown: d.status === "known",
    quantity: i.quantity,
    labelBrand: i.labelBrand,
    makerName: i.makerName,
    makerBasis: i.makerBasis,
    sourceCode: i.sourceCode,
    dateCode: i.dateCode,
    features: normaliseFeatures(i.features),
    condition: i.condition,
    vacuumLoss: i.vacuumLoss,
    defects: i.defects,
    hazards: i.hazards,
    readings: i.readings,
    notes: i.notes,
  };
}

async function analyse(viewer: Viewer, lotId: string, csv: string) {
  db();
  assertConsignorCanEdit(viewer, await Lot.findByPk(lotId));
  const parsed = parseLotCsv(await currentReferenceTable(), csv, { maxBytes: DEFAULT_MAX_BYTES });
  const existing = new Set(
    parsed.rows.length
      ? (
          await LotItem.findAll({
            where: { lotId, importKey: { [Op.in]: parsed.rows.map((r) => r.key) } },
            attributes: ["importKey"],
          })
        ).map((i) => i.importKey)
      : [],
  );
  const fileSeenBefore = parsed.fingerprint
    ? (await LotImport.count({ where: { lotId, fingerprint: parsed.fingerprint } })) > 0
    : false;
  return { parsed, existing, fileSeenBefore };
}

function report(a: Awaited<ReturnType<typeof analyse>>): ImportReport {
  const { parsed, existing } = a;
  const rows = parsed.rows.map((r) => ({
    line: r.line,
    designation: r.item.designation.normalised ?? r.item.designation.typed,
    flagged: r.item.designation.status !== "known",
    quantity: r.item.quantity,
    label: r.item.labelBrand,
    tested: r.item.readings.length > 0,
    alreadyImported: existing.has(r.key),
  }));
  const errorLines = new Set(parsed.errors.filter((e) => e.line > 0).map((e) => e.line));
  return {
    fingerprint: parsed.fingerprint,
    rows,
    errors: parsed.errors,
    warnings: parsed.warnings,
    unknownColumns: parsed.unknownColumns,
    counts: {
      new: rows.filter((r) => !r.alreadyImported).length,
      alreadyImported: rows.filter((r) => r.alreadyImported).length,
      withErrors: errorLines.size,
    },
    fileSeenBefore: a.fileSeenBefore,
  };
}

/** Read a CSV against the lot and say what applying it would add. Writes nothing. */
export async function previewImport(viewer: Viewer, lotId: string, csv: string): Promise<ImportReport> {
  return report(await analyse(viewer, lotId, csv));
}

/**
 * Apply a CSV: refused whole while any row has an error; otherwise the rows
 * not already in the lot are added in one transaction. Re-importing the same
 * file (or the same rows) adds nothing.
 */
export async function applyImport(
  viewer: Viewer,
  lotId: string,
  csv: string,
  fileName: string,
): Promise<ImportReport & { added: number }> {
  const a = await analyse(viewer, lotId, csv);
  const r = report(a);
  if (a.parsed.errors.length) {
    const fields = Object.fromEntries(
      a.parsed.errors
        .slice(0, 50)
        .map((e, i) => [e.line ? `line ${e.line}${e.column ? ` ${e.column}` : ""}` : `file ${i + 1}`, e.message]),
    );
    throw new ApiError(
      "validation_failed",
      `${a.parsed.errors.length} problem(s) in the file; nothing was imported. Fix them and import again.`,
      fields,
    );
  }
  const s = db();
  const added = await s.transaction(async (t) => {
    assertConsignorCanEdit(viewer, await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t }));
    // Re-read the keys under the lot's lock: a concurrent retry of the same import adds nothing.
    const present = new Set(
      (
        await LotItem.findAll({
          where: { lotId, importKey: { [Op.in]: a.parsed.rows.map((row) => row.key) } },
          attributes: ["importKey"],
          transaction: t,
        })
      ).map((i) => i.importKey),
    );
    const fresh = a.parsed.rows.filter((row) => !present.has(row.key));
    const max = ((await LotItem.max("position", { where: { lotId }, transaction: t })) as number | null) ?? 0;
    const created = await LotItem.bulkCreate(
      fresh.map((row, i) => toValues(lotId, row, max + i + 1)),
      { transaction: t },
    );
    await LotImport.create(
      {
        lotId,
        fingerprint: a.parsed.fingerprint!,
        fileName: fileName.slice(0, 200),
        rowsAdded: created.length,
        rowsSkipped: a.parsed.rows.length - created.length,
        createdBy: viewer.id,
      },
      { transaction: t },
    );
    await LotEvent.create(
      {
        lotId,
        actorId: viewer.id,
        kind: "imported",
        comment: `${created.length} rows added from ${fileName || "a CSV file"}${a.parsed.rows.length - created.length ? `, ${a.parsed.rows.length - created.length} already in the lot` : ""}`,
      },
      { transaction: t },
    );
    return created.length;
  });
  return { ...r, added };
}
