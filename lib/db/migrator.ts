import path from "node:path";
import { pathToFileURL } from "node:url";
import type { Sequelize } from "sequelize";
import { SequelizeStorage, Umzug } from "umzug";

/**
 * Umzug runners for migrations/ and seeders/, the same in development, demo and
 * tests. Each keeps its own tracking table, so seeders run once per database.
 */
function runner(sequelize: Sequelize, folder: "migrations" | "seeders") {
  const root = process.env.GETTERLINE_ROOT ?? process.cwd();
  return new Umzug({
    migrations: {
      glob: [`${folder}/*.ts`, { cwd: root }],
      resolve: ({ name, path: file, context }) => ({
        name,
        up: async () => (await import(pathToFileURL(path.resolve(root, file!)).href)).up({ context }),
        down: async () => (await import(pathToFileURL(path.resolve(root, file!)).href)).down({ context }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({
      sequelize,
      tableName: folder === "migrations" ? "schema_migrations" : "schema_seeds",
    }),
    logger: process.env.MIGRATE_QUIET ? undefined : console,
  });
}

export const migrator = (s: Sequelize) => runner(s, "migrations");
export const seeder = (s: Sequelize) => runner(s, "seeders");
