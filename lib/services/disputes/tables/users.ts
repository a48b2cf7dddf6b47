/** The user names a claim shows (users is owned by models/User.ts; this is a read-only face). */
import { select } from "./query";

/** Display names of users, by id. */
export async function displayNames(ids: string[]): Promise<Map<string, string>> {
  const rows = await select<{ id: string; display_name: string }>(
    `SELECT id, display_name FROM users WHERE id IN (:ids)`,
    { ids },
  );
  return new Map(rows.map((u) => [u.id, u.display_name]));
}
