import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * Valve knowledge tables: reference data per type (editable by the house, with
 * a revision history), the maker registry behind source codes, and the
 * dealers' shelf of tubes whose maker is not yet confirmed.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable("valve_types", {
    designation: { type: DataTypes.STRING(32), primaryKey: true },
    aliases: { type: DataTypes.ARRAY(DataTypes.STRING(32)), allowNull: false, defaultValue: [] },
    data: { type: DataTypes.JSONB, allowNull: false },
    source: { type: DataTypes.STRING(40), allowNull: false },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    updated_by: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "users", key: "id" },
      onDelete: "SET NULL",
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.sequelize.query(`CREATE INDEX valve_types_aliases ON valve_types USING GIN (aliases)`);
  await qi.createTable("valve_type_revisions", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    designation: {
      type: DataTypes.STRING(32),
      allowNull: false,
      references: { model: "valve_types", key: "designation" },
      onDelete: "CASCADE",
    },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    changed_by: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "users", key: "id" },
      onDelete: "SET NULL",
    },
    reason: { type: DataTypes.STRING(500), allowNull: false },
    before: { type: DataTypes.JSONB, allowNull: false },
    after: { type: DataTypes.JSONB, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex("valve_type_revisions", ["designation", "revision"], { unique: true });

  await qi.createTable("makers", {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    is_demo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: "" },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable("maker_codes", {
    code: { type: DataTypes.STRING(8), primaryKey: true },
    maker_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: "makers", key: "id" },
      onDelete: "CASCADE",
    },
    is_demo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: "" },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });

  await qi.createTable("shelf_tubes", {
    id: { type: DataTypes.UUID, primaryKey: true },
    owner_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "users", key: "id" },
      onDelete: "CASCADE",
    },
    designation: { type: DataTypes.STRING(32), allowNull: false },
    label_brand: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
    source_code: { type: DataTypes.STRING(16), allowNull: true },
    date_code: { type: DataTypes.STRING(16), allowNull: true },
    features: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    basis: { type: DataTypes.STRING(32), allowNull: false, defaultValue: "unconfirmed" },
    maker_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: "makers", key: "id" },
      onDelete: "SET NULL",
    },
    notes: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: "" },
    client_key: { type: DataTypes.STRING(64), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  // A retried "add to shelf" carries the same client key and adds nothing (NULL keys never collide).
  await qi.addIndex("shelf_tubes", ["owner_id", "client_key"], { unique: true });
  await qi.addIndex("shelf_tubes", ["basis"]);
  await qi.sequelize.query(
    `ALTER TABLE shelf_tubes ADD CONSTRAINT shelf_tubes_basis CHECK (basis IN ('source-code-confirmed','construction-matched','unconfirmed'))`,
  );
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable("shelf_tubes");
  await qi.dropTable("maker_codes");
  await qi.dropTable("makers");
  await qi.dropTable("valve_type_revisions");
  await qi.dropTable("valve_types");
}
