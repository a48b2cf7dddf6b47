// Bid benchmark: a plain-text summary of a V8 .cpuprofile (self time by function and by package).
// Also runnable alone: node --import tsx scripts/bench-bids/profile-summary.ts <file.cpuprofile> [top]
import fs from "node:fs";
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

/** Self time (ms) by function and by origin, largest first. */
export function summarise(file: string, top = 25): string {
  const prof = JSON.parse(fs.readFileSync(file, "utf8")) as Profile;
  const byId = new Map(prof.nodes.map((n) => [n.id, n]));
  const self = new Map<number, number>();
  prof.samples.forEach((id, i) => self.set(id, (self.get(id) ?? 0) + (prof.timeDeltas[i] ?? 0)));
  const total = [...self.values()].reduce((a, b) => a + b, 0);
  const fn = new Map<string, number>();
  const pkg = new Map<string, number>();
  for (const [id, us] of self) {
    const n = byId.get(id)!;
    const { functionName, url, lineNumber } = n.callFrame;
    const where = url ? `${url.replace(/^file:\/\//, "").replace(/^.*node_modules\//, "nm/")}:${lineNumber + 1}` : "";
    const k = `${functionName || "(anonymous)"} ${where}`;
    fn.set(k, (fn.get(k) ?? 0) + us);
    const o = origin(url, functionName);
    pkg.set(o, (pkg.get(o) ?? 0) + us);
  }
  const line = (k: string, us: number) => `${(us / 1000).toFixed(0).padStart(8)} ms ${((100 * us) / total).toFixed(1).padStart(5)} %  ${k}`;
  const sorted = (m: Map<string, number>) => [...m.entries()].sort((a, b) => b[1] - a[1]).slice(0, top);
  return [
    `profile ${file}: ${(total / 1000).toFixed(0)} ms sampled`,
    "self time by origin:",
    ...sorted(pkg).map(([k, v]) => line(k, v)),
    "self time by function:",
    ...sorted(fn).map(([k, v]) => line(k, v)),
  ].join("\n");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const file = process.argv[2];
  if (!file) { console.error("usage: profile-summary.ts <file.cpuprofile> [top]"); process.exit(2); }
  console.log(summarise(file, Number(process.argv[3] ?? 25)));
}
