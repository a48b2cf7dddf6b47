import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * Money safety: every processor event is kept with what we did with it (handled or ignored, and why), and
 * a charge we did not expect for an invoice (a second payment, or one of the wrong amount) is recorded,
 * refunded automatically and listed for the house.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn("payment_events", "outcome", {
    type: DataTypes.STRING(16),
    allowNull: false,
    defaultValue: "handled",
  });
  await qi.addColumn("payment_events", "reason", { type: DataTypes.STRING(300), allowNull: true });
  await qi.addColumn("payment_events", "object_id", { type: DataTypes.STRING(64), allowNull: true });
  await qi.sequelize.query(
    `ALTER TABLE payment_events ADD CONSTRAINT payment_events_outcome CHECK (outcome IN ('processing','handled','ignored'))`,
  );
  await qi.addIndex("payment_events", ["outcome", "received_at"]);

  await qi.createTable("unexpected_charges", {
    id: { type: DataTypes.UUID, primaryKey: true },
    invoice_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "invoices", key: "id" },
      onDelete: "RESTRICT",
    },
    payment_intent_id: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    charge_id: { type: DataTypes.STRING(64), allowNull: true },
    amount_cents: { type: DataTypes.INTEGER, allowNull: false },
    fee_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    why: { type: DataTypes.STRING(32), allowNull: false },
    state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "refund-due" },
    refund_id: { type: DataTypes.STRING(64), allowNull: true },
    last_error: { type: DataTypes.STRING(300), allowNull: true },
    detected_at: { type: DataTypes.DATE, allowNull: false },
    refunded_at: { type: DataTypes.DATE, allowNull: true },
  });
  await qi.sequelize.query(
    `ALTER TABLE unexpected_charges ADD CONSTRAINT unexpected_charges_state CHECK (state IN ('refund-due','refunded'))`,
  );
  await qi.sequelize.query(
    `ALTER TABLE unexpected_charges ADD CONSTRAINT unexpected_charges_why CHECK (why IN ('second-payment','wrong-amount','invoice-closed'))`,
  );
  await qi.sequelize.query(
    `ALTER TABLE unexpected_charges ADD CONSTRAINT unexpected_charges_money CHECK (amount_cents > 0 AND fee_cents >= 0)`,
  );
  await qi.addIndex("unexpected_charges", ["invoice_id"]);
  await qi.addIndex("unexpected_charges", ["state"]);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable("unexpected_charges");
  await qi.sequelize.query(`ALTER TABLE payment_events DROP CONSTRAINT IF EXISTS payment_events_outcome`);
  for (const c of ["outcome", "reason", "object_id"]) await qi.removeColumn("payment_events", c);
}
