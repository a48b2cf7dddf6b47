// Test-side helpers to start our own services: the private PostgreSQL cluster
// and the mail catcher on test ports. Used by vitest's and Playwright's setup.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import net from "node:net";
import path from "node:path";

export const ROOT = path.resolve(__dirname, "../..");
export const TEST_SMTP_PORT = 2525;
export const TEST_INBOX_PORT = 2580;

export function startDatabase(): string {
  const r = spawnSync("bash", ["scripts/db.sh", "start"], { cwd: ROOT, encoding: "utf8" });
  if (r.status !== 0) throw new Error(`could not start PostgreSQL:\n${r.stdout}\n${r.stderr}`);
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  return spawnSync("bash", ["scripts/db.sh", "url"], { cwd: ROOT, encoding: "utf8" }).stdout.trim();
}

export function portOpen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect(port, "127.0.0.1");
    s.once("connect", () => {
      s.destroy();
      resolve(true);
    });
    s.once("error", () => resolve(false));
  });
}

/** Start the mail catcher on the test ports unless one already answers there. */
export async function startMailCatcher(): Promise<ChildProcess | null> {
  if (await portOpen(TEST_INBOX_PORT)) return null;
  const child = spawn(process.execPath, ["--import", "tsx", "server/mail-catcher.ts"], {
    cwd: ROOT,
    env: {
      ...process.env,
      MAIL_CATCHER_SMTP_PORT: String(TEST_SMTP_PORT),
      MAIL_CATCHER_HTTP_PORT: String(TEST_INBOX_PORT),
      MAIL_CATCHER_DIR: ".data/mail-test",
    },
    stdio: ["ignore", "pipe", "ignore"],
  });
  // The signal: the catcher prints one line once both its ports listen (server/mail-catcher.ts).
  const ready = await new Promise<boolean>((resolve) => {
    let out = "";
    const timer = setTimeout(() => resolve(false), 10_000); // a deadline, not a wait: ready resolves first
    child.stdout!.on("data", (chunk: Buffer) => {
      out += chunk.toString("utf8");
      if (out.includes("mail catcher:")) {
        clearTimeout(timer);
        child.stdout!.resume(); // keep draining, so the pipe never fills
        resolve(true);
      }
    });
    child.once("exit", () => {
      clearTimeout(timer);
      resolve(false);
    });
  });
  if (ready) return child;
  child.kill();
  throw new Error("mail catcher did not start");
}

/** Point a database URL at another database name. */
export function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}
