import { DataTypes, type QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/** Users, sign-in attempts (rate limiting) and password reset tokens. */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.createTable("users", {
    id: { type: DataTypes.UUID, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    display_name: { type: DataTypes.STRING(80), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    roles: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: [] },
    disabled_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.sequelize.query(
    `ALTER TABLE users ADD CONSTRAINT users_roles_known CHECK (roles <@ ARRAY['consignor','dealer','mediator','admin']::varchar[])`,
  );
  await qi.createTable("sign_in_attempts", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    ip: { type: DataTypes.STRING(64), allowNull: false },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex("sign_in_attempts", ["email", "created_at"]);
  await qi.addIndex("sign_in_attempts", ["ip", "created_at"]);
  await qi.createTable("password_reset_tokens", {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.dropTable("password_reset_tokens");
  await qi.dropTable("sign_in_attempts");
  await qi.dropTable("users");
}
