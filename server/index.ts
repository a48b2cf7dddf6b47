// Getterline's one process: Next.js and socket.io on one port, with a clean
// shutdown on SIGTERM (stop accepting, close sockets, drain, close the pool).
import { loadEnvConfig } from "@next/env";
loadEnvConfig(process.cwd(), process.env.NODE_ENV !== "production");

import http from "node:http";
import next from "next";
import pg from "pg";
import { env } from "../lib/config/env";
import { getSequelize } from "../lib/db/sequelize";
import { initModels } from "../models";
import { startQueue, stopQueue } from "../lib/jobs/queue";
import { startClosingWorker } from "../lib/services/lot-closing";
import { startPeriodicJobs } from "../lib/services/periodic-jobs";
import { startWantListWorker } from "../lib/services/want-list-matching";
import { repairCatalogue } from "../lib/services/catalogue/entries";
import { warmCatalogue } from "../lib/services/catalogue/search";
import { guardRequest } from "./http-guard";
import { gracefulShutdown } from "./shutdown";
import { attachSockets } from "./socket";

async function main(): Promise<void> {
  const e = env();
  // next-auth reads NEXTAUTH_URL from process.env itself.
  process.env.NEXTAUTH_URL ??= `http://localhost:${e.PORT}`;
  const dev = process.env.NODE_ENV !== "production";
  const app = next({ dev, hostname: "localhost", port: e.PORT });
  const handle = app.getRequestHandler();
  await app.prepare();
  initModels(getSequelize());

  const server = http.createServer((req, res) => {
    // Our own stamp of the peer address, used for sign-in throttling; a client cannot set it.
    req.headers["x-getterline-peer"] = req.socket.remoteAddress ?? "unknown";
    if (guardRequest(req, res)) void handle(req, res);
  });

  // Two connections: one held for LISTEN, one that publishes, so a lot's broadcasts leave in the order
  // they were emitted; a NOTIFY needs no durable commit.
  const pool = new pg.Pool({ connectionString: e.DATABASE_URL, max: 2, options: "-c synchronous_commit=off" });
  pool.on("error", (err) => console.error("[socket pool]", err.message));
  // The adapter keeps one client checked out for LISTEN without an error
  // listener; without this a database restart would be an uncaught exception.
  pool.on("connect", (client) => client.on("error", (err) => console.error("[socket pool client]", err.message)));
  const io = await attachSockets(server, pool);

  const boss = await startQueue(e.DATABASE_URL);
  await startClosingWorker();
  // Sweeps and reconciliation: once per period for the whole cluster, however many instances run.
  const periodic = await startPeriodicJobs(boss);
  await startWantListWorker();
  void repairCatalogue()
    .then((n) => n && console.log(`[catalogue] ${n} lot(s) added to the catalogue`))
    .then(() => warmCatalogue())
    .catch((err: Error) => console.error("[catalogue] repair failed", err.message));
  const stopDemo =
    process.env.DEMO_LIVE === "1" ? await (await import("./demo-live")).startDemoLife() : () => undefined;

  const upgrade = app.getUpgradeHandler();
  server.on("upgrade", (req, socket, head) => {
    if (req.url?.startsWith("/_next/")) void upgrade(req, socket, head);
    // /socket.io upgrades are handled by socket.io's own listener.
  });

  server.listen(e.PORT, e.HOST, () => {
    console.log(
      `getterline: ready on http://localhost:${e.PORT} (${dev ? "development" : "production"}, pid ${process.pid})`,
    );
  });

  const stopper = gracefulShutdown(server, {
    closeSockets: () =>
      new Promise<void>((r) => {
        io.close(() => r());
      }),
    closers: [
      async () => {
        stopDemo();
        periodic.stop();
      },
      () => stopQueue(),
      () => getSequelize().close(),
      () => pool.end(),
    ],
    log: (m) => console.log(`getterline: ${m}`),
  });
  const shutdown = async (signal: string) => {
    console.log(`getterline: ${signal} received, shutting down`);
    setTimeout(() => {
      console.error("getterline: forced exit after 10 s");
      process.exit(1);
    }, 10_000).unref();
    await stopper.shutdown();
    process.exit(0);
  };
  process.on("SIGTERM", () => void shutdown("SIGTERM"));
  process.on("SIGINT", () => void shutdown("SIGINT"));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
