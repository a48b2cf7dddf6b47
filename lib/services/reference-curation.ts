import type { Transaction } from "sequelize";
import { ApiError } from "../api/errors";
import { normaliseDesignation } from "../valves/designation";
import { parseReferenceCsv, referenceCsv, type ReferenceCsvError } from "../valves/reference-csv";
import type { NominalCharacteristics, ReferenceType } from "../valves/reference-row";
import { db, User, ValveType, ValveTypeRevision } from "../../models";
import type { ValveTypeData } from "../../models/ValveType";
import type { ReferenceAddInput } from "../validation/valves";

type Mutable<T> = { -readonly [K in keyof T]: T[K] };

const split = (r: ReferenceType): { designation: string; aliases: string[]; source: string; data: ValveTypeData } => {
  const { designation, aliases, source, ...data } = r;
  return { designation, aliases: [...aliases], source, data };
};

/** Names already used by another row (designation or alias), retired rows included. */
async function takenNames(names: readonly string[], except: string | null, t: Transaction): Promise<string[]> {
  const taken: string[] = [];
  for (const name of names) {
    const other = await ValveType.findByName(name, t);
    if (other && other.designation !== except) taken.push(`${name} (${other.designation})`);
  }
  return taken;
}

async function writeRevision(
  t: Transaction,
  designation: string,
  revision: number,
  actorId: string,
  reason: string,
  before: unknown,
  after: unknown,
) {
  await ValveTypeRevision.create(
    { designation, revision, changedBy: actorId, reason, before, after },
    { transaction: t },
  );
}

/**
 * The house adds a type: a row with whatever figures it has (empty columns
 * stay empty), its source, and revision 1 with who and why. A name already on
 * file, as designation or alias, is a conflict.
 */
export async function addReferenceType(actorId: string, input: ReferenceAddInput) {
  const n = normaliseDesignation(input.designation);
  if (!n.ok) throw new ApiError("validation_failed", n.message, { designation: n.message });
  const aliases = [
    ...new Set(
      input.aliases
        .split(/[;,]/)
        .map((a) => normaliseDesignation(a))
        .filter((a) => a.ok)
        .map((a) => a.value),
    ),
  ].filter((a) => a !== n.value);
  const row: ReferenceType = {
    designation: n.value,
    aliases,
    kind: input.kind,
    base: input.base,
    hazards: [],
    source: input.source,
    ...(input.coldCathode
      ? { heater: null }
      : input.heaterVolts !== null && input.heaterAmps !== null
        ? { heater: { volts: input.heaterVolts, amps: input.heaterAmps } }
        : {}),
    ...(input.note ? { note: input.note } : {}),
  };
  return db().transaction(async (t) => {
    const taken = await takenNames([row.designation, ...aliases], null, t);
    if (taken.length) throw new ApiError("conflict", `Already on file: ${taken.join(", ")}`);
    const { designation, source, data } = split(row);
    await ValveType.create({ designation, aliases, data, source, revision: 1, updatedBy: actorId }, { transaction: t });
    await writeRevision(t, designation, 1, actorId, input.reason, {}, { ...data, source });
    return { designation };
  });
}

/** Retire a type (no longer on file; kept with its history) or bring it back. */
export async function setReferenceRetired(actorId: string, designation: string, retired: boolean, reason: string) {
  return db().transaction(async (t) => {
    const row = await ValveType.findByPk(designation, { lock: t.LOCK.UPDATE, transaction: t });
    if (!row) throw new ApiError("not_found", `No reference row for ${designation}`);
    if ((row.retiredAt !== null) === retired) return { designation, retired, revision: row.revision };
    const revision = row.revision + 1;
    await row.update({ retiredAt: retired ? new Date() : null, revision, updatedBy: actorId }, { transaction: t });
    await writeRevision(
      t,
      designation,
      revision,
      actorId,
      `${retired ? "Retired" : "Back on file"}: ${reason}`,
      { retired: !retired },
      { retired },
    );
    return { designation, retired, revision };
  });
}

/** Record that the row was checked against a data sheet: which sheet, by whom (the house user), when (today). */
export async function verifyReferenceType(actorId: string, designation: string, against: string) {
  return db().transaction(async (t) => {
    const row = await ValveType.findByPk(designation, { lock: t.LOCK.UPDATE, transaction: t });
    if (!row) throw new ApiError("not_found", `No reference row for ${designation}`);
    const actor = await User.findByPk(actorId, { transaction: t });
    const verification = { against, by: actor?.displayName ?? "the house", on: new Date().toISOString().slice(0, 10) };
    const data = { ...row.data, verification };
    const revision = row.revision + 1;
    await row.update({ data, revision, updatedBy: actorId }, { transaction: t });
    await writeRevision(
      t,
      designation,
      revision,
      actorId,
      `Checked against ${against}`,
      { verification: row.data.verification ?? null },
      { verification },
    );
    return { designation, verification, revision };
  });
}

/** One line of an import preview. */
export interface ImportLine {
  line: number;
  designation: string;
  action: "add" | "change" | "unchanged";
}

/**
 * Keeps what the CSV does not carry (hazards, large envelope, year, cathode-resistor bias, non-amplifier
 * figures), and whatever a file leaves out by omitting its columns (heater, figures, check, note).
 */
function merge(prior: ReferenceType, next: ReferenceType, columns: readonly string[]): ReferenceType {
  const has = (c: string) => columns.includes(c);
  const pc = prior.characteristics;
  let characteristics: NominalCharacteristics | undefined = has("plate_volts")
    ? next.characteristics
    : prior.characteristics;
  if (!characteristics && pc && pc.kind !== "amplifier") characteristics = pc;
  if (characteristics?.kind === "amplifier" && pc?.kind === "amplifier") {
    characteristics = {
      ...characteristics,
      ...(pc.cathodeResistorOhms !== undefined && characteristics.gridVolts === undefined
        ? { cathodeResistorOhms: pc.cathodeResistorOhms }
        : {}),
      ...(pc.approximate ? { approximate: true } : {}),
    };
  }
  const out: Mutable<ReferenceType> = { ...prior, ...next, hazards: prior.hazards };
  if (characteristics) out.characteristics = characteristics;
  else delete out.characteristics;
  const kept = {
    heater: has("heater_volts") || has("cold_cathode"),
    verification: has("verified_against"),
    note: has("note"),
  };
  for (const k of ["heater", "verification", "note"] as const) {
    if (!kept[k]) {
      if (k in prior) (out as Record<string, unknown>)[k] = prior[k];
      else delete out[k];
    } else if (!(k in next)) delete out[k];
  }
  if (!has("aliases")) out.aliases = prior.aliases;
  return out;
}

const same = (a: ReferenceType, b: ReferenceType) => canonical(a) === canonical(b);

function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(",")}]`;
  if (v && typeof v === "object")
    return `{${Object.keys(v)
      .sort()
      .map((k) => `${k}:${canonical((v as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  return JSON.stringify(v);
}

/**
 * Import a reference CSV. Every line is checked first; any error refuses the
 * whole file, with line numbers. `apply: false` previews (add, change,
 * unchanged per line); `apply: true` writes every add and change in one
 * transaction, each with a revision, and skips unchanged rows, so importing
 * the same file twice changes nothing the second time.
 */
export async function importReferenceCsv(
  actorId: string,
  csv: string,
  apply: boolean,
  reason: string,
): Promise<{ applied: boolean; lines: ImportLine[]; errors: ReferenceCsvError[] }> {
  const parsed = parseReferenceCsv(csv);
  if (parsed.errors.length) return { applied: false, lines: [], errors: parsed.errors };
  return db().transaction(async (t) => {
    const lines: ImportLine[] = [];
    const errors: ReferenceCsvError[] = [];
    for (const { line, row } of parsed.rows) {
      const existing = await ValveType.findByPk(row.designation, {
        lock: apply ? t.LOCK.UPDATE : undefined,
        transaction: t,
      });
      const taken = await takenNames(row.aliases, row.designation, t);
      if (taken.length)
        errors.push({ line, column: "aliases", message: `Already on file for another type: ${taken.join(", ")}` });
      if (!existing) {
        const other = await ValveType.findByName(row.designation, t);
        if (other)
          errors.push({
            line,
            column: "designation",
            message: `${row.designation} is an alias of ${other.designation}`,
          });
      }
      const next = existing ? merge(existing.toReference(), row, parsed.columns) : row;
      const action: ImportLine["action"] = !existing
        ? "add"
        : same(existing.toReference(), next)
          ? "unchanged"
          : "change";
      lines.push({ line, designation: row.designation, action });
      if (!apply || errors.length || action === "unchanged") continue;
      const { designation, aliases, source, data } = split(next);
      if (existing) {
        const before = { ...existing.data, source: existing.source, aliases: existing.aliases };
        const revision = existing.revision + 1;
        await existing.update({ aliases, data, source, revision, updatedBy: actorId }, { transaction: t });
        await writeRevision(t, designation, revision, actorId, `CSV import: ${reason}`, before, {
          ...data,
          source,
          aliases,
        });
      } else {
        await ValveType.create(
          { designation, aliases, data, source, revision: 1, updatedBy: actorId },
          { transaction: t },
        );
        await writeRevision(t, designation, 1, actorId, `CSV import: ${reason}`, {}, { ...data, source, aliases });
      }
    }
    if (errors.length) {
      if (apply)
        throw new ApiError(
          "validation_failed",
          `${errors.length} line(s) refused; nothing was imported`,
          undefined,
          undefined,
          { errors },
        );
      return { applied: false, lines: [], errors };
    }
    return { applied: apply, lines, errors: [] };
  });
}

/** The whole table (on file, retired rows left out) as CSV. */
export async function exportReferenceCsv(): Promise<string> {
  db();
  return referenceCsv((await ValveType.onFile()).map((r) => r.toReference()));
}
