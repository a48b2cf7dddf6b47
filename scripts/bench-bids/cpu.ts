// Bid benchmark: CPU time per component (bench, watchers, app, PostgreSQL) from /proc, to show who used the cores.
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

let tick = 100;
try {
  tick = Number(execFileSync("getconf", ["CLK_TCK"], { encoding: "utf8" }).trim()) || 100;
} catch {
  /* Linux default */
}

/** user + system CPU seconds of one process, or 0 when it is gone. */
function procSeconds(pid: number): number {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    const f = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    return (Number(f[11]) + Number(f[12])) / tick; // utime, stime (fields 14 and 15)
  } catch {
    return 0;
  }
}

/** Busy CPU seconds of the whole machine (all cores) from /proc/stat. */
export function machineBusySeconds(): number {
  const f = fs.readFileSync("/proc/stat", "utf8").split("\n")[0]!.trim().split(/\s+/).slice(1).map(Number);
  const [user = 0, nice = 0, system = 0, , , irq = 0, softirq = 0, steal = 0] = f;
  return (user + nice + system + irq + softirq + steal) / tick;
}

/** Cores busy on the whole machine over `ms`. */
export async function machineBusyCores(ms = 2_000): Promise<number> {
  const a = machineBusySeconds();
  await new Promise((r) => setTimeout(r, ms));
  return (machineBusySeconds() - a) / (ms / 1000);
}

/** The cluster's postmaster and its children that are not serving another database. */
function postgresPids(dataDir: string, database: string): number[] {
  let master: number;
  try {
    master = Number(fs.readFileSync(path.join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]);
  } catch {
    return [];
  }
  const pids = [master];
  for (const d of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${d}/stat`, "utf8");
      const ppid = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]);
      if (ppid !== master) continue;
      // Backends name their database ("postgres: app <db> 127.0.0.1(…)"); auxiliary processes name none.
      const title = fs.readFileSync(`/proc/${d}/cmdline`, "utf8").replace(/\0/g, " ");
      const m = /^postgres: \S+ (\S+) \d+\.\d+\.\d+\.\d+\(/.exec(title) ?? /autovacuum worker (\S+)/.exec(title);
      if (!m || m[1] === database) pids.push(Number(d));
    } catch {
      /* gone */
    }
  }
  return pids;
}

export type Component = "app" | "postgres" | "watchers" | "bench" | "pgbench" | "machine";
export type CpuSnapshot = { at: number } & Record<Component, number>;

/**
 * Samples cumulative CPU seconds per component every 500 ms, remembering the
 * last reading of every process it has seen, so processes that end (pgbench
 * and its backends) still count up to their last sample.
 */
export class CpuMeter {
  private last = new Map<number, { component: Component; secs: number }>();
  private timer: NodeJS.Timeout;
  pids: Partial<Record<"app" | "watchers" | "pgbench", number>> = {};

  constructor(
    private dataDir: string,
    private database: string,
  ) {
    this.timer = setInterval(() => this.sample(), 500);
    this.timer.unref();
  }

  private sample(): void {
    const own: [Component, number | undefined][] = [
      ["app", this.pids.app],
      ["watchers", this.pids.watchers],
      ["pgbench", this.pids.pgbench],
    ];
    for (const [component, pid] of own)
      if (pid) {
        const secs = procSeconds(pid);
        if (secs) this.last.set(pid, { component, secs });
      }
    for (const pid of postgresPids(this.dataDir, this.database)) {
      const secs = procSeconds(pid);
      if (secs) this.last.set(pid, { component: "postgres", secs });
    }
  }

  /** Totals so far (taken now). Compare two snapshots over one phase. */
  snapshot(): CpuSnapshot {
    this.sample();
    const u = process.cpuUsage();
    const out: CpuSnapshot = {
      at: Date.now(),
      app: 0,
      postgres: 0,
      watchers: 0,
      bench: (u.user + u.system) / 1e6,
      pgbench: 0,
      machine: machineBusySeconds(),
    };
    for (const { component, secs } of this.last.values()) out[component] += secs;
    return out;
  }

  stop(): void {
    clearInterval(this.timer);
  }
}

/** "app 0.95, postgres 0.60, …, others 0.40 of 2 cores" used between two snapshots. */
export function cpuLine(a: CpuSnapshot, b: CpuSnapshot): string {
  const secs = (b.at - a.at) / 1000;
  const rate = (k: Component) => (b[k] - a[k]) / secs;
  const mine = (["app", "postgres", "watchers", "bench", "pgbench"] as const).map((k) => [k, rate(k)] as const);
  const others = Math.max(0, rate("machine") - mine.reduce((s, [, v]) => s + v, 0));
  const parts = mine.filter(([, v]) => v > 0.005).map(([k, v]) => `${k} ${v.toFixed(2)}`);
  return `cores busy over ${secs.toFixed(1)} s: ${parts.join(", ")}, everything else on the machine ${others.toFixed(2)} (of ${os.cpus().length})`;
}
