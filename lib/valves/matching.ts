/**
 * Matched pairs and quads: the most disjoint sets whose spread fits the
 * tolerance on Gm and, when asked, on plate current [CTP].
 *
 * Spread = (max − min)/mean [SUG]. Pass readings from one tester model at one
 * set of settings only, and Gm (or plate-current) readings only: emission
 * readings are never matched against Gm [CTP]. The caller stores tester,
 * settings and date with each match [SUG].
 *
 * Pairs on Gm alone: sort, then pair neighbours greedily — optimal, because a
 * pair fits exactly when max/min ≤ (2 + t)/(2 − t), a rule closed under
 * narrowing, so some largest answer pairs sorted neighbours only, and taking
 * the lowest fitting neighbour pair first never loses one.
 * Pairs on Gm and plate current: maximum matching on the graph of fitting
 * pairs (Edmonds' blossom method), exact.
 * Quads: see matching-quads.ts; exact on small parts, bounded otherwise.
 */
import { growToMaximumMatching, type MatchingGraph } from "./matching-blossom";
import { DEFAULT_EXACT_QUAD_LIMIT, MAX_EXACT_QUAD_LIMIT, searchQuads } from "./matching-quads";
import { maxRatioForSize, spreadPct, TOLERANCE_SLACK_PCT } from "./matching-spread";

/** Spread helpers, re-exported so callers need only this module. */
export { isWithinTolerance, spreadPct } from "./matching-spread";

/** One tube's reading for matching. */
export interface MatchReading {
  id: string;
  /** Mutual conductance on the house tester, any unit, the same for all tubes. */
  gm: number;
  /** Plate current at the stated bias, mA. */
  plateCurrentMa?: number;
}

/** Matching tolerances. Pairs 5–10 %, "tight" ≤ 3 %, quads ~5 % [CTP]. */
export interface MatchOptions {
  tolerancePct: number;
  /** Also require plate current within tolerance (power tubes) [CTP]. */
  onPlateCurrent?: boolean;
  /** Plate-current tolerance; defaults to tolerancePct. */
  plateCurrentTolerancePct?: number;
  /** Quads: parts up to this many tubes are searched exactly (default 16, max 20). */
  exactQuadLimit?: number;
}

/** One matched set with its spreads. */
export interface MatchedSet {
  ids: string[];
  gmSpreadPct: number;
  plateCurrentSpreadPct?: number;
}

/** Outcome of a matching run. `proven` means no answer has more sets than `sets.length`. */
export interface MatchResult {
  setSize: 2 | 4;
  criteria: ("gm" | "plate-current")[];
  sets: MatchedSet[];
  unmatched: string[];
  method: "sorted-neighbours" | "blossom" | "quad-search";
  /** Largest possible number of sets (equal to sets.length when proven). */
  upperBound: number;
  proven: boolean;
}

/** Thrown for unusable matching input (duplicate ids, missing or non-positive readings). */
export class MatchingInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "MatchingInputError";
  }
}

interface Prepared {
  readings: readonly MatchReading[];
  gm: Float64Array;
  ip: Float64Array | null;
  gmTol: number;
  ipTol: number;
}

function prepare(readings: readonly MatchReading[], options: MatchOptions): Prepared {
  const { tolerancePct } = options;
  const ipTol = options.plateCurrentTolerancePct ?? tolerancePct;
  for (const tol of [tolerancePct, ipTol]) {
    if (!Number.isFinite(tol) || tol <= 0 || tol >= 100)
      throw new MatchingInputError(`tolerance must be above 0 and below 100 %, got ${tol}`);
  }
  const ids = new Set<string>();
  for (const r of readings) {
    if (ids.has(r.id)) throw new MatchingInputError(`duplicate tube id ${r.id}`);
    ids.add(r.id);
    if (!Number.isFinite(r.gm) || r.gm <= 0) throw new MatchingInputError(`tube ${r.id}: Gm must be a positive number`);
    if (options.onPlateCurrent && !(Number.isFinite(r.plateCurrentMa) && (r.plateCurrentMa as number) > 0)) {
      throw new MatchingInputError(`tube ${r.id}: plate current is needed to match on it`);
    }
  }
  const gm = Float64Array.from(readings, (r) => r.gm);
  const ip = options.onPlateCurrent ? Float64Array.from(readings, (r) => r.plateCurrentMa as number) : null;
  return { readings, gm, ip, gmTol: tolerancePct, ipTol };
}

function shape(
  p: Prepared,
  groups: number[][],
  setSize: 2 | 4,
  method: MatchResult["method"],
  upperBound: number,
  proven: boolean,
): MatchResult {
  const inSet = new Uint8Array(p.readings.length);
  const sets = groups.map((group) => {
    const members = [...group].sort((a, b) => p.gm[a] - p.gm[b]);
    for (const m of members) inSet[m] = 1;
    const set: MatchedSet = {
      ids: members.map((m) => p.readings[m].id),
      gmSpreadPct: spreadPct(members.map((m) => p.gm[m])),
    };
    if (p.ip) set.plateCurrentSpreadPct = spreadPct(members.map((m) => (p.ip as Float64Array)[m]));
    return { set, key: p.gm[members[0]] };
  });
  sets.sort((a, b) => a.key - b.key);
  return {
    setSize,
    criteria: p.ip ? ["gm", "plate-current"] : ["gm"],
    sets: sets.map((s) => s.set),
    unmatched: p.readings.filter((_, i) => !inSet[i]).map((r) => r.id),
    method,
    upperBound,
    proven,
  };
}

/** Most disjoint matched pairs. Exact on one criterion and on two. */
export function findMatchedPairs(readings: readonly MatchReading[], options: MatchOptions): MatchResult {
  const p = prepare(readings, options);
  const order = Array.from(p.gm.keys()).sort((a, b) => p.gm[a] - p.gm[b]);
  const { gm, ip } = p;
  // Inline pair test, (max − min)·2·100 ≤ (tol + slack)·(a + b): this loop runs millions of times.
  const gmLimit = p.gmTol + TOLERANCE_SLACK_PCT;
  const ipLimit = p.ipTol + TOLERANCE_SLACK_PCT;
  const fits = (a: number, b: number): boolean => {
    const ga = gm[a];
    const gb = gm[b];
    if (Math.abs(ga - gb) * 200 > gmLimit * (ga + gb)) return false;
    if (!ip) return true;
    const ia = ip[a];
    const ib = ip[b];
    return Math.abs(ia - ib) * 200 <= ipLimit * (ia + ib);
  };
  if (!p.ip) {
    const pairs: number[][] = [];
    for (let i = 0; i + 1 < order.length; i += 1) {
      if (fits(order[i], order[i + 1])) {
        pairs.push([order[i], order[i + 1]]);
        i += 1;
      }
    }
    return shape(p, pairs, 2, "sorted-neighbours", pairs.length, true);
  }
  // Compatibility graph over Gm-sorted positions, built only where the search
  // looks: a tube can only fit tubes inside its Gm window.
  const n = order.length;
  const ratio = maxRatioForSize(2, p.gmTol);
  const cache = new Map<number, Int32Array>();
  const scratch = new Int32Array(n);
  const neighbours = (i: number): Int32Array => {
    let list = cache.get(i);
    if (list) return list;
    const a = order[i];
    const low = gm[a] / ratio;
    const high = gm[a] * ratio;
    let count = 0;
    for (let j = i - 1; j >= 0 && gm[order[j]] >= low; j -= 1) if (fits(a, order[j])) scratch[count++] = j;
    for (let j = i + 1; j < n && gm[order[j]] <= high; j += 1) if (fits(a, order[j])) scratch[count++] = j;
    list = scratch.slice(0, count);
    cache.set(i, list);
    return list;
  };
  // Greedy start: each tube takes the next free fitting tube up the Gm order.
  const mate = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i += 1) {
    if (mate[i] !== -1) continue;
    const a = order[i];
    for (let j = i + 1; j < n && gm[order[j]] <= gm[a] * ratio; j += 1) {
      if (mate[j] === -1 && fits(a, order[j])) {
        mate[i] = j;
        mate[j] = i;
        break;
      }
    }
  }
  const graph: MatchingGraph = { vertexCount: n, neighbours };
  growToMaximumMatching(graph, mate);
  const pairs: number[][] = [];
  for (let i = 0; i < n; i += 1) if (mate[i] > i) pairs.push([order[i], order[mate[i]]]);
  return shape(p, pairs, 2, "blossom", pairs.length, true);
}

/**
 * Most disjoint matched quads. Exact on parts of up to `exactQuadLimit`
 * tubes; on larger parts a heuristic whose count is checked against an upper
 * bound (`proven` tells whether it reached it).
 */
export function findMatchedQuads(readings: readonly MatchReading[], options: MatchOptions): MatchResult {
  const p = prepare(readings, options);
  const limit = options.exactQuadLimit ?? DEFAULT_EXACT_QUAD_LIMIT;
  if (!Number.isInteger(limit) || limit < 0 || limit > MAX_EXACT_QUAD_LIMIT) {
    throw new MatchingInputError(`exactQuadLimit must be a whole number from 0 to ${MAX_EXACT_QUAD_LIMIT}`);
  }
  const found = searchQuads(
    { criteria: p.ip ? [p.gm, p.ip] : [p.gm], tolerancesPct: p.ip ? [p.gmTol, p.ipTol] : [p.gmTol] },
    limit,
  );
  return shape(p, found.sets, 4, "quad-search", found.upperBound, found.proven);
}
