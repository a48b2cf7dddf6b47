import pg from "pg";
import { Sequelize } from "sequelize";
import { env } from "../config/env";

/**
 * One Sequelize instance per process. The custom server (run by tsx) and the
 * route handlers (bundled by Next) are separate module graphs, so the instance
 * lives on globalThis and both share one pool.
 */
const g = globalThis as unknown as { __getterlineSequelize?: Sequelize };

export function sequelizeFor(url: string, poolMax = env().DB_POOL_MAX): Sequelize {
  return new Sequelize(url, {
    dialect: "postgres",
    dialectModule: pg,
    logging: env().LOG_SQL === "1" ? console.log : false,
    define: { underscored: true },
    pool: { max: poolMax, min: 0, idle: 10_000, acquire: 10_000, evict: 5_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000, statement_timeout: 15_000 },
    retry: { max: 0 },
  });
}

export function getSequelize(): Sequelize {
  if (!g.__getterlineSequelize) g.__getterlineSequelize = sequelizeFor(env().DATABASE_URL);
  return g.__getterlineSequelize;
}

/** Replace the shared instance (tests point it at their own database). */
export function setSequelize(s: Sequelize | undefined): void {
  g.__getterlineSequelize = s;
}
