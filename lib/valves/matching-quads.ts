/**
 * Search for the most disjoint matched quads.
 *
 * Why not a plain sorted sweep: the spread (max − min)/mean of a quad depends
 * on its two inner values too, so the best quads can interleave, and taking
 * consecutive runs of four can miss one (a case is in the unit tests). The
 * search therefore:
 *  1. splits the tubes (sorted by Gm) wherever a gap is too wide for any quad;
 *  2. solves each part of at most `exactLimit` tubes exactly (memoised search);
 *  3. on larger parts runs a "lowest remaining tube first" pass, taking the
 *     first fitting completion in sort order, from several sort orders, and
 *     keeps the best;
 *  4. bounds every part from above (maxRatioForSize), so a result equal to the
 *     bound is proven largest.
 */
import { countRatioWindows, fitsSpread, maxRatioForSize } from "./matching-spread";

/** Values for the search: criteria[c][i] is tube i's value on criterion c. */
export interface QuadSearchInput {
  criteria: Float64Array[];
  tolerancesPct: number[];
}

/** Quads found (tube indices), an upper bound on the count, and whether the count is proven largest. */
export interface QuadSearchResult {
  sets: number[][];
  upperBound: number;
  proven: boolean;
  /** Parts the heuristic could not prove and the exact search solved. */
  exactParts: number;
  /** Parts left with a heuristic answer below their bound. */
  heuristicParts: number;
}

/** Parts up to this many tubes are solved exactly (2^16 memo states at most). */
export const DEFAULT_EXACT_QUAD_LIMIT = 16;
/** Memo states grow as 2^n; beyond this the exact search is too slow and bit masks too wide. */
export const MAX_EXACT_QUAD_LIMIT = 20;
/** Candidates looked at after each anchor in the heuristic pass. */
const POOL_LIMIT = 24;
const SIZE = 4;

/** Find the most disjoint quads whose spread fits on every criterion. */
export function searchQuads(input: QuadSearchInput, exactLimit = DEFAULT_EXACT_QUAD_LIMIT): QuadSearchResult {
  const { criteria, tolerancesPct } = input;
  if (exactLimit > MAX_EXACT_QUAD_LIMIT) throw new RangeError(`exactLimit must be at most ${MAX_EXACT_QUAD_LIMIT}`);
  const gm = criteria[0];
  const order = Array.from(gm.keys()).sort((a, b) => gm[a] - gm[b]);
  const ratios = tolerancesPct.map((t) => maxRatioForSize(SIZE, t));
  const result: QuadSearchResult = { sets: [], upperBound: 0, proven: true, exactParts: 0, heuristicParts: 0 };
  const fits = (members: number[]) =>
    criteria.every((values, c) => {
      let min = Infinity;
      let max = -Infinity;
      let sum = 0;
      for (const m of members) {
        const v = values[m];
        if (v < min) min = v;
        if (v > max) max = v;
        sum += v;
      }
      return fitsSpread(min, max, sum, members.length, tolerancesPct[c]);
    });
  const pairPossible = (a: number, b: number) =>
    criteria.every((values, c) => Math.max(values[a], values[b]) <= Math.min(values[a], values[b]) * ratios[c]);

  let partStart = 0;
  for (let i = 1; i <= order.length; i += 1) {
    if (i < order.length && gm[order[i]] <= gm[order[i - 1]] * ratios[0]) continue;
    const part = order.slice(partStart, i);
    partStart = i;
    if (part.length < SIZE) continue;
    const bound = Math.min(
      ...criteria.map((values, c) =>
        countRatioWindows(Float64Array.from(part, (m) => values[m]).sort(), SIZE, ratios[c]),
      ),
    );
    if (bound === 0) continue;
    // Heuristic first; a small part it cannot prove goes to the exact search,
    // whose count is then the part's true maximum.
    let sets = heuristicQuads(part, criteria, ratios, bound, pairPossible, fits);
    let partBound = bound;
    if (sets.length < bound && part.length <= exactLimit) {
      sets = exactQuads(part, fits);
      partBound = sets.length;
      result.exactParts += 1;
    } else if (sets.length < bound) {
      result.heuristicParts += 1;
      result.proven = false;
    }
    result.upperBound += partBound;
    result.sets.push(...sets);
  }
  return result;
}

/** Lowest-first passes in Gm order, up and down, then the same on the other criteria; the best kept. */
function heuristicQuads(
  part: number[],
  criteria: Float64Array[],
  ratios: number[],
  bound: number,
  pairPossible: (a: number, b: number) => boolean,
  fits: (members: number[]) => boolean,
): number[][] {
  let sets: number[][] = [];
  for (let c = 0; c < criteria.length; c += 1) {
    for (const direction of [1, -1]) {
      const values = criteria[c];
      const ordered = [...part].sort((a, b) => direction * (values[a] - values[b]));
      const found = lowestFirstQuads(ordered, values, direction === 1 ? ratios[c] : 1 / ratios[c], pairPossible, fits);
      if (found.length > sets.length) sets = found;
      if (sets.length === bound) return sets;
    }
  }
  return sets;
}

/**
 * One heuristic pass: walk `ordered`; the first remaining tube anchors a quad
 * with the first fitting three among the next POOL_LIMIT remaining tubes
 * still within `ratio` of it; a tube with no fitting quad is set aside.
 */
function lowestFirstQuads(
  ordered: number[],
  key: Float64Array,
  ratio: number,
  pairPossible: (a: number, b: number) => boolean,
  fits: (members: number[]) => boolean,
): number[][] {
  const n = ordered.length;
  const next = Int32Array.from({ length: n }, (_, i) => i + 1);
  const prev = Int32Array.from({ length: n }, (_, i) => i - 1);
  let first = 0;
  const remove = (p: number) => {
    if (prev[p] >= 0) next[prev[p]] = next[p];
    else first = next[p];
    if (next[p] < n) prev[next[p]] = prev[p];
  };
  const within = (anchor: number, other: number) =>
    ratio >= 1 ? key[other] <= key[anchor] * ratio : key[other] >= key[anchor] * ratio;
  const sets: number[][] = [];
  const pool: number[] = [];
  while (first < n) {
    const anchorPos = first;
    const anchor = ordered[anchorPos];
    pool.length = 0;
    for (let p = next[anchorPos]; p < n && pool.length < POOL_LIMIT; p = next[p]) {
      if (!within(anchor, ordered[p])) break;
      if (pairPossible(anchor, ordered[p])) pool.push(p);
    }
    const chosen = firstFittingTriple(anchor, pool, ordered, pairPossible, fits);
    remove(anchorPos);
    if (chosen) {
      for (const p of chosen) remove(p);
      sets.push([anchor, ...chosen.map((p) => ordered[p])]);
    }
  }
  return sets;
}

function firstFittingTriple(
  anchor: number,
  pool: number[],
  ordered: number[],
  pairPossible: (a: number, b: number) => boolean,
  fits: (members: number[]) => boolean,
): number[] | null {
  for (let x = 0; x < pool.length; x += 1) {
    const a = ordered[pool[x]];
    for (let y = x + 1; y < pool.length; y += 1) {
      const b = ordered[pool[y]];
      if (!pairPossible(a, b)) continue;
      for (let z = y + 1; z < pool.length; z += 1) {
        const c = ordered[pool[z]];
        if (pairPossible(a, c) && pairPossible(b, c) && fits([anchor, a, b, c])) return [pool[x], pool[y], pool[z]];
      }
    }
  }
  return null;
}

/** Exact answer for a small part: memoised search over subsets (bit masks). */
function exactQuads(part: number[], fits: (members: number[]) => boolean): number[][] {
  const n = part.length;
  const byLowest: number[][] = Array.from({ length: n }, () => []);
  for (let a = 0; a < n; a += 1)
    for (let b = a + 1; b < n; b += 1)
      for (let c = b + 1; c < n; c += 1)
        for (let d = c + 1; d < n; d += 1)
          if (fits([part[a], part[b], part[c], part[d]])) byLowest[a].push((1 << a) | (1 << b) | (1 << c) | (1 << d));
  const memo = new Map<number, number>();
  const choice = new Map<number, number>();
  const full = (1 << n) - 1;
  const best = (used: number): number => {
    if (used === full) return 0;
    const cached = memo.get(used);
    if (cached !== undefined) return cached;
    let lowest = 0;
    while (used & (1 << lowest)) lowest += 1;
    let value = best(used | (1 << lowest));
    let picked = 0;
    for (const quad of byLowest[lowest]) {
      if (quad & used) continue;
      const option = 1 + best(used | quad);
      if (option > value) {
        value = option;
        picked = quad;
      }
    }
    memo.set(used, value);
    choice.set(used, picked);
    return value;
  };
  best(0);
  const sets: number[][] = [];
  let used = 0;
  while (used !== full) {
    const picked = choice.get(used) ?? 0;
    if (picked === 0) {
      let lowest = 0;
      while (used & (1 << lowest)) lowest += 1;
      used |= 1 << lowest;
      continue;
    }
    sets.push(part.filter((_, i) => picked & (1 << i)));
    used |= picked;
  }
  return sets;
}
