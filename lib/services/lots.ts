import { Op, QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { featuresFromText, featuresToText } from "../valves/construction-text";
import { decodeDesignation } from "../valves/designation";
import type { ItemInput, LotDetailsInput } from "../validation/lots";
import { db, Lot, LotEvent, LotItem, LotPhoto, User } from "../../models";
import type { LotState } from "../../models/Lot";
import { assertCanView, assertConsignorCanEdit, seesReserve } from "./lot-access";
import { currentReferenceTable } from "./reference-table";
import type { SaleLotRow } from "./sale-lot-rows";
import type { ReferenceTable } from "../valves/reference-table";
import { typeFamily } from "../lots/type-family";
import { hazardsForType } from "../valves/hazards";
import type { HazardKind } from "../valves/index-types";

/**
 * What a designation becomes when typed: normalised where possible. `known`
 * is false only for the third answer (not a designation: "check type");
 * types on file and types that decode by their scheme are not flagged.
 */
export function normaliseTyped(table: ReferenceTable, typed: string): { designation: string; known: boolean } {
  const d = decodeDesignation(table, typed);
  if (d.ok) return { designation: d.normalised, known: true };
  return { designation: (d.normalised ?? typed.trim().toUpperCase()).slice(0, 40), known: false };
}

/** Known construction features in our vocabulary's spelling; anything else kept as typed. */
export function normaliseFeatures(record: Record<string, string>): Record<string, string> {
  const { features, ignored } = featuresFromText(record);
  const kept = Object.fromEntries(
    Object.entries(record).filter(([k, v]) => v.trim() !== "" && ignored.some((x) => x === k || x.startsWith(`${k}=`))),
  );
  return { ...kept, ...featuresToText(features) };
}

export type ItemView = ReturnType<typeof presentItem>;

export function presentItem(i: LotItem) {
  return {
    id: i.id,
    position: i.position,
    designationTyped: i.designationTyped,
    designation: i.designation,
    designationKnown: i.designationKnown,
    quantity: i.quantity,
    labelBrand: i.labelBrand,
    makerName: i.makerName,
    makerBasis: i.makerBasis,
    sourceCode: i.sourceCode,
    dateCode: i.dateCode,
    features: i.features,
    condition: i.condition,
    vacuumLoss: i.vacuumLoss,
    soldAsSet: i.soldAsSet,
    defects: i.defects,
    hazards: i.hazards,
    readings: i.readings,
    notes: i.notes,
  };
}

/**
 * An item with what the house's current table says about it: whether to ask
 * "check type" (only for the third answer), its family label, and its
 * hazards beyond high voltage and glass (the type's own and those declared).
 */
export function withReference(table: ReferenceTable, i: ItemView) {
  return {
    ...i,
    designationKnown: normaliseTyped(table, i.designationTyped).known,
    familyLabel: typeFamily(table, i.designation).label,
    typeHazards: hazardsForType(table, i.designation, i.hazards as HazardKind[]).notices.filter(
      (n) => n.certainty !== "always",
    ),
  };
}

/** An item of getLot: the stored item with the reference table's reading of it. */
export type LotItemView = ReturnType<typeof withReference>;

export type LotView = ReturnType<typeof presentLot>;

/** A lot as the viewer may see it: the reserve only for the house and the consignor. */
export function presentLot(lot: Lot, viewer: Viewer | null) {
  const reserve = seesReserve(viewer, lot);
  return {
    id: lot.id,
    title: lot.title,
    provenance: lot.provenance,
    shippingOrigin: lot.shippingOrigin,
    testerKind: lot.testerKind,
    testerNotes: lot.testerNotes,
    state: lot.state as LotState,
    consignorId: lot.consignorId,
    consignorName: viewer ? (lot.consignor?.displayName ?? null) : null, // the public reads the evidence, not who consigned it
    estimateLowCents: lot.estimateLowCents,
    estimateHighCents: lot.estimateHighCents,
    reserveCents: reserve ? lot.reserveCents : undefined,
    submittedAt: lot.submittedAt?.toISOString() ?? null,
    approvedAt: lot.approvedAt?.toISOString() ?? null,
    extraReview: lot.extraReview,
    updatedAt: lot.updatedAt.toISOString(),
    createdAt: lot.createdAt.toISOString(),
  };
}

/** A consignor starts a lot as a draft. */
export async function createLot(viewer: Viewer, input: LotDetailsInput): Promise<LotView> {
  const s = db();
  const lot = await s.transaction(async (t) => {
    const l = await Lot.create({ ...input, consignorId: viewer.id }, { transaction: t });
    await LotEvent.create({ lotId: l.id, actorId: viewer.id, kind: "created" }, { transaction: t });
    return l;
  });
  return presentLot(lot, viewer);
}

/** The consignor edits the lot's details while it is theirs to change. */
export async function updateLotDetails(viewer: Viewer, lotId: string, input: LotDetailsInput): Promise<LotView> {
  const s = db();
  return s.transaction(async (t) => {
    const lot = assertConsignorCanEdit(viewer, await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t }));
    await lot.update(input, { transaction: t });
    return presentLot(lot, viewer);
  });
}

/** One lot with its items, photos and trail, as the viewer may see it. */
export async function getLot(viewer: Viewer | null, lotId: string) {
  db();
  if (!/^[0-9a-f-]{36}$/i.test(lotId)) throw new ApiError("not_found", "No such lot");
  const lot = assertCanView(
    viewer,
    await Lot.findByPk(lotId, {
      include: [{ model: User, as: "consignor", attributes: ["id", "displayName"] }],
    }),
  );
  const [items, photos, events] = await Promise.all([
    LotItem.findAll({ where: { lotId }, order: [["position", "ASC"]] }),
    LotPhoto.findAll({ where: { lotId }, order: [["createdAt", "ASC"]] }),
    LotEvent.findAll({
      where: { lotId },
      order: [
        ["createdAt", "ASC"],
        ["id", "ASC"],
      ],
      include: [{ model: User, as: "actor", attributes: ["displayName"] }],
    }),
  ]);
  // "check type" follows the house's current table, not the table when the item was typed.
  const table = await currentReferenceTable();
  return {
    lot: presentLot(lot, viewer),
    items: items.map((i) => withReference(table, presentItem(i))),
    photos: photos.map((p) => ({ id: p.id, itemId: p.itemId, caption: p.caption, width: p.width, height: p.height })),
    events: events.map((e) => ({
      id: e.id,
      kind: e.kind,
      comment: e.comment,
      details: e.details,
      at: e.createdAt.toISOString(),
      actor: viewer ? (e.actor?.displayName ?? null) : null,
    })),
  };
}

/** Lots listed for a viewer: the consignor's own, the house's queue, or approved lots for dealers. */
export async function listLots(viewer: Viewer, scope: "mine" | "approved" | "review") {
  db();
  const where =
    scope === "mine"
      ? { consignorId: viewer.id }
      : scope === "approved"
        ? { state: "approved" }
        : { state: { [Op.in]: ["in-review"] } };
  const lots = await Lot.findAll({
    where,
    order: scope === "review" ? [["submittedAt", "ASC"]] : [["updatedAt", "DESC"]],
    limit: 500,
    include: [{ model: User, as: "consignor", attributes: ["id", "displayName"] }],
  });
  const counts = lots.length
    ? await db().query<{ lot_id: string; tubes: string; lines: string }>(
        `SELECT lot_id, SUM(quantity) AS tubes, COUNT(*) AS lines FROM lot_items WHERE lot_id IN (:ids) GROUP BY lot_id`,
        { replacements: { ids: lots.map((l) => l.id) }, type: QueryTypes.SELECT },
      )
    : [];
  const by = new Map(counts.map((c) => [c.lot_id, { tubes: Number(c.tubes), lines: Number(c.lines) }]));
  return lots.map((l) => ({
    ...presentLot(l, viewer),
    tubes: by.get(l.id)?.tubes ?? 0,
    lines: by.get(l.id)?.lines ?? 0,
  }));
}

function itemValues(table: ReferenceTable, input: ItemInput) {
  const { designation, known } = normaliseTyped(table, input.designation);
  return {
    designationTyped: input.designation,
    designation,
    designationKnown: known,
    quantity: input.quantity,
    labelBrand: input.labelBrand,
    makerName: input.makerName || null,
    makerBasis: input.makerBasis,
    sourceCode: input.sourceCode || null,
    dateCode: input.dateCode || null,
    features: normaliseFeatures(input.features),
    condition: input.condition,
    vacuumLoss: input.vacuumLoss,
    soldAsSet: input.soldAsSet ?? false,
    defects: input.defects,
    hazards: input.hazards,
    readings: input.readings,
    notes: input.notes,
  };
}

/** Add an item to the consignor's lot; unknown designations are kept and flagged, never refused. */
export async function addItem(viewer: Viewer, lotId: string, input: ItemInput): Promise<ItemView> {
  const s = db();
  const table = await currentReferenceTable();
  return s.transaction(async (t) => {
    assertConsignorCanEdit(viewer, await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t }));
    const max = (await LotItem.max("position", { where: { lotId }, transaction: t })) as number | null;
    const item = await LotItem.create(
      { lotId, position: (max ?? 0) + 1, ...itemValues(table, input) },
      { transaction: t },
    );
    return presentItem(item);
  });
}

export async function updateItem(viewer: Viewer, lotId: string, itemId: string, input: ItemInput): Promise<ItemView> {
  const s = db();
  const table = await currentReferenceTable();
  return s.transaction(async (t) => {
    assertConsignorCanEdit(viewer, await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t }));
    const item = await LotItem.findOne({ where: { id: itemId, lotId }, transaction: t });
    if (!item) throw new ApiError("not_found", "No such item in this lot");
    await item.update(itemValues(table, input), { transaction: t });
    return presentItem(item);
  });
}

export async function removeItem(viewer: Viewer, lotId: string, itemId: string): Promise<void> {
  const s = db();
  await s.transaction(async (t) => {
    assertConsignorCanEdit(viewer, await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t }));
    const n = await LotItem.destroy({ where: { id: itemId, lotId }, transaction: t });
    if (!n) throw new ApiError("not_found", "No such item in this lot");
  });
}

/** The sale a lot is (or was) offered in, if any: for the lot page's way to bidding. */
export async function saleLotOf(lotId: string): Promise<{
  saleLotId: string;
  saleId: string;
  saleTitle: string;
  phase: string;
  hammerCents: number | null;
  closedAt: string | null;
} | null> {
  const [row] = await db().query<
    Pick<SaleLotRow, "id" | "sale_id" | "phase" | "hammer_cents" | "closed_at"> & { title: string } // the sale's title
  >(
    `SELECT sl.id, sl.sale_id, s.title, sl.phase, sl.hammer_cents, sl.closed_at FROM sale_lots sl JOIN sales s ON s.id = sl.sale_id WHERE sl.lot_id = :lotId ORDER BY sl.created_at DESC LIMIT 1`,
    { replacements: { lotId }, type: QueryTypes.SELECT },
  );
  return row
    ? {
        saleLotId: row.id,
        saleId: row.sale_id,
        saleTitle: row.title,
        phase: row.phase,
        hammerCents: row.hammer_cents,
        closedAt: row.closed_at?.toISOString() ?? null,
      }
    : null;
}
