import { ApiError } from "../api/errors";
import { decodeDesignation } from "../valves/designation";
import type { DecodedDesignation } from "../valves/designation";
import { findEquivalents, type EquivalentsResult } from "../valves/equivalents";
import { hazardsForType, type HazardReport } from "../valves/hazards";
import { findReferenceType, type ReferenceType } from "../valves/reference-data";
import { db, User, ValveType, ValveTypeRevision } from "../../models";
import type { ValveTypeData } from "../../models/ValveType";
import type { ReferenceEditInput } from "../validation/valves";

/** Everything the exchange knows about one designation. */
export type TypeLookup = {
  query: string;
  decode: DecodedDesignation;
  reference: (ReferenceType & { revision: number; updatedAt: string; matchedBy: "exact" | "alias" | "stem" }) | null;
  equivalents: EquivalentsResult;
  hazards: HazardReport;
};

/** The house's current reference row for a designation (name, alias, or US stem). */
export async function referenceFor(designation: string): Promise<TypeLookup["reference"]> {
  db();
  const found = findReferenceType(designation);
  const name = found?.row.designation ?? designation;
  const row = await ValveType.findByName(name);
  if (!row) return null;
  return { ...row.toReference(), revision: row.revision, updatedAt: row.updatedAt.toISOString(), matchedBy: found?.match ?? "exact" };
}

/**
 * Decode a designation and gather its equivalents, reference figures and
 * hazards. Malformed input is a 400; a designation we cannot place is a 404
 * whose details list the closest known designations.
 */
export async function lookupType(input: string): Promise<TypeLookup> {
  const decode = decodeDesignation(input);
  if (!decode.ok) {
    if (decode.error === "not-a-designation") {
      throw new ApiError("not_found", decode.message, undefined, undefined, { candidates: decode.candidates });
    }
    throw new ApiError("validation_failed", decode.message, { designation: decode.message });
  }
  const [reference, equivalents] = [await referenceFor(decode.normalised), findEquivalents(decode.normalised)];
  if (!reference && equivalents.matches.length === 0 && !decode.knownType) {
    throw new ApiError("not_found", `${decode.normalised} is not a type we hold figures for`, undefined, undefined, {
      candidates: decode.candidates,
      decode,
    });
  }
  return { query: input, decode, reference, equivalents, hazards: hazardsForType(decode.normalised) };
}

/** All reference rows, for the house's table. */
export async function listReferenceTypes(): Promise<(ReferenceType & { revision: number; updatedAt: string })[]> {
  db();
  const rows = await ValveType.findAll({ order: [["designation", "ASC"]] });
  return rows.map((r) => ({ ...r.toReference(), revision: r.revision, updatedAt: r.updatedAt.toISOString() }));
}

/** The change history of one row, newest first. */
export async function referenceHistory(designation: string) {
  db();
  const rows = await ValveTypeRevision.findAll({
    where: { designation }, order: [["revision", "DESC"]], limit: 200,
    include: [{ model: User, as: "changer", attributes: ["displayName"] }],
  });
  return rows.map((r) => ({
    revision: r.revision, changedBy: r.changer?.displayName ?? "a removed account", reason: r.reason,
    before: r.before, after: r.after, at: r.createdAt.toISOString(),
  }));
}

function applyEdit(data: ValveTypeData, e: ReferenceEditInput): ValveTypeData {
  const heater = e.heaterVolts != null && e.heaterAmps != null ? { ...(data.heater ?? {}), volts: e.heaterVolts, amps: e.heaterAmps } : null;
  const prior = data.characteristics;
  const characteristics =
    prior && prior.kind !== "amplifier"
      ? prior
      : e.plateVolts == null
        ? undefined
        : {
            kind: "amplifier" as const,
            plateVolts: e.plateVolts,
            ...(e.gridVolts != null ? { gridVolts: e.gridVolts } : {}),
            ...(prior?.kind === "amplifier" && prior.cathodeResistorOhms != null && e.gridVolts == null ? { cathodeResistorOhms: prior.cathodeResistorOhms } : {}),
            ...(e.screenVolts != null ? { screenVolts: e.screenVolts } : {}),
            ...(e.mu != null ? { mu: e.mu } : {}),
            ...(e.gmMicromho != null ? { gmMicromho: e.gmMicromho } : {}),
            ...(e.plateCurrentMa != null ? { plateCurrentMa: e.plateCurrentMa } : {}),
            ...(e.rpOhms != null ? { rpOhms: e.rpOhms } : {}),
          };
  const next: ValveTypeData = { ...data, heater: heater as ValveTypeData["heater"] };
  const mutable = next as { -readonly [K in keyof ValveTypeData]: ValveTypeData[K] };
  if (characteristics) mutable.characteristics = characteristics;
  else delete mutable.characteristics;
  if (e.introducedYear != null) mutable.introduced = { year: e.introducedYear, source: "MEM" };
  else delete mutable.introduced;
  if (e.note) mutable.note = e.note;
  else delete mutable.note;
  return next;
}

/**
 * The house corrects a reference row. The row is locked, the revision number
 * rises by one and a revision with before, after, who and why is written in
 * the same transaction. `expectedRevision` stops two editors overwriting each other.
 */
export async function editReferenceType(actorId: string, designation: string, expectedRevision: number, e: ReferenceEditInput) {
  const s = db();
  return s.transaction(async (t) => {
    const row = await ValveType.findByPk(designation, { lock: t.LOCK.UPDATE, transaction: t });
    if (!row) throw new ApiError("not_found", `No reference row for ${designation}`);
    if (row.revision !== expectedRevision) {
      throw new ApiError("conflict", `Someone saved revision ${row.revision} since you opened it; reload and apply your change again`);
    }
    const before = { ...row.data, source: row.source };
    const data = applyEdit(row.data, e);
    const revision = row.revision + 1;
    await row.update({ data, source: e.source, revision, updatedBy: actorId }, { transaction: t });
    await ValveTypeRevision.create(
      { designation, revision, changedBy: actorId, reason: e.reason, before, after: { ...data, source: e.source } },
      { transaction: t },
    );
    return { ...row.toReference(), revision, updatedAt: row.updatedAt.toISOString() };
  });
}
