import type { QueryInterface } from "sequelize";

type Ctx = { context: QueryInterface };

/**
 * The lot fee leaves the house settings: it was stored but never charged. Stored versions drop the key so the
 * history shows only figures that take effect; older documents stay readable either way (the schema ignores keys it
 * does not know). Down puts back a zero fee, the value version 1 carried.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`UPDATE house_settings_versions SET settings = settings - 'lotFeeCents'`);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(
    `UPDATE house_settings_versions SET settings = jsonb_set(settings, '{lotFeeCents}', '0'::jsonb, true)`,
  );
}
