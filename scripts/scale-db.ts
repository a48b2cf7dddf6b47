// The scale catalogue's own database (npm run seed:scale, npm run bench:catalogue): SCALE_DATABASE_URL, or
// getterline_scale on the same server as the app's database.
import { execFileSync } from "node:child_process";

export function scaleDatabaseUrl(): string {
  if (process.env.SCALE_DATABASE_URL) return process.env.SCALE_DATABASE_URL;
  const base = process.env.DATABASE_URL ?? execFileSync("bash", ["scripts/db.sh", "url"], { encoding: "utf8" }).trim();
  const u = new URL(base);
  u.pathname = "/getterline_scale";
  return u.toString();
}
