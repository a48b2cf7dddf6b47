import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * Releasing the undisputed share of a lot while a claim is open: the invoice
 * keeps what has been released early, and the claim keeps the line values the
 * release was worked out from (its decision must use the same ones).
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn("invoices", "released_hammer_cents", {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.addColumn("invoices", "released_premium_cents", {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.addColumn("invoices", "released_commission_cents", {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.sequelize.query(`ALTER TABLE invoices ADD CONSTRAINT invoices_early_release CHECK (
    released_hammer_cents >= 0 AND released_premium_cents >= 0 AND released_commission_cents >= 0
    AND released_hammer_cents + hammer_refunded_cents <= hammer_cents
    AND released_premium_cents + premium_refunded_cents <= premium_cents
    AND released_commission_cents + commission_returned_cents <= commission_cents)`);
  await qi.addColumn("disputes", "held_lines", { type: DataTypes.JSONB, allowNull: true });
  await qi.addColumn("disputes", "undisputed_released_at", { type: DataTypes.DATE, allowNull: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn("disputes", "undisputed_released_at");
  await qi.removeColumn("disputes", "held_lines");
  await qi.sequelize.query(`ALTER TABLE invoices DROP CONSTRAINT IF EXISTS invoices_early_release`);
  for (const c of ["released_hammer_cents", "released_premium_cents", "released_commission_cents"])
    await qi.removeColumn("invoices", c);
}
