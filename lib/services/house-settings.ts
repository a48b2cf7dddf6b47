/**
 * House settings as versions: read the current one, keep a new version per change (who, when, why), and give a sale
 * or an invoice the version frozen on its sale. Versions are never updated, so a read version is cached for good.
 */
import { QueryTypes, type Transaction } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { settingsChanges } from "../validation/house-settings-diff";
import { HouseSettingsSchema, type HouseSettings, type HouseSettingsChange } from "../validation/house-settings";
import { db, HouseSettingsVersion } from "../../models";

/** One version as the settings page and the API show it. */
export type SettingsVersionView = {
  version: number;
  settings: HouseSettings;
  reason: string;
  changedBy: string | null;
  changedAt: string;
  /** What this version changed from the one before (empty for the first). */
  changes: string[];
};

const g = globalThis as unknown as { __houseSettingsCache?: Map<number, HouseSettings> };
const cache = (g.__houseSettingsCache ??= new Map<number, HouseSettings>());

/** Versions are immutable: parse each once (through the schema, so defaults apply to older documents). */
function remember(version: number, raw: unknown): HouseSettings {
  const hit = cache.get(version);
  if (hit) return hit;
  const settings = HouseSettingsSchema.parse(raw);
  cache.set(version, settings);
  return settings;
}

/** The version in force now (the highest). */
export async function currentSettings(t?: Transaction): Promise<{ version: number; settings: HouseSettings }> {
  db();
  const row = await HouseSettingsVersion.findOne({ order: [["version", "DESC"]], transaction: t });
  if (!row) throw new Error("house_settings_versions is empty: run the migrations");
  return { version: row.version, settings: remember(row.version, row.settings) };
}

/** One version's settings (cached: a version never changes). */
export async function settingsVersion(version: number, t?: Transaction): Promise<HouseSettings> {
  const hit = cache.get(version);
  if (hit) return hit;
  db();
  const row = await HouseSettingsVersion.findByPk(version, { transaction: t });
  if (!row) throw new Error(`no house settings version ${version}`);
  return remember(row.version, row.settings);
}

/** The settings frozen on a sale when it was scheduled. */
export async function settingsForSale(
  saleId: string,
  t?: Transaction,
): Promise<{ version: number; settings: HouseSettings }> {
  const [row] = await db().query<{ settings_version: number }>(
    `SELECT settings_version FROM sales WHERE id = :saleId`,
    {
      replacements: { saleId },
      type: QueryTypes.SELECT,
      transaction: t,
    },
  );
  if (!row) throw new ApiError("not_found", "No such sale");
  return { version: row.settings_version, settings: await settingsVersion(row.settings_version, t) };
}

/** The settings an invoice's money and timing follow: its own version, else its sale's. */
export async function settingsForInvoice(invoiceId: string, t?: Transaction): Promise<HouseSettings> {
  const [row] = await db().query<{ version: number }>(
    `SELECT COALESCE(i.settings_version, s.settings_version) AS version
       FROM invoices i JOIN sale_lots sl ON sl.id = i.sale_lot_id JOIN sales s ON s.id = sl.sale_id WHERE i.id = :invoiceId`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT, transaction: t },
  );
  if (!row) throw new ApiError("not_found", "No such invoice");
  return settingsVersion(row.version, t);
}

/** Every version, newest first, with who changed what and why. */
export async function settingsHistory(limit = 100): Promise<SettingsVersionView[]> {
  const rows = await db().query<{
    version: number;
    settings: unknown;
    reason: string;
    created_at: Date;
    changed_by: string | null;
  }>(
    `SELECT v.version, v.settings, v.reason, v.created_at, u.display_name AS changed_by
       FROM house_settings_versions v LEFT JOIN users u ON u.id = v.created_by
      ORDER BY v.version DESC LIMIT :limit`,
    { replacements: { limit: limit + 1 }, type: QueryTypes.SELECT },
  );
  const parsed = rows.map((r) => ({ ...r, settings: remember(r.version, r.settings) }));
  return parsed.slice(0, limit).map((r, i) => ({
    version: r.version,
    settings: r.settings,
    reason: r.reason,
    changedBy: r.changed_by,
    changedAt: r.created_at.toISOString(),
    changes: parsed[i + 1] ? settingsChanges(parsed[i + 1]!.settings, r.settings) : [],
  }));
}

/**
 * Keep a new version. Refused (409) when `baseVersion` is given and another change came first. A retry of the same
 * change (same settings and reason as the current version) returns that version instead of adding another.
 */
export async function changeSettings(
  viewer: Viewer,
  input: HouseSettingsChange & { baseVersion?: number },
): Promise<SettingsVersionView> {
  const s = db();
  const version = await s.transaction(async (t) => {
    // One writer at a time: the next version number is the highest plus one.
    await s.query(`LOCK TABLE house_settings_versions IN SHARE ROW EXCLUSIVE MODE`, { transaction: t });
    const current = await currentSettings(t);
    const [latest] = await s.query<{ reason: string }>(
      `SELECT reason FROM house_settings_versions WHERE version = :v`,
      { replacements: { v: current.version }, type: QueryTypes.SELECT, transaction: t },
    );
    const same = settingsChanges(current.settings, input.settings).length === 0;
    if (same && latest?.reason === input.reason) return current.version;
    if (input.baseVersion !== undefined && input.baseVersion !== current.version)
      throw new ApiError(
        "conflict",
        `The settings changed meanwhile (now version ${current.version}): reload and try again`,
      );
    if (same) throw new ApiError("validation_failed", "Nothing changed", { settings: "Change at least one figure" });
    const next = current.version + 1;
    await HouseSettingsVersion.create(
      { version: next, settings: input.settings, reason: input.reason, createdBy: viewer.id },
      { transaction: t },
    );
    return next;
  });
  const [view] = (await settingsHistory(5)).filter((v) => v.version === version);
  return view!;
}
