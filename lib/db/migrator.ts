import path from "node:path";
import { pathToFileURL } from "node:url";
import type { Sequelize } from "sequelize";
import { SequelizeStorage, Umzug } from "umzug";

/**
 * Set to `true` by esbuild (`define`, scripts/build-migrate.mjs) when this module is bundled into
 * dist/migrate.js; undeclared, so `typeof` is "undefined", under tsx and vitest.
 */
declare const GETTERLINE_COMPILED_MIGRATIONS: boolean | undefined;

type Folder = "migrations" | "seeders";

/**
 * Where the migration and seeder files are. Under tsx (development, demo, tests) the TypeScript sources in
 * migrations/ and seeders/ under GETTERLINE_ROOT or the working directory; compiled, the one-file bundles esbuild
 * wrote beside dist/migrate.js (dist/migrations/*.js, dist/seeders/*.js), found from the bundle's own folder so the
 * working directory does not matter. seeders/support/ is not scanned either way (the compiled seeders bundle it).
 */
function filesOf(folder: Folder): { cwd: string; pattern: string } {
  if (typeof GETTERLINE_COMPILED_MIGRATIONS !== "undefined" && GETTERLINE_COMPILED_MIGRATIONS) {
    return { cwd: __dirname, pattern: `${folder}/*.js` };
  }
  return { cwd: process.env.GETTERLINE_ROOT ?? process.cwd(), pattern: `${folder}/*.ts` };
}

/**
 * The name recorded in schema_migrations / schema_seeds: the source file's base name WITH its `.ts` extension,
 * e.g. "20261201000100-create-users.ts", as umzug has recorded it from the first migration on. A compiled file
 * "20261201000100-create-users.js" records the same name, so a database migrated by either path can be continued
 * (or rolled back) by the other. Never change this form: existing databases hold it.
 */
export function recordedName(file: string): string {
  return `${path.basename(file, path.extname(file))}.ts`;
}

/**
 * Until December 2026 both runners shared umzug's default storage model ("SequelizeMeta") on one Sequelize
 * instance, so the second one reused the first's table and seeders were recorded in schema_migrations. Before the
 * seeders run, move any seeder name found there into schema_seeds (once; later runs find none), so a database
 * seeded then is not seeded twice and rolling migrations back does not meet names it has no file for.
 */
async function adoptSeedRecords(sequelize: Sequelize, storage: SequelizeStorage, names: string[]): Promise<void> {
  const [[found]] = (await sequelize.query("SELECT to_regclass('schema_migrations') IS NOT NULL AS present")) as [
    { present: boolean }[],
    unknown,
  ];
  if (!found?.present || names.length === 0) return;
  await storage.model.sync();
  await sequelize.transaction(async (transaction) => {
    const replacements = { names };
    await sequelize.query(
      `INSERT INTO schema_seeds (name) SELECT name FROM schema_migrations WHERE name IN (:names) ON CONFLICT DO NOTHING`,
      { replacements, transaction },
    );
    await sequelize.query(`DELETE FROM schema_migrations WHERE name IN (:names)`, { replacements, transaction });
  });
}

/**
 * Umzug runners for migrations/ and seeders/, the same in development, demo, tests and production. Each keeps
 * its own tracking table (and storage model, named apart), so seeders run once per database.
 */
function runner(sequelize: Sequelize, folder: Folder) {
  const { cwd, pattern } = filesOf(folder);
  const load = async (file: string) => await import(pathToFileURL(path.resolve(cwd, file)).href);
  const storage = new SequelizeStorage({
    sequelize,
    modelName: folder === "migrations" ? "SchemaMigration" : "SchemaSeed",
    tableName: folder === "migrations" ? "schema_migrations" : "schema_seeds",
  });
  const umzug = new Umzug({
    migrations: {
      glob: [pattern, { cwd }],
      resolve: ({ name, path: file, context }) => ({
        name: recordedName(name),
        up: async () => (await load(file!)).up({ context }),
        down: async () => (await load(file!)).down({ context }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage,
    logger: process.env.MIGRATE_QUIET ? undefined : console,
  });
  if (folder === "seeders") {
    umzug.on("beforeCommand", async () => {
      const names = (await umzug.migrations(sequelize.getQueryInterface())).map((m) => m.name);
      await adoptSeedRecords(sequelize, storage, names);
    });
  }
  return umzug;
}

export const migrator = (s: Sequelize) => runner(s, "migrations");
export const seeder = (s: Sequelize) => runner(s, "seeders");
