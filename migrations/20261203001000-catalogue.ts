import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * The public catalogue and want lists. `catalogue_entries` holds one row per lot the public may see, with what
 * its items add up to (types, families, conditions, grades, matched sets, hazards), written whenever the lot
 * or its place in a sale changes, so a search reads one indexed table. Want lists are dealers' saved searches;
 * a hit is recorded once per lot per list.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable("catalogue_entries", {
    lot_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    title: { type: DataTypes.STRING(140), allowNull: false },
    stage: { type: DataTypes.STRING(12), allowNull: false },
    sale_lot_id: { type: DataTypes.UUID, allowNull: true },
    sale_starts_at: { type: DataTypes.DATE, allowNull: true },
    closes_at: { type: DataTypes.DATE, allowNull: true },
    sold_at: { type: DataTypes.DATE, allowNull: true },
    hammer_cents: { type: DataTypes.INTEGER, allowNull: true },
    listed_at: { type: DataTypes.DATE, allowNull: false },
    estimate_low_cents: { type: DataTypes.INTEGER, allowNull: true },
    estimate_high_cents: { type: DataTypes.INTEGER, allowNull: true },
    tubes: { type: DataTypes.INTEGER, allowNull: false },
    designations: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false },
    families: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false },
    conditions: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false },
    maker_bases: { type: DataTypes.ARRAY(DataTypes.STRING(32)), allowNull: false },
    grades: { type: DataTypes.ARRAY(DataTypes.STRING(12)), allowNull: false },
    hazards: { type: DataTypes.ARRAY(DataTypes.STRING(24)), allowNull: false },
    tested: { type: DataTypes.BOOLEAN, allowNull: false },
    vacuum_loss_tubes: { type: DataTypes.INTEGER, allowNull: false },
    pairs: { type: DataTypes.INTEGER, allowNull: false },
    quads: { type: DataTypes.INTEGER, allowNull: false },
    consignor_upheld: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    thumb_photo_id: { type: DataTypes.UUID, allowNull: true },
    search_text: { type: DataTypes.TEXT, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.sequelize.query(
    `ALTER TABLE catalogue_entries ADD CONSTRAINT catalogue_stage CHECK (stage IN ('listed','in-sale','sold'))`,
  );
  await qi.sequelize.query(
    `ALTER TABLE catalogue_entries ADD COLUMN search_tsv tsvector GENERATED ALWAYS AS (to_tsvector('simple', search_text)) STORED`,
  );
  await qi.sequelize.query(`CREATE INDEX catalogue_designations ON catalogue_entries USING gin (designations)`);
  await qi.sequelize.query(`CREATE INDEX catalogue_families ON catalogue_entries USING gin (families)`);
  await qi.sequelize.query(`CREATE INDEX catalogue_tsv ON catalogue_entries USING gin (search_tsv)`);
  await qi.sequelize.query(`CREATE INDEX catalogue_newest ON catalogue_entries (listed_at DESC, lot_id DESC)`);
  await qi.sequelize.query(
    `CREATE INDEX catalogue_closing ON catalogue_entries (closes_at, lot_id) WHERE stage = 'in-sale'`,
  );
  await qi.sequelize.query(`CREATE INDEX catalogue_estimate ON catalogue_entries (estimate_low_cents, lot_id)`);
  await qi.sequelize.query(
    `CREATE INDEX catalogue_stage_newest ON catalogue_entries (stage, listed_at DESC, lot_id DESC)`,
  );

  await qi.createTable("want_lists", {
    id: { type: DataTypes.UUID, primaryKey: true },
    dealer_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "users", key: "id" },
      onDelete: "CASCADE",
    },
    name: { type: DataTypes.STRING(80), allowNull: false },
    criteria: { type: DataTypes.JSONB, allowNull: false },
    designations: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false },
    max_estimate_cents: { type: DataTypes.INTEGER, allowNull: true },
    paused: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.sequelize.query(
    `CREATE INDEX want_lists_designations ON want_lists USING gin (designations) WHERE NOT paused`,
  );
  await qi.addIndex("want_lists", ["dealer_id"]);
  await qi.createTable("want_list_hits", {
    want_list_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "want_lists", key: "id" },
      onDelete: "CASCADE",
    },
    lot_id: { type: DataTypes.UUID, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    dealer_id: { type: DataTypes.UUID, allowNull: false },
    summary: { type: DataTypes.STRING(300), allowNull: false },
    matched_at: { type: DataTypes.DATE, allowNull: false },
    mailed_at: { type: DataTypes.DATE, allowNull: true },
  });
  await qi.sequelize.query(`ALTER TABLE want_list_hits ADD PRIMARY KEY (want_list_id, lot_id)`);
  await qi.sequelize.query(
    `CREATE INDEX want_list_hits_unmailed ON want_list_hits (dealer_id) WHERE mailed_at IS NULL`,
  );
  await qi.createTable("want_list_mail", {
    dealer_id: {
      type: DataTypes.UUID,
      primaryKey: true,
      references: { model: "users", key: "id" },
      onDelete: "CASCADE",
    },
    digest_enabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    last_digest_at: { type: DataTypes.DATE, allowNull: true },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  for (const t of ["want_list_mail", "want_list_hits", "want_lists", "catalogue_entries"]) await qi.dropTable(t);
}
