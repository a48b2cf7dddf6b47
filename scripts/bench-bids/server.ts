// Bid benchmark: the app under test as a child process (production build, its own port and database).
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import net from "node:net";
import path from "node:path";

/** The first port in [from, to] nobody listens on (127.0.0.1). Bench processes use 3300–3399. */
export async function freePort(from = 3300, to = 3399, skip: number[] = []): Promise<number> {
  for (let p = from; p <= to; p++) {
    if (skip.includes(p)) continue;
    const ok = await new Promise<boolean>((resolve) => {
      const s = net.createServer();
      s.once("error", () => resolve(false));
      s.listen(p, "127.0.0.1", () => s.close(() => resolve(true)));
    });
    if (ok) return p;
  }
  throw new Error(`no free port in ${from}-${to}`);
}

/**
 * Build once if the lead's build is missing (`npx next build`, bounded to 10
 * minutes). When someone else's build is running, wait for its BUILD_ID instead.
 */
export async function ensureBuild(cwd: string, log: (m: string) => void): Promise<void> {
  const id = path.join(cwd, ".next", "BUILD_ID");
  if (fs.existsSync(id)) return;
  log("no production build in .next: running `npx next build` (takes ~30 s)");
  const r = spawnSync("npx", ["next", "build"], {
    cwd,
    encoding: "utf8",
    timeout: 600_000,
    maxBuffer: 64 * 1024 * 1024,
  });
  const out = `${r.stdout ?? ""}${r.stderr ?? ""}`;
  if (r.status === 0) return;
  if (/Another next build process is already running/.test(out)) {
    log("another next build is running: waiting up to 10 minutes for .next/BUILD_ID");
    const deadline = Date.now() + 600_000;
    while (Date.now() < deadline) {
      if (fs.existsSync(id)) return;
      await new Promise((res) => setTimeout(res, 2_000));
    }
    throw new Error("the other next build did not finish within 10 minutes");
  }
  throw new Error(`next build failed (${r.status ?? r.signal}):\n${out.slice(-3000)}`);
}

export type AppServer = {
  port: number;
  child: ChildProcess;
  logFile: string;
  stop: () => Promise<void>;
  /** How the app ended if it is no longer running ("SIGTERM", "1"), or null while it runs. */
  exited: () => string | null;
};

/**
 * Start `node --import tsx server/index.ts` in production mode on `port`,
 * with mail pointed at a closed local port (mail errors are logged, not
 * fatal), and wait until /api/health answers 200.
 */
export async function startServer(opts: {
  cwd: string;
  port: number;
  databaseUrl: string;
  smtpPort: number;
  logFile: string;
  cpuProfDir?: string;
  readyTimeoutMs?: number;
}): Promise<AppServer> {
  const out = fs.openSync(opts.logFile, "a");
  const args = [
    ...(opts.cpuProfDir ? ["--cpu-prof", `--cpu-prof-dir=${opts.cpuProfDir}`] : []),
    "--import",
    "tsx",
    "server/index.ts",
  ];
  const child = spawn(process.execPath, args, {
    cwd: opts.cwd,
    env: {
      ...process.env,
      NODE_ENV: "production",
      PORT: String(opts.port),
      HOST: "127.0.0.1",
      DATABASE_URL: opts.databaseUrl,
      NEXTAUTH_URL: `http://localhost:${opts.port}`,
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(opts.smtpPort),
      MAIL_CATCHER_URL: `http://127.0.0.1:${opts.smtpPort}`,
      DEMO_LIVE: "0",
      LOG_SQL: "0",
    },
    stdio: ["ignore", out, out],
  });
  fs.closeSync(out);
  let exited: string | null = null;
  let stopping = false;
  const exit = new Promise<void>((resolve) =>
    child.once("exit", (code, signal) => {
      exited = `${code ?? signal}`;
      if (!stopping)
        console.error(
          `bench-bids: the app under test exited by itself or was stopped from outside (${exited}); see ${opts.logFile}`,
        );
      resolve();
    }),
  );

  const stop = async () => {
    if (exited !== null) return;
    stopping = true;
    child.kill("SIGTERM");
    const t = setTimeout(() => {
      if (exited === null) child.kill("SIGKILL");
    }, 15_000);
    await exit;
    clearTimeout(t);
  };

  const deadline = Date.now() + (opts.readyTimeoutMs ?? 120_000);
  for (;;) {
    if (exited !== null) throw new Error(`the app exited during start (${exited}); see ${opts.logFile}`);
    if (Date.now() > deadline) {
      await stop();
      throw new Error(`the app did not become healthy in time; see ${opts.logFile}`);
    }
    const status = await new Promise<number>((resolve) => {
      const req = http.get({ host: "127.0.0.1", port: opts.port, path: "/api/health", timeout: 2_000 }, (res) => {
        res.resume();
        resolve(res.statusCode ?? 0);
      });
      req.on("timeout", () => req.destroy());
      req.on("error", () => resolve(0));
    });
    if (status === 200) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  return { port: opts.port, child, logFile: opts.logFile, stop, exited: () => exited };
}
