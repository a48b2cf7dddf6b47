import { ApiError } from "../api/errors";
import { decodeDesignation } from "../valves/designation";
import type { DecodedDesignation } from "../valves/designation";
import { findEquivalents, type EquivalentsResult } from "../valves/equivalents";
import { hazardsForType, type HazardReport } from "../valves/hazards";
import type { ReferenceType } from "../valves/reference-row";
import { findReferenceType } from "../valves/reference-table";
import { db, User, ValveType, ValveTypeRevision } from "../../models";
import type { ValveTypeData } from "../../models/ValveType";
import type { ReferenceEditInput } from "../validation/valves";
import { currentReferenceTable } from "./reference-table";

/** A reference row as the house keeps it: the row, its revision and when it last changed. */
export type HouseReference = ReferenceType & { revision: number; updatedAt: string; retired: boolean };

/**
 * Everything the exchange knows about one designation. `onFile` is true when
 * the house's table (or the equivalents lists) holds the type; false when it
 * decodes by its scheme (heater, systems, base) but has no figures on file,
 * in which case `canAdd` tells the house it may add the row.
 */
export type TypeLookup = {
  query: string;
  onFile: boolean;
  canAdd: boolean;
  decode: DecodedDesignation;
  reference: (HouseReference & { matchedBy: "exact" | "alias" | "stem" }) | null;
  equivalents: EquivalentsResult;
  hazards: HazardReport;
};

const present = (row: ValveType): HouseReference => ({
  ...row.toReference(),
  revision: row.revision,
  updatedAt: row.updatedAt.toISOString(),
  retired: row.retiredAt !== null,
});

/** The house's current reference row for a designation (name, alias, or US stem), on file only. */
export async function referenceFor(designation: string): Promise<TypeLookup["reference"]> {
  const table = await currentReferenceTable();
  const found = findReferenceType(table, designation);
  if (!found) return null;
  const row = await ValveType.findByPk(found.row.designation);
  return row ? { ...present(row), matchedBy: found.match } : null;
}

/** One row by its designation for the house's edit page, retired or not. */
export async function houseReferenceRow(designation: string): Promise<HouseReference | null> {
  db();
  const row = await ValveType.findByPk(designation);
  return row ? present(row) : null;
}

/**
 * The three answers for a designation, the same for the API, the reference
 * page, intake and the lot summary: on file (figures, equivalents, sources);
 * decoded by its scheme with no figures on file (200, onFile false); not a
 * designation (404 with the closest known candidates). Malformed input is a 400.
 */
export async function lookupType(input: string): Promise<TypeLookup> {
  const table = await currentReferenceTable();
  const decode = decodeDesignation(table, input);
  if (!decode.ok) {
    if (decode.error === "not-a-designation") {
      throw new ApiError("not_found", decode.message, undefined, undefined, { candidates: decode.candidates });
    }
    throw new ApiError("validation_failed", decode.message, { designation: decode.message });
  }
  const reference = decode.reference ? await referenceFor(decode.normalised) : null;
  return {
    query: input,
    onFile: decode.knownType,
    canAdd: !reference,
    decode,
    reference,
    equivalents: findEquivalents(decode.normalised),
    hazards: hazardsForType(table, decode.normalised),
  };
}

/** All reference rows, retired ones included, for the house's table. */
export async function listReferenceTypes(): Promise<HouseReference[]> {
  db();
  const rows = await ValveType.findAll({ order: [["designation", "ASC"]] });
  return rows.map(present);
}

/** The change history of one row, newest first. */
export async function referenceHistory(designation: string) {
  db();
  const rows = await ValveTypeRevision.findAll({
    where: { designation },
    order: [["revision", "DESC"]],
    limit: 200,
    include: [{ model: User, as: "changer", attributes: ["displayName"] }],
  });
  return rows.map((r) => ({
    revision: r.revision,
    changedBy: r.changer?.displayName ?? "a removed account",
    reason: r.reason,
    before: r.before,
    after: r.after,
    at: r.createdAt.toISOString(),
  }));
}

function applyEdit(data: ValveTypeData, e: ReferenceEditInput): ValveTypeData {
  const heater =
    e.heaterVolts != null && e.heaterAmps != null
      ? { ...(data.heater ?? {}), volts: e.heaterVolts, amps: e.heaterAmps }
      : data.heater === null
        ? null
        : undefined;
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
            ...(prior?.kind === "amplifier" && prior.cathodeResistorOhms != null && e.gridVolts == null
              ? { cathodeResistorOhms: prior.cathodeResistorOhms }
              : {}),
            ...(e.screenVolts != null ? { screenVolts: e.screenVolts } : {}),
            ...(e.mu != null ? { mu: e.mu } : {}),
            ...(e.gmMicromho != null ? { gmMicromho: e.gmMicromho } : {}),
            ...(e.plateCurrentMa != null ? { plateCurrentMa: e.plateCurrentMa } : {}),
            ...(e.rpOhms != null ? { rpOhms: e.rpOhms } : {}),
          };
  const next: ValveTypeData = { ...data, heater: heater as ValveTypeData["heater"] };
  const mutable = next as { -readonly [K in keyof ValveTypeData]: ValveTypeData[K] };
  if (heater === undefined) delete mutable.heater;
  // A corrected row needs checking again.
  delete mutable.verification;
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
export async function editReferenceType(
  actorId: string,
  designation: string,
  expectedRevision: number,
  e: ReferenceEditInput,
) {
  const s = db();
  return s.transaction(async (t) => {
    const row = await ValveType.findByPk(designation, { lock: t.LOCK.UPDATE, transaction: t });
    if (!row) throw new ApiError("not_found", `No reference row for ${designation}`);
    if (row.revision !== expectedRevision) {
      throw new ApiError(
        "conflict",
        `Someone saved revision ${row.revision} since you opened it; reload and apply your change again`,
      );
    }
    const before = { ...row.data, source: row.source };
    const data = applyEdit(row.data, e);
    const revision = row.revision + 1;
    await row.update({ data, source: e.source, revision, updatedBy: actorId }, { transaction: t });
    await ValveTypeRevision.create(
      { designation, revision, changedBy: actorId, reason: e.reason, before, after: { ...data, source: e.source } },
      { transaction: t },
    );
    return present(row);
  });
}
