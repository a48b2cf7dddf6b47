import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * Return postage on a claim: what the buyer says they paid to send the lot
 * back (bounded, whole cents, with the carrier's receipt reference), and the
 * processor transfer that repaid it.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn("disputes", "return_postage_cents", {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.addColumn("disputes", "return_postage_receipt", { type: DataTypes.STRING(80), allowNull: true });
  await qi.addColumn("disputes", "postage_transfer_id", { type: DataTypes.STRING(64), allowNull: true });
  await qi.sequelize.query(
    `ALTER TABLE disputes ADD CONSTRAINT disputes_return_postage CHECK (return_postage_cents BETWEEN 0 AND 15000)`,
  );
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`ALTER TABLE disputes DROP CONSTRAINT IF EXISTS disputes_return_postage`);
  for (const c of ["postage_transfer_id", "return_postage_receipt", "return_postage_cents"])
    await qi.removeColumn("disputes", c);
}
