// Bid benchmark: a plain-text summary of a V8 .cpuprofile (self time by function and by package).
// Also runnable alone: node --import tsx scripts/bench-bids/profile-summary.ts <file.cpuprofile> [top]
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

type Node = { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; children?: number[] };
type Profile = { nodes: Node[]; samples: number[]; timeDeltas: number[]; startTime: number; endTime: number };

/** Where a frame's code comes from: an npm package, Node itself, the project, or V8's own buckets. */
function origin(url: string, name: string): string {
  if (!url) return name.startsWith("(") ? name : "(native)";
  const m = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(url);
  if (m) {
    const nested = /node_modules\/next\/dist\/compiled\/([^/]+)/.exec(url);
    return nested ? `next/compiled/${nested[1]}` : m[1]!;
  }
  if (url.startsWith("node:")) return url.split("/")[0]!.replace(/^node:internal.*/, "node:internal");
  const p = /\/work\/[^/]+\/(.+)$/.exec(url.replace(/^file:\/\//, ""));
  if (p) return p[1]!.startsWith(".next/") ? ".next (app bundle)" : p[1]!.split("/").slice(0, 2).join("/");
  return url;
}

/** A window of the profile in CLOCK_MONOTONIC microseconds (what process.hrtime gives and V8 stamps samples with). */
export type Window = { label: string; fromUs: number; toUs: number };

/** Microseconds on the monotonic clock the profiler uses, for marking windows. */
export const monotonicUs = () => Number(process.hrtime.bigint() / 1000n);

/**
 * Self time by origin and by function, and inclusive time by function
 * (every function on the sampled stack), largest first; optionally only the
 * samples inside `window`.
 */
export function summarise(file: string, top = 25, window?: Window): string {
  const prof = JSON.parse(fs.readFileSync(file, "utf8")) as Profile;
  const byId = new Map(prof.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of prof.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const key = (n: Node) => {
    const { functionName, url, lineNumber } = n.callFrame;
    const where = url
      ? `${url
          .replace(/^file:\/\//, "")
          .replace(/^.*node_modules\//, "nm/")
          .replace(/^\/work\/[^/]+\//, "")}:${lineNumber + 1}`
      : "";
    return `${functionName || "(anonymous)"} ${where}`.trim();
  };
  const self = new Map<number, number>();
  let t = prof.startTime;
  prof.samples.forEach((id, i) => {
    const d = Math.max(0, prof.timeDeltas[i] ?? 0);
    t += d;
    // The sample stands for the interval (t - d, t]; count only its part inside the window.
    const us = window ? Math.max(0, Math.min(t, window.toUs) - Math.max(t - d, window.fromUs)) : d;
    if (us > 0) self.set(id, (self.get(id) ?? 0) + us);
  });
  const total = [...self.values()].reduce((a, b) => a + b, 0);
  const idle = [...self.entries()]
    .filter(([id]) => byId.get(id)!.callFrame.functionName === "(idle)")
    .reduce((a, [, v]) => a + v, 0);
  const fn = new Map<string, number>();
  const pkg = new Map<string, number>();
  const incl = new Map<string, number>();
  const lib = new Map<string, number>();
  for (const [id, us] of self) {
    const n = byId.get(id)!;
    const k = key(n);
    fn.set(k, (fn.get(k) ?? 0) + us);
    const o = origin(n.callFrame.url, n.callFrame.functionName);
    pkg.set(o, (pkg.get(o) ?? 0) + us);
    // Charge the sample to the nearest package or project file on the stack (so a socket write issued by pg counts as pg).
    let owner = o;
    for (let cur: number | undefined = id; cur !== undefined; cur = parent.get(cur)) {
      const f = byId.get(cur)!.callFrame;
      const fo = origin(f.url, f.functionName);
      if (f.url && !fo.startsWith("node:") && !fo.startsWith("(")) {
        owner = fo;
        break;
      }
    }
    lib.set(owner, (lib.get(owner) ?? 0) + us);
    const seen = new Set<string>();
    for (let cur: number | undefined = id; cur !== undefined; cur = parent.get(cur)) {
      const ck = key(byId.get(cur)!);
      if (
        seen.has(ck) ||
        ck.startsWith("(root)") ||
        ck.startsWith("(idle)") ||
        ck.startsWith("(program)") ||
        ck.startsWith("(garbage")
      )
        continue;
      seen.add(ck);
      incl.set(ck, (incl.get(ck) ?? 0) + us);
    }
  }
  const busy = total - idle;
  const line = (k: string, us: number) =>
    `${(us / 1000).toFixed(0).padStart(8)} ms ${((100 * us) / Math.max(1, busy)).toFixed(1).padStart(5)} %  ${k}`;
  const sorted = (m: Map<string, number>, n = top) =>
    [...m.entries()]
      .filter(([k]) => !k.startsWith("(idle)"))
      .sort((a, b) => b[1] - a[1])
      .slice(0, n);
  return [
    `profile ${path.basename(file)}${window ? ` during ${window.label}` : ""}: ${(total / 1000).toFixed(0)} ms sampled, ${(busy / 1000).toFixed(0)} ms busy (${((100 * busy) / Math.max(1, total)).toFixed(0)} % of one core); percentages are of busy time`,
    "self time by origin:",
    ...sorted(pkg, 15).map(([k, v]) => line(k, v)),
    "self time charged to the nearest package or project file on the stack (node internals and native calls go to their caller):",
    ...sorted(lib, 15).map(([k, v]) => line(k, v)),
    "self time by function:",
    ...sorted(fn).map(([k, v]) => line(k, v)),
    "inclusive time by function:",
    ...sorted(incl, top + 15).map(([k, v]) => line(k, v)),
  ].join("\n");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const file = process.argv[2];
  if (!file) {
    console.error("usage: profile-summary.ts <file.cpuprofile> [top]");
    process.exit(2);
  }
  console.log(summarise(file, Number(process.argv[3] ?? 25)));
}
