import type { QueryInterface } from "sequelize";
import { INITIAL_HOUSE_SETTINGS } from "../lib/validation/house-settings";

type Ctx = { context: QueryInterface };

/**
 * House settings as versioned rows (who, when, why), version 1 seeded from the constants the exchange ran on; every
 * sale records the version in force when it was scheduled (existing sales get 1, so nothing they charge changes).
 * Buyers and consignors keep a shipping address; an invoice keeps a copy of both addresses, its zone and tax rate.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  const q = (sql: string, replacements?: Record<string, unknown>) => qi.sequelize.query(sql, { replacements });
  await q(`CREATE TABLE house_settings_versions (
    version integer PRIMARY KEY,
    settings jsonb NOT NULL,
    reason varchar(500) NOT NULL,
    created_by uuid NULL REFERENCES users(id),
    created_at timestamptz NOT NULL DEFAULT now()
  )`);
  await q(
    `INSERT INTO house_settings_versions (version, settings, reason) VALUES (1, CAST(:settings AS jsonb), :reason)`,
    {
      settings: JSON.stringify(INITIAL_HOUSE_SETTINGS),
      reason: "First version: the figures the exchange ran on before settings could be changed",
    },
  );
  await q(`ALTER TABLE sales
    ADD COLUMN settings_version integer NOT NULL DEFAULT 1 REFERENCES house_settings_versions(version),
    ADD COLUMN max_extensions integer NULL`);
  await q(`CREATE TABLE addresses (
    user_id uuid PRIMARY KEY REFERENCES users(id) ON DELETE CASCADE,
    name varchar(100) NOT NULL,
    line1 varchar(120) NOT NULL,
    line2 varchar(120) NOT NULL DEFAULT '',
    city varchar(80) NOT NULL,
    region varchar(60) NOT NULL DEFAULT '',
    postal_code varchar(16) NOT NULL DEFAULT '',
    country char(2) NOT NULL,
    created_at timestamptz NOT NULL DEFAULT now(),
    updated_at timestamptz NOT NULL DEFAULT now()
  )`);
  await q(`ALTER TABLE invoices
    ADD COLUMN settings_version integer NULL REFERENCES house_settings_versions(version),
    ADD COLUMN buyer_address jsonb NULL,
    ADD COLUMN origin_address jsonb NULL,
    ADD COLUMN shipping_zone varchar(24) NULL,
    ADD COLUMN tax_bp integer NOT NULL DEFAULT 0`);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  const q = (sql: string) => qi.sequelize.query(sql);
  await q(`ALTER TABLE invoices DROP COLUMN settings_version, DROP COLUMN buyer_address, DROP COLUMN origin_address,
    DROP COLUMN shipping_zone, DROP COLUMN tax_bp`);
  await q(`DROP TABLE addresses`);
  await q(`ALTER TABLE sales DROP COLUMN settings_version, DROP COLUMN max_extensions`);
  await q(`DROP TABLE house_settings_versions`);
}
