import { ApiError } from "../api/errors";
import {
  lookupSourceCode,
  parseMakerRegistryCsv,
  type MakerRegistryEntry,
  type SourceCodeLookup,
} from "../valves/source-code";
import { db, Maker, MakerCode } from "../../models";

/** The registry as the pure code reads it: one entry per registered code. */
export async function registryEntries(): Promise<MakerRegistryEntry[]> {
  db();
  const codes = await MakerCode.findAll({ include: [{ model: Maker, as: "maker" }], order: [["code", "ASC"]] });
  return codes.map((c) => ({ code: c.code, makerName: c.maker!.name, isDemo: c.isDemo, notes: c.notes }));
}

/** Look a source code up in the house registry (evidence, not proof). */
export async function lookupRegisteredCode(code: string): Promise<SourceCodeLookup> {
  return lookupSourceCode(code, await registryEntries());
}

export type ImportRow = MakerRegistryEntry & { change: "new" | "changed" | "unchanged"; previousMaker?: string };
export type ImportPreview = {
  rows: ImportRow[];
  errors: { line: number; message: string }[];
  counts: Record<ImportRow["change"], number>;
};

/** Largest registry CSV accepted (bytes). */
export const MAX_REGISTRY_CSV_BYTES = 512 * 1024;

/** Parse a registry CSV and say, row by row, what applying it would change. Writes nothing. */
export async function previewRegistryImport(csv: string): Promise<ImportPreview> {
  if (Buffer.byteLength(csv) > MAX_REGISTRY_CSV_BYTES)
    throw new ApiError("payload_too_large", "The registry file is larger than 512 KB");
  const parsed = parseMakerRegistryCsv(csv);
  const existing = new Map((await registryEntries()).map((e) => [e.code, e]));
  const seen = new Set<string>();
  const errors = [...parsed.errors];
  const rows: ImportRow[] = [];
  for (const r of parsed.rows) {
    if (seen.has(r.code)) {
      errors.push({ line: 0, message: `code ${r.code} appears more than once` });
      continue;
    }
    seen.add(r.code);
    const before = existing.get(r.code);
    const change = !before
      ? "new"
      : before.makerName === r.makerName && before.isDemo === r.isDemo && before.notes === r.notes
        ? "unchanged"
        : "changed";
    rows.push({
      ...r,
      change,
      ...(before && before.makerName !== r.makerName ? { previousMaker: before.makerName } : {}),
    });
  }
  const counts = { new: 0, changed: 0, unchanged: 0 };
  for (const r of rows) counts[r.change]++;
  return { rows, errors, counts };
}

/**
 * Apply a registry CSV in one transaction. Any row error refuses the whole
 * file (nothing is written); applying the same file twice changes nothing.
 */
export async function applyRegistryImport(csv: string): Promise<ImportPreview> {
  const preview = await previewRegistryImport(csv);
  if (preview.errors.length) {
    const fields = Object.fromEntries(
      preview.errors.slice(0, 50).map((e, i) => [`line ${e.line || `?${i}`}`, e.message]),
    );
    throw new ApiError(
      "validation_failed",
      `${preview.errors.length} row(s) need fixing; nothing was imported`,
      fields,
    );
  }
  const s = db();
  await s.transaction(async (t) => {
    for (const r of preview.rows.filter((x) => x.change !== "unchanged")) {
      const [maker] = await Maker.findOrCreate({
        where: { name: r.makerName },
        defaults: { name: r.makerName, isDemo: r.isDemo },
        transaction: t,
      });
      await MakerCode.upsert({ code: r.code, makerId: maker.id, isDemo: r.isDemo, notes: r.notes }, { transaction: t });
    }
  });
  return preview;
}
