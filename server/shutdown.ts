import type http from "node:http";

/**
 * Tracks requests in flight and, on shutdown: stops accepting connections,
 * runs `closeSockets` (socket.io), lets in-flight requests finish, then runs
 * the closers (database pool, job queue) in order.
 */
export function gracefulShutdown(
  server: http.Server,
  opts: { closeSockets: () => Promise<void>; closers: Array<() => Promise<unknown>>; log?: (m: string) => void },
) {
  let inFlight = 0;
  let closing = false;
  server.on("request", (req: http.IncomingMessage, res: http.ServerResponse) => {
    inFlight++;
    if (closing) res.setHeader("Connection", "close");
    res.on("close", () => inFlight--);
  });
  const log = opts.log ?? (() => undefined);
  return {
    get closing() {
      return closing;
    },
    get inFlight() {
      return inFlight;
    },
    async shutdown(): Promise<void> {
      if (closing) return;
      closing = true;
      const stopped = new Promise<void>((r) => server.close(() => r()));
      await opts.closeSockets();
      server.closeIdleConnections();
      while (inFlight > 0) await new Promise((r) => setTimeout(r, 25));
      server.closeIdleConnections();
      await stopped;
      for (const close of opts.closers) await close().catch((e: Error) => log(`close failed: ${e.message}`));
      log("stopped cleanly");
    },
  };
}
