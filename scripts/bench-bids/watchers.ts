// Bid benchmark: the bench's handle on its watcher process (watchers-child.ts).
import { fork, type ChildProcess } from "node:child_process";
import { fileURLToPath } from "node:url";
import type { FromParent, Receipts, ToParent } from "./protocol";

export type Watchers = {
  /** Receipts for seq in [from, to]. */
  query: (from: number, to: number) => Promise<Receipts>;
  stop: () => Promise<void>;
  pid: number | undefined;
};

/** Fork the watcher process, connect W sockets (in batches) to the lot's room, resolve when every one has joined. */
export async function startWatchers(opts: {
  url: string;
  saleLotId: string;
  cookies: string[];
  batch?: number;
  timeoutMs?: number;
}): Promise<Watchers & { joinMs: number }> {
  const file = fileURLToPath(new URL("./watchers-child.ts", import.meta.url));
  const child: ChildProcess = fork(file, [], {
    execArgv: ["--import", "tsx"],
    stdio: ["ignore", "inherit", "inherit", "ipc"],
  });
  let exited = false;
  const exit = new Promise<void>((resolve) =>
    child.once("exit", () => {
      exited = true;
      resolve();
    }),
  );
  const pending = new Map<number, (r: Receipts) => void>();
  let nextId = 1;
  const post = (m: FromParent) => {
    if (!exited && child.connected) child.send(m);
  };

  const stop = async () => {
    if (exited) return;
    post({ type: "stop" });
    const t = setTimeout(() => {
      if (!exited) child.kill("SIGKILL");
    }, 5_000);
    await exit;
    clearTimeout(t);
  };

  const ready = new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error("watchers did not all join in time")), opts.timeoutMs ?? 120_000);
    child.on("message", (m: ToParent) => {
      if (m.type === "ready") {
        clearTimeout(timer);
        if (m.connected === opts.cookies.length) resolve(m.ms);
        else reject(new Error(`only ${m.connected} of ${opts.cookies.length} watchers connected`));
      } else if (m.type === "failed") {
        clearTimeout(timer);
        reject(new Error(`watchers failed: ${m.message}`));
      } else if (m.type === "result") {
        const r = pending.get(m.id);
        pending.delete(m.id);
        r?.(m);
      }
    });
    child.once("exit", (code) => {
      clearTimeout(timer);
      reject(new Error(`watcher process exited (${code})`));
    });
  });
  post({ type: "start", url: opts.url, saleLotId: opts.saleLotId, cookies: opts.cookies, batch: opts.batch ?? 25 });
  let joinMs: number;
  try {
    joinMs = await ready;
  } catch (e) {
    await stop();
    throw e;
  }

  const query = (from: number, to: number) =>
    new Promise<Receipts>((resolve, reject) => {
      if (exited) return reject(new Error("watcher process has exited"));
      const id = nextId++;
      const timer = setTimeout(() => {
        pending.delete(id);
        reject(new Error("watcher query timed out"));
      }, 15_000);
      pending.set(id, (r) => {
        clearTimeout(timer);
        resolve(r);
      });
      post({ type: "query", id, from, to });
    });
  return { query, stop, pid: child.pid, joinMs };
}
