import type { QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * Revocable sessions: each user has a session version, copied into the JWT at sign-in and compared on every
 * guarded request; signing out or changing the password bumps it, so a copied token stops working.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`ALTER TABLE users ADD COLUMN session_version integer NOT NULL DEFAULT 0`);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`ALTER TABLE users DROP COLUMN IF EXISTS session_version`);
}
