import { QueryTypes } from "sequelize";
import { db } from "../../models";

/** Is the database answering? Bounded by a short timeout so the probe itself never hangs. */
export async function databaseUp(timeoutMs = 2_000): Promise<boolean> {
  const probe = db().query("SELECT 1 AS up", { type: QueryTypes.SELECT });
  const timeout = new Promise<never>((_, reject) =>
    setTimeout(() => reject(new Error("timeout")), timeoutMs).unref?.(),
  );
  try {
    await Promise.race([probe, timeout]);
    return true;
  } catch {
    return false;
  }
}
