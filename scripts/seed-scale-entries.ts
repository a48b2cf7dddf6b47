// Part of npm run seed:scale (run by scripts/seed-scale.ts with DATABASE_URL set to the scale database): the
// catalogue entries, worked out by the same pure code a listing uses, and the want lists. Not for other use.
import { loadEnvConfig } from "@next/env";
loadEnvConfig(process.cwd());
import { QueryTypes } from "sequelize";
import { aggregateLot } from "../lib/catalogue/entry";
import { CLOSENESS, wantedDesignations, type WantCriteria } from "../lib/catalogue/want-list";
import { summariseLot } from "../lib/lots/summary";
import { toDomainItem } from "../lib/services/lot-summary";
import type { ItemView } from "../lib/services/lots";
import { currentReferenceTable } from "../lib/services/reference-table";
import { db } from "../models";

const BATCH = 2_000;

type ItemRow = {
  lot_id: string;
  id: string;
  position: number;
  designation_typed: string;
  designation: string;
  designation_known: boolean;
  quantity: number;
  label_brand: string;
  maker_name: string | null;
  maker_basis: ItemView["makerBasis"];
  condition: ItemView["condition"];
  vacuum_loss: boolean;
  hazards: string[];
  readings: ItemView["readings"];
};

async function entries(): Promise<number> {
  const reference = await currentReferenceTable();
  const lots = await db().query<{ id: string }>(`SELECT id FROM lots ORDER BY id`, { type: QueryTypes.SELECT });
  for (let i = 0; i < lots.length; i += BATCH) {
    const ids = lots.slice(i, i + BATCH).map((l) => l.id);
    const rows = await db().query<ItemRow>(
      `SELECT lot_id, id, position, designation_typed, designation, designation_known, quantity, label_brand, maker_name, maker_basis, condition, vacuum_loss, hazards, readings
         FROM lot_items WHERE lot_id IN (:ids) ORDER BY lot_id, position`,
      { replacements: { ids }, type: QueryTypes.SELECT },
    );
    const byLot = new Map<string, ItemRow[]>();
    for (const r of rows) byLot.set(r.lot_id, [...(byLot.get(r.lot_id) ?? []), r]);
    const computed = ids.map((id) => {
      const items = (byLot.get(id) ?? []).map((r) =>
        toDomainItem(reference, {
          id: r.id,
          position: r.position,
          designationTyped: r.designation_typed,
          designation: r.designation,
          designationKnown: r.designation_known,
          quantity: r.quantity,
          labelBrand: r.label_brand,
          makerName: r.maker_name,
          makerBasis: r.maker_basis,
          sourceCode: null,
          dateCode: null,
          features: {},
          condition: r.condition,
          vacuumLoss: r.vacuum_loss,
          soldAsSet: false,
          defects: [],
          hazards: r.hazards,
          readings: r.readings,
          notes: "",
        } as ItemView),
      );
      return { lot_id: id, ...aggregateLot(items, summariseLot(items, { reference, comparables: [] })) };
    });
    await db().query(
      `INSERT INTO catalogue_entries (lot_id, title, stage, sale_lot_id, sale_starts_at, closes_at, sold_at, hammer_cents, listed_at, estimate_low_cents, estimate_high_cents,
          tubes, designations, families, conditions, maker_bases, grades, hazards, tested, vacuum_loss_tubes, pairs, quads, consignor_upheld, thumb_photo_id, search_text, updated_at)
       SELECT l.id, l.title, CASE sl.phase WHEN 'sold' THEN 'sold' WHEN 'open' THEN 'in-sale' ELSE 'listed' END, sl.id, s.starts_at,
              CASE WHEN sl.phase = 'open' THEN sl.closes_at END, CASE WHEN sl.phase = 'sold' THEN sl.closed_at END, CASE WHEN sl.phase = 'sold' THEN sl.hammer_cents END,
              l.approved_at, l.estimate_low_cents, l.estimate_high_cents, a.tubes,
              ARRAY(SELECT jsonb_array_elements_text(a.designations)), ARRAY(SELECT jsonb_array_elements_text(a.families)), ARRAY(SELECT jsonb_array_elements_text(a.conditions)),
              ARRAY(SELECT jsonb_array_elements_text(a."makerBases")), ARRAY(SELECT jsonb_array_elements_text(a.grades)), ARRAY(SELECT jsonb_array_elements_text(a.hazards)),
              a.tested, a."vacuumLossTubes", a.pairs, a.quads, 0,
              (SELECT p.id FROM lot_photos p WHERE p.lot_id = l.id LIMIT 1), l.title || ' ' || l.provenance || ' ' || l.shipping_origin, now()
         FROM jsonb_to_recordset(:rows::jsonb) AS a(lot_id uuid, tubes int, designations jsonb, families jsonb, conditions jsonb, "makerBases" jsonb, grades jsonb, hazards jsonb,
                                                  tested boolean, "vacuumLossTubes" int, pairs int, quads int)
         JOIN lots l ON l.id = a.lot_id LEFT JOIN sale_lots sl ON sl.lot_id = l.id LEFT JOIN sales s ON s.id = sl.sale_id`,
      { replacements: { rows: JSON.stringify(computed) } },
    );
    if ((i / BATCH) % 10 === 0)
      console.log(
        `seed:scale   catalogue entries ${Math.min(i + BATCH, lots.length).toLocaleString("en")} of ${lots.length.toLocaleString("en")}`,
      );
  }
  return lots.length;
}

async function wantLists(count: number): Promise<void> {
  const reference = await currentReferenceTable();
  const dealers = await db().query<{ id: string }>(`SELECT id FROM users WHERE 'dealer' = ANY(roles) ORDER BY email`, {
    type: QueryTypes.SELECT,
  });
  const types = (
    await db().query<{ designation: string }>(`SELECT DISTINCT designation FROM lot_items`, { type: QueryTypes.SELECT })
  )
    .map((t) => t.designation)
    .sort();
  const rows = Array.from({ length: count }, (_, k) => {
    const criteria: WantCriteria = {
      designation: types[(k * 7) % types.length]!,
      closeness: CLOSENESS[k % 4]!,
      minQuantity: 1 + (k % 8),
      conditions: k % 3 === 0 ? ["new-old-stock", "new-in-box"] : [],
      makerBases: [],
      noVacuumLoss: k % 2 === 0,
      maxEstimateCents: k % 5 === 0 ? 20_000 + (k % 7) * 10_000 : null,
    };
    return {
      dealer: dealers[k % dealers.length]!.id,
      name: `Scale want list ${k + 1}`,
      criteria,
      designations: [...wantedDesignations(criteria, reference).keys()],
      max: criteria.maxEstimateCents,
      paused: k % 20 === 0,
    };
  });
  for (let i = 0; i < rows.length; i += BATCH) {
    await db().query(
      `INSERT INTO want_lists (id, dealer_id, name, criteria, designations, max_estimate_cents, paused, created_at, updated_at)
       SELECT gen_random_uuid(), w.dealer, w.name, w.criteria, ARRAY(SELECT jsonb_array_elements_text(w.designations)), w.max, w.paused, now(), now()
         FROM jsonb_to_recordset(:rows::jsonb) AS w(dealer uuid, name text, criteria jsonb, designations jsonb, max int, paused boolean)`,
      { replacements: { rows: JSON.stringify(rows.slice(i, i + BATCH)) } },
    );
  }
}

async function main(): Promise<void> {
  const n = await entries();
  console.log(`seed:scale   ${n.toLocaleString("en")} catalogue entries`);
  await wantLists(Number(process.env.SCALE_WANT_LISTS ?? 10_000));
  await db().query("ANALYZE");
  console.log(`seed:scale   ${Number(process.env.SCALE_WANT_LISTS ?? 10_000).toLocaleString("en")} want lists`);
  await db().close();
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
