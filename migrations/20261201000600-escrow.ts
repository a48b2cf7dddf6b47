import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };
const now = { type: DataTypes.DATE, allowNull: false };

/**
 * Escrow and settlement: one invoice per sold lot, a double-entry ledger
 * written in the same transaction as each state change, processed payment
 * events (for idempotent webhooks) and consignors' payout accounts.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`CREATE SEQUENCE IF NOT EXISTS invoice_numbers START 1001`);
  await qi.createTable("invoices", {
    id: { type: DataTypes.UUID, primaryKey: true },
    number: { type: DataTypes.STRING(24), allowNull: false, unique: true },
    sale_lot_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "sale_lots", key: "id" },
      onDelete: "RESTRICT",
    },
    lot_id: { type: DataTypes.UUID, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "RESTRICT" },
    buyer_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    consignor_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    state: { type: DataTypes.STRING(24), allowNull: false, defaultValue: "awaiting-payment" },
    hammer_cents: { type: DataTypes.INTEGER, allowNull: false },
    premium_bp: { type: DataTypes.INTEGER, allowNull: false },
    premium_cents: { type: DataTypes.INTEGER, allowNull: false },
    shipping_cents: { type: DataTypes.INTEGER, allowNull: false },
    tax_cents: { type: DataTypes.INTEGER, allowNull: false },
    total_cents: { type: DataTypes.INTEGER, allowNull: false },
    commission_cents: { type: DataTypes.INTEGER, allowNull: false },
    processor_fee_cents: { type: DataTypes.INTEGER, allowNull: true },
    tube_count: { type: DataTypes.INTEGER, allowNull: false },
    due_at: now,
    payment_intent_id: { type: DataTypes.STRING(64), allowNull: true },
    last_payment_error: { type: DataTypes.STRING(300), allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    carrier: { type: DataTypes.STRING(60), allowNull: true },
    tracking: { type: DataTypes.STRING(80), allowNull: true },
    shipped_at: { type: DataTypes.DATE, allowNull: true },
    delivered_at: { type: DataTypes.DATE, allowNull: true },
    inspection_ends_at: { type: DataTypes.DATE, allowNull: true },
    released_at: { type: DataTypes.DATE, allowNull: true },
    transfer_id: { type: DataTypes.STRING(64), allowNull: true },
    reminders_sent: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: now,
    updated_at: now,
  });
  await qi.sequelize.query(
    `ALTER TABLE invoices ADD CONSTRAINT invoices_state CHECK (state IN ('awaiting-payment','paid-held','shipped','delivered','released','disputed','refunded','cancelled'))`,
  );
  await qi.sequelize.query(
    `ALTER TABLE invoices ADD CONSTRAINT invoices_money CHECK (hammer_cents >= 0 AND premium_cents >= 0 AND shipping_cents >= 0 AND tax_cents >= 0 AND total_cents = hammer_cents + premium_cents + shipping_cents + tax_cents)`,
  );
  // One live invoice per sold lot; a cancelled one may be followed by a second-chance invoice to the under-bidder.
  await qi.sequelize.query(
    `CREATE UNIQUE INDEX invoices_one_live ON invoices (sale_lot_id) WHERE state <> 'cancelled'`,
  );
  await qi.addColumn("invoices", "second_chance", { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.addIndex("invoices", ["state"]);
  await qi.addIndex("invoices", ["buyer_id"]);
  await qi.addIndex("invoices", ["consignor_id"]);

  await qi.createTable("ledger_entries", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    txn_id: { type: DataTypes.UUID, allowNull: false },
    txn_kind: { type: DataTypes.STRING(80), allowNull: false },
    invoice_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "invoices", key: "id" },
      onDelete: "RESTRICT",
    },
    account: { type: DataTypes.STRING(32), allowNull: false },
    debit_cents: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
    credit_cents: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
    external_ref: { type: DataTypes.STRING(64), allowNull: true },
    created_at: now,
  });
  await qi.sequelize.query(
    `ALTER TABLE ledger_entries ADD CONSTRAINT ledger_one_side CHECK ((debit_cents > 0 AND credit_cents = 0) OR (credit_cents > 0 AND debit_cents = 0))`,
  );
  await qi.addIndex("ledger_entries", ["txn_id"]);
  await qi.addIndex("ledger_entries", ["invoice_id"]);
  // One posting per kind per invoice: a retried handler cannot post twice.
  await qi.sequelize.query(
    `CREATE UNIQUE INDEX ledger_once ON ledger_entries (invoice_id, txn_kind, account) WHERE invoice_id IS NOT NULL`,
  );

  await qi.createTable("payment_events", {
    event_id: { type: DataTypes.STRING(64), primaryKey: true },
    type: { type: DataTypes.STRING(64), allowNull: false },
    received_at: now,
  });
  await qi.createTable("reconciliation_runs", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    ok: { type: DataTypes.BOOLEAN, allowNull: false },
    details: { type: DataTypes.JSONB, allowNull: false },
    ran_at: now,
  });
  await qi.createTable("payout_accounts", {
    user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    stripe_account_id: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    created_at: now,
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  for (const t of ["payout_accounts", "reconciliation_runs", "payment_events", "ledger_entries", "invoices"])
    await qi.dropTable(t);
  await qi.sequelize.query(`DROP SEQUENCE IF EXISTS invoice_numbers`);
}
