import { describe, expect, it } from "vitest";
import {
  findMatchedPairs,
  findMatchedQuads,
  isWithinTolerance,
  MatchingInputError,
  spreadPct,
  type MatchReading,
} from "../../../lib/valves/matching";
import { growToMaximumMatching } from "../../../lib/valves/matching-blossom";
import { searchQuads } from "../../../lib/valves/matching-quads";

// Seeded PRNG (mulberry32) so every run checks the same instances.
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

// Independent reference: the spread formula written out again, and an
// exhaustive search over every way of choosing disjoint sets.
function fitsRef(values: number[], tolPct: number): boolean {
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  return ((Math.max(...values) - Math.min(...values)) / mean) * 100 <= tolPct + 1e-9;
}
function bruteForceMax(tubes: MatchReading[], k: number, tolPct: number, onIp: boolean): number {
  const n = tubes.length;
  const memo = new Map<number, number>();
  const fits = (members: number[]) =>
    fitsRef(
      members.map((m) => tubes[m].gm),
      tolPct,
    ) &&
    (!onIp ||
      fitsRef(
        members.map((m) => tubes[m].plateCurrentMa!),
        tolPct,
      ));
  const best = (used: number): number => {
    if (memo.has(used)) return memo.get(used)!;
    let i = 0;
    while (i < n && used & (1 << i)) i += 1;
    if (i >= n) return 0;
    let value = best(used | (1 << i));
    const rest: number[] = [];
    for (let j = i + 1; j < n; j += 1) if (!(used & (1 << j))) rest.push(j);
    const choose = (from: number, picked: number[]) => {
      if (picked.length === k - 1) {
        const members = [i, ...picked];
        if (fits(members)) value = Math.max(value, 1 + best(members.reduce((m, x) => m | (1 << x), used)));
        return;
      }
      for (let x = from; x < rest.length; x += 1) choose(x + 1, [...picked, rest[x]]);
    };
    choose(0, []);
    memo.set(used, value);
    return value;
  };
  return best(0);
}

// Random lots clustered near the tolerance edge, with ties, so that choices matter.
function randomLot(rand: () => number, n: number, tolPct: number, withIp: boolean): MatchReading[] {
  const lot: MatchReading[] = [];
  for (let i = 0; i < n; i += 1) {
    const edge = 1 + (tolPct / 100) * (0.8 + 0.5 * rand());
    const gm = Math.round(1000 * (rand() < 0.4 ? 1 : rand() < 0.5 ? edge : 1 + (rand() - 0.3) * 2 * (tolPct / 100)));
    const reading: MatchReading = { id: `t${i}`, gm };
    if (withIp) reading.plateCurrentMa = Math.round(400 * (1 + rand() * 1.6 * (tolPct / 100))) / 10;
    lot.push(reading);
  }
  return lot;
}

function checkSets(tubes: MatchReading[], sets: { ids: string[] }[], k: number, tolPct: number, onIp: boolean) {
  const byId = new Map(tubes.map((t) => [t.id, t]));
  const seen = new Set<string>();
  for (const set of sets) {
    expect(set.ids).toHaveLength(k);
    for (const id of set.ids) {
      expect(seen.has(id)).toBe(false);
      seen.add(id);
    }
    const members = set.ids.map((id) => byId.get(id)!);
    expect(
      fitsRef(
        members.map((m) => m.gm),
        tolPct,
      ),
    ).toBe(true);
    if (onIp)
      expect(
        fitsRef(
          members.map((m) => m.plateCurrentMa!),
          tolPct,
        ),
      ).toBe(true);
  }
}

describe("spread (max − min)/mean [SUG]", () => {
  it("Gm 2,000 & 2,100 → 4.9 %, within 5 % [CTP]", () => {
    expect(spreadPct([2000, 2100])).toBeCloseTo(4.878, 3);
    expect(isWithinTolerance([2000, 2100], 5)).toBe(true);
  });
  it("Gm 2,000 & 2,150 → 7.2 %: fails 5 %, passes 10 % [CTP]", () => {
    expect(spreadPct([2000, 2150])).toBeCloseTo(7.229, 3);
    expect(isWithinTolerance([2000, 2150], 5)).toBe(false);
    expect(isWithinTolerance([2000, 2150], 10)).toBe(true);
  });
  it("the same values as a matching run [CTP; SUG]", () => {
    const lot = [
      { id: "a", gm: 2000 },
      { id: "b", gm: 2150 },
    ];
    expect(findMatchedPairs(lot, { tolerancePct: 5 }).sets).toHaveLength(0);
    const loose = findMatchedPairs(lot, { tolerancePct: 10 });
    expect(loose.sets.map((s) => s.ids)).toEqual([["a", "b"]]);
    expect(loose.sets[0].gmSpreadPct).toBeCloseTo(7.229, 3);
  });
});

describe("findMatchedPairs", () => {
  it("pairs on plate current too when asked [CTP: power tubes matched on Ip at a stated bias]", () => {
    const lot = [
      { id: "a", gm: 5000, plateCurrentMa: 40 },
      { id: "b", gm: 5050, plateCurrentMa: 48 },
      { id: "c", gm: 5100, plateCurrentMa: 41 },
    ];
    const result = findMatchedPairs(lot, { tolerancePct: 5, onPlateCurrent: true });
    expect(result.sets.map((s) => s.ids)).toEqual([["a", "c"]]);
    expect(result.unmatched).toEqual(["b"]);
    expect(result.criteria).toEqual(["gm", "plate-current"]);
  });

  it("rejects duplicate ids, bad Gm and missing plate current", () => {
    expect(() =>
      findMatchedPairs(
        [
          { id: "a", gm: 1 },
          { id: "a", gm: 1 },
        ],
        { tolerancePct: 5 },
      ),
    ).toThrow(MatchingInputError);
    expect(() => findMatchedPairs([{ id: "a", gm: 0 }], { tolerancePct: 5 })).toThrow(MatchingInputError);
    expect(() => findMatchedPairs([{ id: "a", gm: 10 }], { tolerancePct: 5, onPlateCurrent: true })).toThrow(
      /plate current/,
    );
    expect(() => findMatchedPairs([], { tolerancePct: 0 })).toThrow(MatchingInputError);
    expect(() => findMatchedQuads([], { tolerancePct: 5, exactQuadLimit: 40 })).toThrow(MatchingInputError);
  });

  it("Gm only: sorted-neighbour greedy equals brute force on 300 random lots of up to 10 tubes", () => {
    const rand = prng(1947);
    for (let trial = 0; trial < 300; trial += 1) {
      const tol = [3, 5, 10][trial % 3];
      const lot = randomLot(rand, 2 + Math.floor(rand() * 9), tol, false);
      const result = findMatchedPairs(lot, { tolerancePct: tol });
      checkSets(lot, result.sets, 2, tol, false);
      expect(result.sets.length).toBe(bruteForceMax(lot, 2, tol, false));
      expect(result.proven).toBe(true);
    }
  });

  it("Gm and plate current: blossom matching equals brute force on 300 random lots of up to 12 tubes", () => {
    const rand = prng(6550);
    for (let trial = 0; trial < 300; trial += 1) {
      const tol = [3, 5, 10][trial % 3];
      const lot = randomLot(rand, 2 + Math.floor(rand() * 11), tol, true);
      const result = findMatchedPairs(lot, { tolerancePct: tol, onPlateCurrent: true });
      checkSets(lot, result.sets, 2, tol, true);
      expect(result.sets.length).toBe(bruteForceMax(lot, 2, tol, true));
    }
  });

  it("improves on a greedy start through an augmenting path", () => {
    // Fitting pairs (5 %, Gm all close): t0–t1, t0–t2, t1–t3 by plate current. A greedy start
    // takes t0–t1 and strands t2, t3; the maximum is t0–t2 and t1–t3.
    const lot = [
      { id: "t0", gm: 1000, plateCurrentMa: 50 },
      { id: "t1", gm: 1010, plateCurrentMa: 52 },
      { id: "t2", gm: 1020, plateCurrentMa: 48 },
      { id: "t3", gm: 1030, plateCurrentMa: 54.5 },
    ];
    const result = findMatchedPairs(lot, { tolerancePct: 5, onPlateCurrent: true });
    expect(result.sets.map((s) => s.ids).sort()).toEqual([
      ["t0", "t2"],
      ["t1", "t3"],
    ]);
  });
});

describe("growToMaximumMatching (Edmonds' blossom method)", () => {
  // Brute-force maximum matching size on a small graph, for comparison.
  function bruteMatching(n: number, edges: [number, number][]): number {
    const memo = new Map<number, number>();
    const best = (used: number): number => {
      if (memo.has(used)) return memo.get(used)!;
      let i = 0;
      while (i < n && used & (1 << i)) i += 1;
      if (i >= n) return 0;
      let value = best(used | (1 << i));
      for (const [a, b] of edges) {
        const other = a === i ? b : b === i ? a : -1;
        if (other >= 0 && !(used & (1 << other))) value = Math.max(value, 1 + best(used | (1 << i) | (1 << other)));
      }
      memo.set(used, value);
      return value;
    };
    return best(0);
  }

  it("reaches the maximum on 2,000 random graphs (odd cycles included) from random greedy starts", () => {
    const rand = prng(1939);
    for (let trial = 0; trial < 2000; trial += 1) {
      const n = 2 + Math.floor(rand() * 13);
      const density = 0.15 + rand() * 0.5;
      const edges: [number, number][] = [];
      for (let a = 0; a < n; a += 1) for (let b = a + 1; b < n; b += 1) if (rand() < density) edges.push([a, b]);
      const lists: number[][] = Array.from({ length: n }, () => []);
      for (const [a, b] of edges) {
        lists[a].push(b);
        lists[b].push(a);
      }
      const mate = new Int32Array(n).fill(-1);
      for (const [a, b] of [...edges].sort(() => rand() - 0.5)) {
        if (mate[a] === -1 && mate[b] === -1 && rand() < 0.7) {
          mate[a] = b;
          mate[b] = a;
        }
      }
      growToMaximumMatching({ vertexCount: n, neighbours: (v) => lists[v] }, mate);
      let size = 0;
      for (let v = 0; v < n; v += 1) {
        if (mate[v] === -1) continue;
        expect(mate[mate[v]]).toBe(v);
        expect(lists[v]).toContain(mate[v]);
        if (mate[v] > v) size += 1;
      }
      expect(size).toBe(bruteMatching(n, edges));
    }
  });
});

describe("findMatchedQuads", () => {
  it("finds interleaved quads that consecutive runs of four miss (spread uses the mean)", () => {
    // Sorted runs: {95.509,100,105.931,110.754} and {100,105.931,110.754,110.754} exceed 10 %;
    // the answer takes {100, 110.754 ×3} and {105.931, 110.754, 111.539, 112.246}.
    const values = [95.509, 100, 105.931, 110.754, 110.754, 110.754, 110.754, 111.539, 112.246];
    const lot = values.map((gm, i) => ({ id: `q${i}`, gm }));
    expect(fitsRef([100, 105.931, 110.754, 110.754], 10)).toBe(false);
    const result = findMatchedQuads(lot, { tolerancePct: 10 });
    expect(result.sets).toHaveLength(2);
    checkSets(lot, result.sets, 4, 10, false);
    const heuristic = findMatchedQuads(lot, { tolerancePct: 10, exactQuadLimit: 0 });
    expect(heuristic.sets).toHaveLength(2);
  });

  it("Gm only: equals brute force on 300 random lots of up to 10 tubes (exact part search)", () => {
    const rand = prng(5881);
    for (let trial = 0; trial < 300; trial += 1) {
      const tol = [3, 5, 10][trial % 3];
      const lot = randomLot(rand, 4 + Math.floor(rand() * 7), tol, false);
      const result = findMatchedQuads(lot, { tolerancePct: tol });
      checkSets(lot, result.sets, 4, tol, false);
      expect(result.sets.length).toBe(bruteForceMax(lot, 4, tol, false));
      expect(result.proven).toBe(true);
    }
  });

  it("Gm and plate current: equals brute force on 300 random lots of up to 10 tubes (exact part search)", () => {
    const rand = prng(7581);
    let exactSearches = 0;
    for (let trial = 0; trial < 300; trial += 1) {
      const tol = [3, 5, 10][trial % 3];
      const lot = randomLot(rand, 4 + Math.floor(rand() * 7), tol, true);
      const result = findMatchedQuads(lot, { tolerancePct: tol, onPlateCurrent: true });
      checkSets(lot, result.sets, 4, tol, true);
      expect(result.sets.length).toBe(bruteForceMax(lot, 4, tol, true));
      expect(result.proven).toBe(true);
      expect(result.upperBound).toBe(result.sets.length);
      const direct = searchQuads({
        criteria: [Float64Array.from(lot, (t) => t.gm), Float64Array.from(lot, (t) => t.plateCurrentMa!)],
        tolerancesPct: [tol, tol],
      });
      exactSearches += direct.exactParts;
    }
    // The lots are built so that the heuristic alone often falls short of the bound and the
    // exact search has to settle the answer; make sure that path really ran.
    expect(exactSearches).toBeGreaterThan(10);
  });

  it("heuristic path (exact search off): never above brute force, bound never below it, proven ⇒ equal", () => {
    const rand = prng(1936);
    let equal = 0;
    const trials = 300;
    for (let trial = 0; trial < trials; trial += 1) {
      const tol = [3, 5, 10][trial % 3];
      const onIp = trial % 2 === 1;
      const lot = randomLot(rand, 4 + Math.floor(rand() * 7), tol, onIp);
      const result = findMatchedQuads(lot, { tolerancePct: tol, onPlateCurrent: onIp, exactQuadLimit: 0 });
      const best = bruteForceMax(lot, 4, tol, onIp);
      checkSets(lot, result.sets, 4, tol, onIp);
      expect(result.sets.length).toBeLessThanOrEqual(best);
      expect(result.upperBound).toBeGreaterThanOrEqual(best);
      if (result.proven) expect(result.sets.length).toBe(best);
      if (result.sets.length === best) equal += 1;
    }
    // Observed, not proven: the heuristic matched brute force on every one of these lots when
    // written; allow at most 1 % misses so a regression in the heuristic shows up here.
    expect(equal).toBeGreaterThanOrEqual(trials * 0.99);
  });
});
