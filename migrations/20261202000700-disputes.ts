import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };
const now = { type: DataTypes.DATE, allowNull: false };

/**
 * Disputes and mediation: a buyer's claim on a delivered lot, the items it
 * names, a threaded conversation and evidence that cannot be changed once
 * posted, the mediator's decision and the money it moved. Lot items may be
 * listed as a matched set (one line for refunds). Invoices keep what has
 * been refunded so escrow releases only what is left.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn("lot_items", "sold_as_set", { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.addColumn("invoices", "hammer_refunded_cents", {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.addColumn("invoices", "premium_refunded_cents", {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.addColumn("invoices", "commission_returned_cents", {
    type: DataTypes.INTEGER,
    allowNull: false,
    defaultValue: 0,
  });
  await qi.sequelize.query(
    `ALTER TABLE invoices ADD CONSTRAINT invoices_refunds CHECK (hammer_refunded_cents BETWEEN 0 AND hammer_cents AND premium_refunded_cents BETWEEN 0 AND premium_cents AND commission_returned_cents BETWEEN 0 AND commission_cents)`,
  );

  await qi.sequelize.query(`CREATE SEQUENCE IF NOT EXISTS dispute_numbers START 101`);
  await qi.createTable("disputes", {
    id: { type: DataTypes.UUID, primaryKey: true },
    number: { type: DataTypes.STRING(24), allowNull: false, unique: true },
    invoice_id: {
      type: DataTypes.UUID,
      allowNull: false,
      unique: true,
      references: { model: "invoices", key: "id" },
      onDelete: "RESTRICT",
    },
    lot_id: { type: DataTypes.UUID, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "RESTRICT" },
    buyer_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    consignor_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    reason: { type: DataTypes.STRING(32), allowNull: false },
    remedy: { type: DataTypes.STRING(32), allowNull: false },
    state: { type: DataTypes.STRING(24), allowNull: false },
    answer_due_at: now,
    answered_at: { type: DataTypes.DATE, allowNull: true },
    consignor_stance: { type: DataTypes.STRING(16), allowNull: true },
    mediator_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    taken_at: { type: DataTypes.DATE, allowNull: true },
    outcome: { type: DataTypes.STRING(24), allowNull: true },
    decided_by: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    decided_at: { type: DataTypes.DATE, allowNull: true },
    decision: { type: DataTypes.JSONB, allowNull: true },
    buyer_refund_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    refund_id: { type: DataTypes.STRING(64), allowNull: true },
    upheld_tubes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    return_due_at: { type: DataTypes.DATE, allowNull: true },
    return_carrier: { type: DataTypes.STRING(60), allowNull: true },
    return_tracking: { type: DataTypes.STRING(80), allowNull: true },
    return_shipped_at: { type: DataTypes.DATE, allowNull: true },
    return_received_at: { type: DataTypes.DATE, allowNull: true },
    closed_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.sequelize.query(
    `ALTER TABLE disputes ADD CONSTRAINT disputes_state CHECK (state IN ('awaiting-answer','answered','with-mediator','settling','awaiting-return','closed'))`,
  );
  await qi.sequelize.query(
    `ALTER TABLE disputes ADD CONSTRAINT disputes_outcome CHECK (outcome IS NULL OR outcome IN ('dismissed','partial-refund','refund-on-return'))`,
  );
  // Decided once: an outcome always carries who decided and when.
  await qi.sequelize.query(
    `ALTER TABLE disputes ADD CONSTRAINT disputes_decided CHECK ((outcome IS NULL) = (decided_at IS NULL) AND (outcome IS NULL) = (decided_by IS NULL))`,
  );
  await qi.addIndex("disputes", ["state"]);
  await qi.addIndex("disputes", ["buyer_id"]);
  await qi.addIndex("disputes", ["consignor_id"]);
  await qi.addIndex("disputes", ["mediator_id"]);

  await qi.createTable("dispute_items", {
    dispute_id: {
      type: DataTypes.UUID,
      allowNull: false,
      primaryKey: true,
      references: { model: "disputes", key: "id" },
      onDelete: "CASCADE",
    },
    lot_item_id: {
      type: DataTypes.UUID,
      allowNull: false,
      primaryKey: true,
      references: { model: "lot_items", key: "id" },
      onDelete: "RESTRICT",
    },
    tubes: { type: DataTypes.INTEGER, allowNull: false },
    report: { type: DataTypes.JSONB, allowNull: false },
  });
  await qi.createTable("dispute_messages", {
    id: { type: DataTypes.UUID, primaryKey: true },
    dispute_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "disputes", key: "id" },
      onDelete: "CASCADE",
    },
    author_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    author_role: { type: DataTypes.STRING(16), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    client_key: { type: DataTypes.STRING(64), allowNull: true },
    created_at: now,
  });
  await qi.addIndex("dispute_messages", ["dispute_id", "created_at"]);
  await qi.sequelize.query(
    `CREATE UNIQUE INDEX dispute_messages_once ON dispute_messages (dispute_id, author_id, client_key) WHERE client_key IS NOT NULL`,
  );
  await qi.createTable("dispute_evidence", {
    id: { type: DataTypes.UUID, primaryKey: true },
    dispute_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "disputes", key: "id" },
      onDelete: "CASCADE",
    },
    author_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    author_role: { type: DataTypes.STRING(16), allowNull: false },
    lot_item_id: { type: DataTypes.UUID, allowNull: true, references: { model: "lot_items", key: "id" } },
    caption: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
    full_key: { type: DataTypes.STRING(200), allowNull: false },
    thumb_key: { type: DataTypes.STRING(200), allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    created_at: now,
  });
  await qi.sequelize.query(`CREATE UNIQUE INDEX dispute_evidence_once ON dispute_evidence (dispute_id, sha256)`);

  // Evidence and the conversation are immutable once posted: the database itself refuses edits and deletions
  // (a whole dispute may still be removed by CASCADE only when its invoice goes, which RESTRICT prevents).
  await qi.sequelize.query(`
    CREATE OR REPLACE FUNCTION dispute_record_immutable() RETURNS trigger AS $$
    BEGIN
      RAISE EXCEPTION 'dispute evidence and messages cannot be changed once posted';
    END $$ LANGUAGE plpgsql`);
  for (const table of ["dispute_items", "dispute_messages", "dispute_evidence"]) {
    await qi.sequelize.query(
      `CREATE TRIGGER ${table}_immutable BEFORE UPDATE OR DELETE ON ${table} FOR EACH ROW EXECUTE FUNCTION dispute_record_immutable()`,
    );
  }
}

export async function down({ context: qi }: Ctx): Promise<void> {
  for (const t of ["dispute_evidence", "dispute_messages", "dispute_items", "disputes"]) await qi.dropTable(t);
  await qi.sequelize.query(`DROP FUNCTION IF EXISTS dispute_record_immutable()`);
  await qi.sequelize.query(`DROP SEQUENCE IF EXISTS dispute_numbers`);
  await qi.sequelize.query(`ALTER TABLE invoices DROP CONSTRAINT IF EXISTS invoices_refunds`);
  for (const c of ["hammer_refunded_cents", "premium_refunded_cents", "commission_returned_cents"])
    await qi.removeColumn("invoices", c);
  await qi.removeColumn("lot_items", "sold_as_set");
}
