/**
 * Maximum-cardinality matching in a general graph (Edmonds' blossom method).
 *
 * Used for pairs matched on two criteria (Gm and plate current), where the
 * compatibility graph is not an interval graph and a greedy pass can miss
 * pairs. Blossom bases are kept in a union-find, and every search resets only
 * the vertices it touched, so a search costs about the size of the part of the
 * graph it explores.
 */

/** A graph given by its vertex count and a neighbour list per vertex (may be computed on demand). */
export interface MatchingGraph {
  vertexCount: number;
  neighbours: (v: number) => ArrayLike<number>;
}

/**
 * Grow `mate` (−1 = unmatched; a valid matching on entry, e.g. a greedy one)
 * to a maximum matching, in place. Each exposed vertex is searched once: if
 * no augmenting path starts there now, none will after later augmentations
 * (a standard property of Edmonds' method).
 */
export function growToMaximumMatching(graph: MatchingGraph, mate: Int32Array): void {
  const n = graph.vertexCount;
  const pred = new Int32Array(n).fill(-1);
  const parent = new Int32Array(n);
  for (let v = 0; v < n; v += 1) parent[v] = v;
  const used = new Uint8Array(n);
  const mark = new Int32Array(n);
  let stamp = 0;
  const queue = new Int32Array(n);
  let head = 0;
  let tail = 0;
  const touched: number[] = [];

  const find = (x: number): number => {
    let root = x;
    while (parent[root] !== root) root = parent[root];
    while (parent[x] !== root) {
      const next = parent[x];
      parent[x] = root;
      x = next;
    }
    return root;
  };
  const visit = (v: number) => {
    used[v] = 1;
    touched.push(v);
    queue[tail++] = v;
  };
  const lowestCommonBase = (a: number, b: number): number => {
    stamp += 1;
    for (;;) {
      a = find(a);
      mark[a] = stamp;
      if (mate[a] === -1) break;
      a = pred[mate[a]];
    }
    for (;;) {
      b = find(b);
      if (mark[b] === stamp) return b;
      b = pred[mate[b]];
    }
  };
  const markPath = (v: number, base: number, child: number) => {
    while (find(v) !== base) {
      const m = mate[v];
      pred[v] = child;
      touched.push(v);
      child = m;
      parent[find(v)] = base;
      parent[find(m)] = base;
      if (!used[m]) visit(m);
      v = pred[m];
    }
  };
  const search = (root: number): number => {
    head = 0;
    tail = 0;
    visit(root);
    while (head < tail) {
      const v = queue[head++];
      const list = graph.neighbours(v);
      for (let e = 0; e < list.length; e += 1) {
        const to = list[e];
        if (find(v) === find(to) || mate[v] === to) continue;
        if (to === root || (mate[to] !== -1 && pred[mate[to]] !== -1)) {
          const base = lowestCommonBase(v, to);
          markPath(v, base, to);
          markPath(to, base, v);
        } else if (pred[to] === -1) {
          pred[to] = v;
          touched.push(to);
          if (mate[to] === -1) return to;
          visit(mate[to]);
        }
      }
    }
    return -1;
  };

  // An augmenting path joins two exposed vertices, and a vertex already
  // searched in vain can never end one; so the last untried exposed vertex
  // needs no search at all.
  let untried = 0;
  for (let v = 0; v < n; v += 1) if (mate[v] === -1) untried += 1;
  for (let root = 0; root < n && untried > 1; root += 1) {
    if (mate[root] !== -1) continue;
    untried -= 1;
    if (graph.neighbours(root).length === 0) continue;
    let v = search(root);
    if (v !== -1) untried -= 1;
    while (v !== -1) {
      const p = pred[v];
      const next = mate[p];
      mate[v] = p;
      mate[p] = v;
      v = next;
    }
    for (const t of touched) {
      pred[t] = -1;
      used[t] = 0;
      parent[t] = t;
    }
    touched.length = 0;
  }
}
