import type { QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * Self-service accounts confirm their e-mail address before they can sign in, so sign-up answers the same
 * whether or not an address already has an account. Accounts that exist already, and those the house or the
 * seeders create, count as confirmed (the column's default); only sign-up writes NULL and a link's hash.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`
    ALTER TABLE users
      ADD COLUMN email_confirmed_at timestamptz DEFAULT now(),
      ADD COLUMN confirm_token_hash varchar(64) UNIQUE,
      ADD COLUMN confirm_expires_at timestamptz`);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`
    ALTER TABLE users
      DROP COLUMN IF EXISTS email_confirmed_at,
      DROP COLUMN IF EXISTS confirm_token_hash,
      DROP COLUMN IF EXISTS confirm_expires_at`);
}
