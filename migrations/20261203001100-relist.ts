import type { QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * A lot that closed unsold (or was withdrawn) may be offered again in a later sale: a lot has at most one sale
 * lot that is open or sold, and any number that ended without a sale.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`ALTER TABLE sale_lots DROP CONSTRAINT IF EXISTS sale_lots_lot_id_key`);
  await qi.sequelize.query(
    `CREATE UNIQUE INDEX sale_lots_one_live_per_lot ON sale_lots (lot_id) WHERE phase IN ('open', 'sold')`,
  );
  await qi.sequelize.query(`CREATE INDEX sale_lots_lot_id ON sale_lots (lot_id)`);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`DROP INDEX IF EXISTS sale_lots_lot_id`);
  await qi.sequelize.query(`DROP INDEX IF EXISTS sale_lots_one_live_per_lot`);
  await qi.sequelize.query(`ALTER TABLE sale_lots ADD CONSTRAINT sale_lots_lot_id_key UNIQUE (lot_id)`);
}
