// Benchmark: grade and match 10,000 synthetic readings (seeded, demo data only).
// Run: node --import tsx scripts/bench-grading.ts [count] [tolerancePct]
// (add --expose-gc before --import for heap figures taken after a collection)
import { performance } from "node:perf_hooks";
import { gradeReading, type TesterReading } from "../lib/valves/grading";
import { findMatchedPairs, findMatchedQuads, type MatchReading, type MatchResult } from "../lib/valves/matching";
import { decodeDesignation } from "../lib/valves/designation";
import { seedReferenceTable } from "../lib/valves/seed";

const count = Number(process.argv[2] ?? 10_000);
const tolerancePct = Number(process.argv[3] ?? 5);

// mulberry32: small seeded PRNG so every run measures the same lot
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const rand = prng(20240);
const gauss = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());

// Invented lot: Gm in tester units against a chart "new" of 100, about 95 ± 12;
// plate current loosely follows Gm (power-tube style), about 70 mA ± 6 %.
const readings: TesterReading[] = [];
const tubes: MatchReading[] = [];
for (let i = 0; i < count; i += 1) {
  const gm = Math.max(5, 95 + 12 * gauss());
  const dual = i % 2 === 0;
  readings.push({
    measure: "gm",
    sections: dual ? [gm, Math.max(5, gm * (1 + 0.06 * gauss()))] : [gm],
    chartNewValue: 100,
    shorts: rand() < 0.01,
    gas: rand() < 0.01,
  });
  tubes.push({
    id: `demo-${i}`,
    gm: Math.round(gm * 10) / 10,
    plateCurrentMa: Math.round(70 * (gm / 95) ** 0.8 * (1 + 0.06 * gauss()) * 10) / 10,
  });
}

const mb = (bytes: number) => `${(bytes / 1048576).toFixed(1)} MB`;
function time<T>(label: string, run: () => T, describe: (result: T) => string): void {
  global.gc?.();
  const before = process.memoryUsage().heapUsed;
  const started = performance.now();
  const result = run();
  const ms = performance.now() - started;
  const after = process.memoryUsage().heapUsed;
  console.log(
    `${label.padEnd(34)} ${ms.toFixed(1).padStart(9)} ms   heap ${mb(after)} (Δ ${mb(after - before)})   ${describe(result)}`,
  );
}
const describeMatch = (r: MatchResult) =>
  `${r.sets.length} sets, ${r.unmatched.length} unmatched, bound ${r.upperBound}, ${r.proven ? "proven largest" : "not proven"}`;

console.log(`${count} synthetic readings, tolerance ${tolerancePct} %, node ${process.version}`);
time(
  "grading",
  () => readings.map((r) => gradeReading(r)),
  (g) => {
    const tally: Record<string, number> = {};
    for (const r of g) tally[r.grade] = (tally[r.grade] ?? 0) + 1;
    return Object.entries(tally)
      .map(([k, v]) => `${k} ${v}`)
      .join(", ");
  },
);
time("pairs, Gm", () => findMatchedPairs(tubes, { tolerancePct }), describeMatch);
time("pairs, Gm + plate current", () => findMatchedPairs(tubes, { tolerancePct, onPlateCurrent: true }), describeMatch);
time("quads, Gm", () => findMatchedQuads(tubes, { tolerancePct }), describeMatch);
time("quads, Gm + plate current", () => findMatchedQuads(tubes, { tolerancePct, onPlateCurrent: true }), describeMatch);
// Designation decoding runs on every keystroke of the item form: 2,000 mixed inputs (known, unknown, garbage).
const table = seedReferenceTable();
const inputs = ["12ax7", "ECC38", "12AX8", "KT89", "6SN7GTB", "E88CC", "garbage!", "5751"];
time(
  "decode 2,000 designations",
  () => Array.from({ length: 2000 }, (_, i) => decodeDesignation(table, inputs[i % inputs.length]!)),
  (r) => `${r.filter((d) => d.ok).length} decoded`,
);
console.log(`peak RSS ${mb(process.memoryUsage().rss)}`);
