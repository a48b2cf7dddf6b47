import { QueryTypes, type Transaction } from "sequelize";
import { aggregateLot } from "../../catalogue/entry";
import { summariseLot } from "../../lots/summary";
import { db, LotItem } from "../../../models";
import { toDomainItem } from "../lot-summary";
import { presentItem } from "../lots";
import { currentReferenceTable } from "../reference-table";
import { consignorRecord } from "../track-record";

type LotRow = {
  id: string;
  title: string;
  provenance: string;
  shipping_origin: string;
  state: string;
  consignor_id: string;
  approved_at: Date | null;
  created_at: Date;
  estimate_low_cents: number | null;
  estimate_high_cents: number | null;
  sale_lot_id: string | null;
  phase: string | null;
  starts_at: Date | null;
  closes_at: Date | null;
  closed_at: Date | null;
  hammer_cents: number | null;
  thumb: string | null;
};

/**
 * Write (or remove) the lot's catalogue entry from the lot as it stands: what its items add up to, its place
 * in a sale, its first photo. Called whenever any of those changes (approval, amendment, scheduling, close,
 * photos); a lot the public may not see has no entry. Idempotent.
 */
export async function refreshCatalogueEntry(lotId: string, t?: Transaction): Promise<void> {
  const [lot] = await db().query<LotRow>(
    `SELECT l.id, l.title, l.provenance, l.shipping_origin, l.state, l.consignor_id, l.approved_at, l.created_at, l.estimate_low_cents, l.estimate_high_cents,
            sl.id AS sale_lot_id, sl.phase, s.starts_at, sl.closes_at, sl.closed_at, sl.hammer_cents,
            (SELECT p.id FROM lot_photos p WHERE p.lot_id = l.id ORDER BY p.created_at, p.id LIMIT 1) AS thumb
       FROM lots l
       LEFT JOIN LATERAL (SELECT id, sale_id, phase, closes_at, closed_at, hammer_cents FROM sale_lots WHERE lot_id = l.id ORDER BY created_at DESC LIMIT 1) sl ON true -- the latest offer (a lot may be relisted)
       LEFT JOIN sales s ON s.id = sl.sale_id
      WHERE l.id = :lotId`,
    { replacements: { lotId }, type: QueryTypes.SELECT, transaction: t },
  );
  if (!lot || lot.state !== "approved") {
    await db().query(`DELETE FROM catalogue_entries WHERE lot_id = :lotId`, {
      replacements: { lotId },
      transaction: t,
    });
    return;
  }
  const reference = await currentReferenceTable();
  const items = (await LotItem.findAll({ where: { lotId }, order: [["position", "ASC"]], transaction: t }))
    .map(presentItem)
    .map((i) => toDomainItem(reference, i));
  const a = aggregateLot(items, summariseLot(items, { reference, comparables: [] }));
  const stage = lot.phase === "sold" ? "sold" : lot.phase === "open" ? "in-sale" : "listed";
  const record = await consignorRecord(lot.consignor_id);
  await db().query(
    `INSERT INTO catalogue_entries (lot_id, title, stage, sale_lot_id, sale_starts_at, closes_at, sold_at, hammer_cents, listed_at, estimate_low_cents, estimate_high_cents,
        tubes, designations, families, conditions, maker_bases, grades, hazards, tested, vacuum_loss_tubes, pairs, quads, consignor_upheld, thumb_photo_id, search_text, updated_at)
     VALUES (:lotId, :title, :stage, :saleLotId, :startsAt, :closesAt, :soldAt, :hammer, :listedAt, :estLow, :estHigh,
        :tubes, array_remove(ARRAY[:designations]::varchar[], NULL), array_remove(ARRAY[:families]::varchar[], NULL), array_remove(ARRAY[:conditions]::varchar[], NULL), array_remove(ARRAY[:bases]::varchar[], NULL), array_remove(ARRAY[:grades]::varchar[], NULL), array_remove(ARRAY[:hazards]::varchar[], NULL),
        :tested, :vacuum, :pairs, :quads, :upheld, :thumb, :text, now())
     ON CONFLICT (lot_id) DO UPDATE SET title = EXCLUDED.title, stage = EXCLUDED.stage, sale_lot_id = EXCLUDED.sale_lot_id, sale_starts_at = EXCLUDED.sale_starts_at,
        closes_at = EXCLUDED.closes_at, sold_at = EXCLUDED.sold_at, hammer_cents = EXCLUDED.hammer_cents, listed_at = EXCLUDED.listed_at,
        estimate_low_cents = EXCLUDED.estimate_low_cents, estimate_high_cents = EXCLUDED.estimate_high_cents, tubes = EXCLUDED.tubes, designations = EXCLUDED.designations,
        families = EXCLUDED.families, conditions = EXCLUDED.conditions, maker_bases = EXCLUDED.maker_bases, grades = EXCLUDED.grades, hazards = EXCLUDED.hazards,
        tested = EXCLUDED.tested, vacuum_loss_tubes = EXCLUDED.vacuum_loss_tubes, pairs = EXCLUDED.pairs, quads = EXCLUDED.quads, consignor_upheld = EXCLUDED.consignor_upheld,
        thumb_photo_id = EXCLUDED.thumb_photo_id, search_text = EXCLUDED.search_text, updated_at = now()`,
    {
      replacements: {
        lotId,
        title: lot.title,
        stage,
        saleLotId: lot.sale_lot_id,
        startsAt: lot.starts_at,
        closesAt: stage === "in-sale" ? lot.closes_at : null,
        soldAt: stage === "sold" ? (lot.closed_at ?? lot.closes_at) : null,
        hammer: stage === "sold" ? lot.hammer_cents : null,
        listedAt: lot.approved_at ?? lot.created_at,
        estLow: lot.estimate_low_cents,
        estHigh: lot.estimate_high_cents,
        tubes: a.tubes,
        designations: orNone(a.designations),
        families: orNone(a.families),
        conditions: orNone(a.conditions),
        bases: orNone(a.makerBases),
        grades: orNone(a.grades),
        hazards: orNone(a.hazards),
        tested: a.tested,
        vacuum: a.vacuumLossTubes,
        pairs: a.pairs,
        quads: a.quads,
        upheld: record.tubesUpheld,
        thumb: lot.thumb,
        text: [lot.title, lot.provenance, lot.shipping_origin].join(" ").slice(0, 4000),
      },
      transaction: t,
    },
  );
}

/** `ARRAY[:x]` with an empty list would be `ARRAY[]`, which has no type: a list of one null, removed in SQL. */
function orNone(xs: string[]): string[] | null[] {
  return xs.length ? xs : [null];
}

/**
 * Bring the catalogue in step with the lots (at start, after a migration or a failed refresh): approved lots
 * with no entry get one, entries of lots no longer approved go, and `all` rewrites every entry.
 */
export async function repairCatalogue(all = false): Promise<number> {
  const ids = await db().query<{ id: string }>(
    `SELECT l.id FROM lots l WHERE l.state = 'approved' ${all ? "" : "AND NOT EXISTS (SELECT 1 FROM catalogue_entries e WHERE e.lot_id = l.id)"}`,
    { type: QueryTypes.SELECT },
  );
  for (const { id } of ids) await refreshCatalogueEntry(id);
  await db().query(
    `DELETE FROM catalogue_entries e WHERE NOT EXISTS (SELECT 1 FROM lots l WHERE l.id = e.lot_id AND l.state = 'approved')`,
  );
  return ids.length;
}
