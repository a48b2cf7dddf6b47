import type { QueryInterface } from "sequelize";
import { CORE_ROWS as REFERENCE_TYPES } from "../lib/valves/seed/core";

type Ctx = { context: QueryInterface };

/**
 * Loads the published reference rows (lib/valves/seed/core.ts) into
 * valve_types, where the house can correct them with a recorded history.
 * Rows already present are left as the house edited them.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  const now = new Date();
  for (const r of REFERENCE_TYPES) {
    const { designation, aliases, source, ...data } = r;
    await qi.sequelize.query(
      `INSERT INTO valve_types (designation, aliases, data, source, revision, created_at, updated_at)
       VALUES (:designation, ARRAY[:aliases]::varchar[], :data::jsonb, :source, 1, :now, :now)
       ON CONFLICT (designation) DO NOTHING`,
      {
        replacements: {
          designation,
          aliases: aliases.length ? [...aliases] : [""],
          data: JSON.stringify(data),
          source,
          now,
        },
      },
    );
  }
  await qi.sequelize.query(`UPDATE valve_types SET aliases = '{}' WHERE aliases = ARRAY['']::varchar[]`);
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`DELETE FROM valve_types WHERE updated_by IS NULL AND revision = 1`);
}
