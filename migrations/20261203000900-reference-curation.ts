import { DataTypes, type QueryInterface } from "sequelize";
import { SEED_REFERENCE_TYPES } from "../lib/valves/seed";

type Ctx = { context: QueryInterface };

/** Review fixes to first-release rows, applied only where the house has not edited the row. */
const FIXES: readonly { designation: string; reason: string }[] = [
  { designation: "5Y3GT", reason: "Seed correction: 5Y3GT is directly heated (filament flag) [REG MEM]" },
  {
    designation: "5AR4",
    reason: "Seed correction: in place of 5U4GB/5Y3GT a 5AR4 gives higher output voltage (lower drop) [MEM]",
  },
];

/**
 * One source of truth for reference data: a revision counter that any change
 * to valve_types bumps (statement trigger), so every instance can re-check its
 * cached table cheaply; a retired_at column for retiring types; and the
 * service-bench seed rows, added where missing (rows the house has are kept).
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  const q = (sql: string, replacements?: Record<string, unknown>) =>
    qi.sequelize.query(sql, replacements ? { replacements } : {});
  await qi.addColumn("valve_types", "retired_at", { type: DataTypes.DATE, allowNull: true });
  await q(`CREATE TABLE reference_revision (id smallint PRIMARY KEY CHECK (id = 1), revision bigint NOT NULL)`);
  await q(`INSERT INTO reference_revision (id, revision) VALUES (1, 1)`);
  await q(`CREATE FUNCTION bump_reference_revision() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE reference_revision SET revision = revision + 1 WHERE id = 1;
      PERFORM pg_notify('reference_changed', '');
      RETURN NULL;
    END $$`);
  await q(`CREATE TRIGGER valve_types_bump_revision AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON valve_types
           FOR EACH STATEMENT EXECUTE FUNCTION bump_reference_revision()`);
  const now = new Date();
  for (const r of SEED_REFERENCE_TYPES) {
    const { designation, aliases, source, ...data } = r;
    await q(
      `INSERT INTO valve_types (designation, aliases, data, source, revision, created_at, updated_at)
       VALUES (:designation, ARRAY[:aliases]::varchar[], :data::jsonb, :source, 1, :now, :now)
       ON CONFLICT (designation) DO NOTHING`,
      { designation, aliases: aliases.length ? [...aliases] : [""], data: JSON.stringify(data), source, now },
    );
  }
  await q(`UPDATE valve_types SET aliases = '{}' WHERE aliases = ARRAY['']::varchar[]`);
  // Demo source codes move out of the registers' three-digit space into the invented "X" form.
  await q(`UPDATE maker_codes SET code = 'X' || right(code, 2) WHERE is_demo AND code IN ('917', '931', '946', '958')`);
  for (const fix of FIXES) {
    const seed = SEED_REFERENCE_TYPES.find((r) => r.designation === fix.designation);
    if (!seed) continue;
    const { designation, aliases: _a, source, ...data } = seed;
    const [rows] = await q(
      `SELECT data FROM valve_types WHERE designation = :designation AND revision = 1 AND updated_by IS NULL`,
      { designation },
    );
    const before = (rows as { data: unknown }[])[0]?.data;
    if (!before || JSON.stringify(before) === JSON.stringify(data)) continue;
    await q(
      `UPDATE valve_types SET data = :data::jsonb, revision = 2, updated_at = :now WHERE designation = :designation`,
      { designation, data: JSON.stringify(data), now },
    );
    await q(
      `INSERT INTO valve_type_revisions (designation, revision, changed_by, reason, before, after, created_at)
       VALUES (:designation, 2, NULL, :reason, :before::jsonb, :after::jsonb, :now)`,
      {
        designation,
        reason: fix.reason,
        before: JSON.stringify({ ...(before as object), source }),
        after: JSON.stringify({ ...data, source }),
        now,
      },
    );
  }
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(`DROP TRIGGER IF EXISTS valve_types_bump_revision ON valve_types`);
  await qi.sequelize.query(`DROP FUNCTION IF EXISTS bump_reference_revision()`);
  await qi.sequelize.query(`DROP TABLE IF EXISTS reference_revision`);
  await qi.removeColumn("valve_types", "retired_at");
}
