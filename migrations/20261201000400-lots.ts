import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

const now = { type: DataTypes.DATE, allowNull: false };

/**
 * Consignment intake: lots, their items (with per-tube readings), CSV
 * imports (for idempotence), photos (objects in S3), the review trail and
 * amendments made after approval.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable("lots", {
    id: { type: DataTypes.UUID, primaryKey: true },
    consignor_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "users", key: "id" },
      onDelete: "RESTRICT",
    },
    title: { type: DataTypes.STRING(140), allowNull: false },
    provenance: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    shipping_origin: { type: DataTypes.STRING(140), allowNull: false, defaultValue: "" },
    tester_kind: { type: DataTypes.STRING(32), allowNull: false, defaultValue: "untested" },
    tester_notes: { type: DataTypes.STRING(500), allowNull: false, defaultValue: "" },
    state: { type: DataTypes.STRING(24), allowNull: false, defaultValue: "draft" },
    estimate_low_cents: { type: DataTypes.INTEGER, allowNull: true },
    estimate_high_cents: { type: DataTypes.INTEGER, allowNull: true },
    reserve_cents: { type: DataTypes.INTEGER, allowNull: true },
    reserve_agreed_at: { type: DataTypes.DATE, allowNull: true },
    submitted_at: { type: DataTypes.DATE, allowNull: true },
    approved_at: { type: DataTypes.DATE, allowNull: true },
    approved_by: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "users", key: "id" },
      onDelete: "SET NULL",
    },
    extra_review: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: now,
    updated_at: now,
  });
  await qi.sequelize.query(
    `ALTER TABLE lots ADD CONSTRAINT lots_state CHECK (state IN ('draft','in-review','needs-changes','approved','declined'))`,
  );
  await qi.sequelize.query(
    `ALTER TABLE lots ADD CONSTRAINT lots_money CHECK (coalesce(estimate_low_cents,0) >= 0 AND coalesce(estimate_high_cents,0) >= coalesce(estimate_low_cents,0) AND coalesce(reserve_cents,0) >= 0)`,
  );
  await qi.addIndex("lots", ["consignor_id"]);
  await qi.addIndex("lots", ["state"]);

  await qi.createTable("lot_items", {
    id: { type: DataTypes.UUID, primaryKey: true },
    lot_id: { type: DataTypes.UUID, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    position: { type: DataTypes.INTEGER, allowNull: false },
    designation_typed: { type: DataTypes.STRING(64), allowNull: false },
    designation: { type: DataTypes.STRING(40), allowNull: false },
    designation_known: { type: DataTypes.BOOLEAN, allowNull: false },
    quantity: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    label_brand: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
    maker_name: { type: DataTypes.STRING(120), allowNull: true },
    maker_basis: { type: DataTypes.STRING(32), allowNull: false, defaultValue: "unconfirmed" },
    source_code: { type: DataTypes.STRING(16), allowNull: true },
    date_code: { type: DataTypes.STRING(16), allowNull: true },
    features: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    condition: { type: DataTypes.STRING(16), allowNull: false },
    vacuum_loss: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    defects: { type: DataTypes.ARRAY(DataTypes.STRING(200)), allowNull: false, defaultValue: [] },
    hazards: { type: DataTypes.ARRAY(DataTypes.STRING(24)), allowNull: false, defaultValue: [] },
    readings: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: "" },
    import_key: { type: DataTypes.STRING(64), allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.sequelize.query(
    `ALTER TABLE lot_items ADD CONSTRAINT lot_items_quantity CHECK (quantity BETWEEN 1 AND 10000)`,
  );
  await qi.sequelize.query(
    `ALTER TABLE lot_items ADD CONSTRAINT lot_items_condition CHECK (condition IN ('new-in-box','new-old-stock','used'))`,
  );
  await qi.sequelize.query(
    `ALTER TABLE lot_items ADD CONSTRAINT lot_items_basis CHECK (maker_basis IN ('source-code-confirmed','construction-matched','unconfirmed'))`,
  );
  await qi.addIndex("lot_items", ["lot_id", "position"]);
  await qi.addIndex("lot_items", ["lot_id", "import_key"], { unique: true });

  await qi.createTable("lot_imports", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    lot_id: { type: DataTypes.UUID, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    fingerprint: { type: DataTypes.STRING(64), allowNull: false },
    file_name: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
    rows_added: { type: DataTypes.INTEGER, allowNull: false },
    rows_skipped: { type: DataTypes.INTEGER, allowNull: false },
    created_by: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    created_at: now,
  });
  await qi.addIndex("lot_imports", ["lot_id", "fingerprint"]);

  await qi.createTable("lot_photos", {
    id: { type: DataTypes.UUID, primaryKey: true },
    lot_id: { type: DataTypes.UUID, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    item_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "lot_items", key: "id" },
      onDelete: "SET NULL",
    },
    full_key: { type: DataTypes.STRING(200), allowNull: false },
    thumb_key: { type: DataTypes.STRING(200), allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    caption: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
    uploaded_by: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    created_at: now,
  });
  await qi.addIndex("lot_photos", ["lot_id", "sha256"], { unique: true });

  await qi.createTable("lot_events", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    lot_id: { type: DataTypes.UUID, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    actor_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "users", key: "id" },
      onDelete: "SET NULL",
    },
    kind: { type: DataTypes.STRING(24), allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    created_at: now,
  });
  await qi.addIndex("lot_events", ["lot_id", "created_at"]);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  for (const t of ["lot_events", "lot_photos", "lot_imports", "lot_items", "lots"]) await qi.dropTable(t);
}
