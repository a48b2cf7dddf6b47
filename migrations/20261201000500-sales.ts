import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };
const now = { type: DataTypes.DATE, allowNull: false };

/**
 * Live sales: a sale holds approved lots with staggered closing times; each
 * sale lot keeps its bidding state (the proxy fold) beside a per-lot bid log
 * numbered without gaps; paddles hide bidders' names; watchlists and in-app
 * notices; a mail throttle so a bidding war does not flood an inbox.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable("sales", {
    id: { type: DataTypes.UUID, primaryKey: true },
    title: { type: DataTypes.STRING(140), allowNull: false },
    starts_at: { type: DataTypes.DATE, allowNull: false },
    soft_close_seconds: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 120 },
    is_demo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_by: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "users", key: "id" },
      onDelete: "SET NULL",
    },
    created_at: now,
    updated_at: now,
  });
  await qi.createTable("sale_lots", {
    id: { type: DataTypes.UUID, primaryKey: true },
    sale_id: { type: DataTypes.UUID, allowNull: false, references: { model: "sales", key: "id" }, onDelete: "CASCADE" },
    lot_id: {
      type: DataTypes.UUID,
      allowNull: false,
      unique: true,
      references: { model: "lots", key: "id" },
      onDelete: "RESTRICT",
    },
    position: { type: DataTypes.INTEGER, allowNull: false },
    consignor_id: { type: DataTypes.UUID, allowNull: false },
    phase: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "open" },
    opening_cents: { type: DataTypes.INTEGER, allowNull: false },
    closes_at: { type: DataTypes.DATE, allowNull: false },
    original_close_at: { type: DataTypes.DATE, allowNull: false },
    extension_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    seq: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    price_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    bid_count: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    leader_id: { type: DataTypes.UUID, allowNull: true },
    reserve_met: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    state: { type: DataTypes.JSONB, allowNull: false },
    closed_at: { type: DataTypes.DATE, allowNull: true },
    buyer_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: "users", key: "id" },
      onDelete: "SET NULL",
    },
    hammer_cents: { type: DataTypes.INTEGER, allowNull: true },
    unsold_reason: { type: DataTypes.STRING(24), allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.sequelize.query(
    `ALTER TABLE sale_lots ADD CONSTRAINT sale_lots_phase CHECK (phase IN ('open','sold','unsold','withdrawn'))`,
  );
  await qi.addIndex("sale_lots", ["sale_id", "position"]);
  await qi.addIndex("sale_lots", ["phase", "closes_at"]);

  await qi.createTable("bids", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    sale_lot_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "sale_lots", key: "id" },
      onDelete: "CASCADE",
    },
    seq: { type: DataTypes.INTEGER, allowNull: false },
    bidder_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    max_cents: { type: DataTypes.INTEGER, allowNull: false },
    price_after_cents: { type: DataTypes.INTEGER, allowNull: false },
    outcome: { type: DataTypes.STRING(24), allowNull: false },
    idempotency_key: { type: DataTypes.STRING(80), allowNull: false },
    placed_at: now,
    retracted_at: { type: DataTypes.DATE, allowNull: true },
    retracted_by: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" } },
    retract_reason: { type: DataTypes.STRING(500), allowNull: true },
  });
  await qi.addIndex("bids", ["sale_lot_id", "seq"], { unique: true });
  await qi.addIndex("bids", ["sale_lot_id", "bidder_id", "idempotency_key"], { unique: true });

  await qi.createTable("paddles", {
    sale_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "sales", key: "id" }, onDelete: "CASCADE" },
    user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    number: { type: DataTypes.INTEGER, allowNull: false },
    created_at: now,
  });
  await qi.addIndex("paddles", ["sale_id", "number"], { unique: true });

  await qi.createTable("watches", {
    user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    sale_lot_id: {
      type: DataTypes.UUID,
      primaryKey: true,
      references: { model: "sale_lots", key: "id" },
      onDelete: "CASCADE",
    },
    created_at: now,
  });

  await qi.createTable("notices", {
    id: { type: DataTypes.UUID, primaryKey: true },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    text: { type: DataTypes.STRING(500), allowNull: false },
    href: { type: DataTypes.STRING(200), allowNull: true },
    read_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
  });
  await qi.addIndex("notices", ["user_id", "created_at"]);

  await qi.createTable("outbid_mail", {
    user_id: { type: DataTypes.UUID, primaryKey: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    sale_lot_id: {
      type: DataTypes.UUID,
      primaryKey: true,
      references: { model: "sale_lots", key: "id" },
      onDelete: "CASCADE",
    },
    last_sent_at: now,
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  for (const t of ["outbid_mail", "notices", "watches", "paddles", "bids", "sale_lots", "sales"]) await qi.dropTable(t);
}
