import { QueryTypes, type Transaction } from "sequelize";
import { db } from "../../../../models";

/** A SELECT (or an UPDATE … RETURNING) through the shared Sequelize instance, typed by the caller's column list. */
export const select = <T extends object>(
  sql: string,
  replacements: Record<string, unknown> = {},
  transaction?: Transaction,
): Promise<T[]> => db().query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });

/** A write with no rows back. */
export async function exec(
  sql: string,
  replacements: Record<string, unknown>,
  transaction?: Transaction,
): Promise<void> {
  await db().query(sql, { replacements, transaction });
}

/** `a.x, a.y, …` for a column list, so no query reads `*`. */
export const columns = (list: readonly string[], alias?: string): string =>
  list.map((c) => (alias ? `${alias}.${c}` : c)).join(", ");
