// Edit distance for "did you mean" suggestions on mistyped designations.

/**
 * Optimal-string-alignment distance: insertions, deletions, substitutions and
 * swaps of two neighbouring characters each cost 1 ("ECC38" is 1 from "ECC83").
 * Inputs are short (designations are capped at 32 characters), so the plain
 * O(n·m) table is enough.
 */
export function editDistance(a: string, b: string): number {
  if (a === b) return 0;
  if (a.length === 0) return b.length;
  if (b.length === 0) return a.length;
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d: number[][] = Array.from({ length: rows }, (_, i) =>
    Array.from({ length: cols }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)),
  );
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        best = Math.min(best, d[i - 2][j - 2] + 1);
      }
      d[i][j] = best;
    }
  }
  return d[a.length][b.length];
}

/**
 * The names closest to `query` by editDistance, nearest first then alphabetical,
 * keeping those within `maxDistance` (default: 1 for short queries, 2 otherwise),
 * at most `limit` of them.
 */
export function closestNames(
  query: string,
  names: readonly string[],
  options: { maxDistance?: number; limit?: number } = {},
): string[] {
  const maxDistance = options.maxDistance ?? (query.length <= 3 ? 1 : 2);
  const limit = options.limit ?? 6;
  const scored: { name: string; distance: number }[] = [];
  for (const name of names) {
    if (Math.abs(name.length - query.length) > maxDistance) continue;
    const distance = editDistance(query, name);
    if (distance <= maxDistance && name !== query) scored.push({ name, distance });
  }
  scored.sort((x, y) => x.distance - y.distance || x.name.localeCompare(y.name));
  return scored.slice(0, limit).map((s) => s.name);
}
