import { Op } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { typeFamily } from "../lots/type-family";
import {
  buildReferenceProfiles,
  rankMakers,
  unconfirmedShelf,
  type AttributableItem,
  type MakerCandidate,
  type ReferenceProfile,
} from "../valves/attribution";
import { featuresFromText, featuresToText } from "../valves/construction-text";
import { readDateCode } from "../valves/date-code";
import { decodeDesignation } from "../valves/designation";
import { splitJoinedCode } from "../valves/source-code";
import type { AttributionQuery, ShelfTubeInput } from "../validation/shelf";
import { db, Lot, LotItem, Maker, ShelfTube } from "../../models";
import { lookupRegisteredCode } from "./makers";
import { currentReferenceTable } from "./reference-table";
import type { ReferenceTable } from "../valves/reference-table";

/** A year for era checks: only when the date code reads unambiguously. */
function yearOf(dateCode: string | null | undefined): number | undefined {
  if (!dateCode) return undefined;
  const r = readDateCode(dateCode);
  return r.ok && r.readings.length === 1 ? r.readings[0]!.year : undefined;
}

const familyOf = (table: ReferenceTable, designation: string) => typeFamily(table, designation).key;

/**
 * Every tube whose maker a source code confirms, from dealers' shelves and
 * from approved lots, as reference examples. Built fresh on each call, so
 * each newly confirmed tube sharpens the profiles at once.
 */
export async function referenceProfiles(): Promise<ReferenceProfile[]> {
  const table = await currentReferenceTable();
  db();
  const [shelf, items] = await Promise.all([
    ShelfTube.findAll({
      where: { basis: "source-code-confirmed" },
      include: [{ model: Maker, as: "maker", attributes: ["name"] }],
      limit: 20_000,
    }),
    LotItem.findAll({
      where: { makerBasis: "source-code-confirmed", makerName: { [Op.ne]: null } },
      include: [{ model: Lot, attributes: [], where: { state: "approved" }, required: true }],
      limit: 20_000,
    }),
  ]);
  const examples: AttributableItem[] = [
    ...shelf
      .filter((t) => t.maker)
      .map((t) => ({
        itemId: t.id,
        typeFamily: familyOf(table, t.designation),
        year: yearOf(t.dateCode),
        features: featuresFromText(t.features as Record<string, string>).features,
        basis: "source-code-confirmed" as const,
        makerId: t.maker!.name,
        makerName: t.maker!.name,
      })),
    ...items.map((i) => ({
      itemId: i.id,
      typeFamily: familyOf(table, i.designation),
      year: yearOf(i.dateCode),
      features: featuresFromText(i.features).features,
      basis: "source-code-confirmed" as const,
      makerId: i.makerName!,
      makerName: i.makerName!,
    })),
  ];
  return buildReferenceProfiles(examples);
}

/** Rank makers for a set of features (POST /api/valves/attribution). */
export async function rankForFeatures(q: AttributionQuery) {
  const table = await currentReferenceTable();
  const text = Object.fromEntries(
    Object.entries(q.features).map(([k, v]) => [k, typeof v === "boolean" ? (v ? "yes" : "no") : String(v)]),
  );
  const { features, ignored } = featuresFromText(text);
  const d = q.designation ? decodeDesignation(table, q.designation) : null;
  const family = d?.ok ? familyOf(table, d.normalised) : undefined;
  const profiles = await referenceProfiles();
  const candidates = rankMakers(features, profiles, { typeFamily: family, year: q.year });
  return {
    features,
    ignored,
    typeFamily: family ?? null,
    profilesCompared: profiles.filter((p) => !family || p.typeFamily === family).length,
    candidates,
  };
}

export type ShelfTubeView = {
  id: string;
  designation: string;
  labelBrand: string;
  sourceCode: string | null;
  dateCode: string | null;
  features: Record<string, string>;
  basis: string;
  makerName: string | null;
  notes: string;
  createdAt: string;
  best: MakerCandidate | null;
  proposed: boolean;
};

function present(t: ShelfTube, best: MakerCandidate | undefined, proposed: boolean): ShelfTubeView {
  return {
    id: t.id,
    designation: t.designation,
    labelBrand: t.labelBrand,
    sourceCode: t.sourceCode,
    dateCode: t.dateCode,
    features: t.features as Record<string, string>,
    basis: t.basis,
    makerName: t.maker?.name ?? null,
    notes: t.notes,
    createdAt: t.createdAt.toISOString(),
    best: best ?? null,
    proposed,
  };
}

/**
 * Put a tube on the viewer's shelf. A source code the registry knows
 * confirms its maker at once (and the tube becomes a reference example);
 * otherwise it waits, unconfirmed. A retried request adds nothing.
 */
export async function addShelfTube(viewer: Viewer, input: ShelfTubeInput): Promise<ShelfTubeView> {
  const table = await currentReferenceTable();
  db();
  if (input.clientKey) {
    const again = await ShelfTube.findOne({
      where: { ownerId: viewer.id, clientKey: input.clientKey },
      include: [{ model: Maker, as: "maker" }],
    });
    if (again) return present(again, undefined, false);
  }
  const d = decodeDesignation(table, input.designation);
  const designation = d.ok ? d.normalised : input.designation.trim().toUpperCase();
  let sourceCode = input.sourceCode || null;
  let dateCode = input.dateCode || null;
  const joined = sourceCode ? splitJoinedCode(sourceCode) : null;
  if (joined) {
    sourceCode = joined.sourcePart;
    dateCode ??= joined.datePart;
  }
  let makerId: number | null = null;
  if (sourceCode) {
    const found = await lookupRegisteredCode(sourceCode);
    if (found.ok && found.found) {
      const maker = await Maker.findOne({ where: { name: found.entries[0]!.makerName } });
      makerId = maker?.id ?? null;
    }
  }
  const known = featuresFromText(input.features);
  const t = await ShelfTube.create({
    ownerId: viewer.id,
    designation,
    labelBrand: input.labelBrand,
    sourceCode,
    dateCode,
    features: featuresToText(known.features),
    notes: input.notes,
    clientKey: input.clientKey,
    basis: makerId ? "source-code-confirmed" : "unconfirmed",
    makerId,
  });
  await t.reload({ include: [{ model: Maker, as: "maker" }] });
  return present(t, undefined, false);
}

/** The viewer's shelf: unconfirmed tubes with their best candidate, those now strong enough proposed first. */
export async function listShelf(
  viewer: Viewer,
): Promise<{ proposed: ShelfTubeView[]; waiting: ShelfTubeView[]; confirmed: ShelfTubeView[]; profiles: number }> {
  const table = await currentReferenceTable();
  db();
  const [tubes, profiles] = await Promise.all([
    ShelfTube.findAll({
      where: { ownerId: viewer.id },
      include: [{ model: Maker, as: "maker" }],
      order: [["createdAt", "DESC"]],
      limit: 2000,
    }),
    referenceProfiles(),
  ]);
  const open = tubes.filter((t) => t.basis === "unconfirmed");
  const split = unconfirmedShelf(
    open.map((t) => ({
      itemId: t.id,
      typeFamily: familyOf(table, t.designation),
      year: yearOf(t.dateCode),
      features: featuresFromText(t.features as Record<string, string>).features,
      basis: "unconfirmed" as const,
    })),
    profiles,
  );
  const byId = new Map(tubes.map((t) => [t.id, t]));
  return {
    proposed: split.proposals.map((p) => present(byId.get(p.itemId)!, p.candidate, true)),
    waiting: split.remaining.map((r) => present(byId.get(r.itemId)!, r.best, false)),
    confirmed: tubes.filter((t) => t.basis !== "unconfirmed").map((t) => present(t, undefined, false)),
    profiles: profiles.length,
  };
}

/** One shelf tube with every candidate maker, the features that agree and those that conflict. */
export async function shelfTube(viewer: Viewer, id: string) {
  const table = await currentReferenceTable();
  db();
  const t = await ShelfTube.findOne({ where: { id, ownerId: viewer.id }, include: [{ model: Maker, as: "maker" }] });
  if (!t) throw new ApiError("not_found", "No such tube on your shelf");
  const profiles = await referenceProfiles();
  const family = familyOf(table, t.designation);
  const candidates = rankMakers(featuresFromText(t.features as Record<string, string>).features, profiles, {
    typeFamily: family,
    year: yearOf(t.dateCode),
  });
  return {
    tube: present(t, candidates[0], false),
    candidates,
    profilesCompared: profiles.filter((p) => p.typeFamily === family).length,
  };
}

/** Accept the construction match: the tube moves off the unconfirmed shelf (it never becomes a reference example). */
export async function acceptMatch(viewer: Viewer, id: string, makerName: string): Promise<ShelfTubeView> {
  db();
  const t = await ShelfTube.findOne({ where: { id, ownerId: viewer.id } });
  if (!t) throw new ApiError("not_found", "No such tube on your shelf");
  const { candidates } = await shelfTube(viewer, id);
  const chosen = candidates.find((c) => c.makerName === makerName);
  if (!chosen || chosen.confidence === "low")
    throw new ApiError("conflict", "Only a medium or high construction match can be accepted");
  const maker = await Maker.findOne({ where: { name: makerName } });
  await t.update({
    basis: "construction-matched",
    makerId: maker?.id ?? null,
    notes: `${t.notes}${t.notes ? " · " : ""}Matched by construction to ${makerName} (${chosen.confidence})`.slice(
      0,
      2000,
    ),
  });
  await t.reload({ include: [{ model: Maker, as: "maker" }] });
  return present(t, chosen, false);
}
