import { QueryTypes } from "sequelize";
import type { DesignationTerm } from "../../catalogue/relations";
import type { CatalogueQuery } from "../../validation/catalogue";
import { db } from "../../../models";
import { filterSql } from "./filters";

/** How many lots of the current result have each value of a filter. */
export type CatalogueFacets = {
  total: number;
  status: Record<string, number>;
  family: Record<string, number>;
  condition: Record<string, number>;
  basis: Record<string, number>;
  grade: Record<string, number>;
  hazard: Record<string, number>;
  tested: number;
  noVacuumLoss: number;
  pairs: number;
  quads: number;
};

const FRESH_MS = 20_000;
const KEEP_MS = 10 * 60_000;
const MAX_CACHED = 500;
const cache = new Map<string, { at: number; facets: Promise<CatalogueFacets> }>();

/**
 * Facet counts for a search. The same filters give the same counts for every page of a result, so they are
 * kept per filter set (paging and sort do not change them): fresh for 20 s, then served while a recount runs
 * in the background (counts a few seconds old are good enough to choose a filter by; the lots themselves are
 * always read fresh).
 */
export async function catalogueFacets(query: CatalogueQuery, term: DesignationTerm | null): Promise<CatalogueFacets> {
  const { cursor: _c, sort: _s, limit: _l, ...filters } = query;
  const key = JSON.stringify(filters);
  const hit = cache.get(key);
  const age = hit ? Date.now() - hit.at : Infinity;
  if (hit && age < FRESH_MS) return hit.facets;
  const fresh = countFacets(query, term);
  fresh.catch(() => cache.delete(key));
  if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value!);
  if (hit && age < KEEP_MS) {
    void fresh.then(
      (f) => cache.set(key, { at: Date.now(), facets: Promise.resolve(f) }),
      () => undefined,
    );
    return hit.facets;
  }
  cache.set(key, { at: Date.now(), facets: fresh });
  return fresh;
}

async function countFacets(query: CatalogueQuery, term: DesignationTerm | null): Promise<CatalogueFacets> {
  const p = filterSql(query, term);
  // One pass over the result: each lot yields a (facet, value) row per value it has; one hash aggregate counts them.
  const rows = await db().query<{ facet: string; value: string; n: string }>(
    `SELECT x.facet, x.value, COUNT(*) AS n
       FROM catalogue_entries e CROSS JOIN LATERAL (
              SELECT 'family' AS facet, unnest(e.families) AS value UNION ALL SELECT 'condition', unnest(e.conditions)
              UNION ALL SELECT 'basis', unnest(e.maker_bases) UNION ALL SELECT 'grade', unnest(e.grades) UNION ALL SELECT 'hazard', unnest(e.hazards)
              UNION ALL SELECT 'status', CASE WHEN e.stage = 'listed' THEN 'approved' WHEN e.stage = 'sold' THEN 'sold' WHEN e.sale_starts_at > now() THEN 'upcoming' ELSE 'live' END
              UNION ALL SELECT 'flags', 'tested' WHERE e.tested UNION ALL SELECT 'flags', 'noVacuumLoss' WHERE e.vacuum_loss_tubes = 0
              UNION ALL SELECT 'flags', 'pairs' WHERE e.pairs > 0 UNION ALL SELECT 'flags', 'quads' WHERE e.quads > 0 UNION ALL SELECT 'total', '') x
      WHERE ${p.where()}
      GROUP BY x.facet, x.value`,
    { replacements: p.values, type: QueryTypes.SELECT },
  );
  const f: CatalogueFacets = {
    total: 0,
    status: {},
    family: {},
    condition: {},
    basis: {},
    grade: {},
    hazard: {},
    tested: 0,
    noVacuumLoss: 0,
    pairs: 0,
    quads: 0,
  };
  for (const r of rows) {
    const n = Number(r.n);
    if (r.facet === "total") f.total = n;
    else if (r.facet === "flags") f[r.value as "tested" | "noVacuumLoss" | "pairs" | "quads"] = n;
    else (f[r.facet as "status"] as Record<string, number>)[r.value] = n;
  }
  f.family = Object.fromEntries(
    Object.entries(f.family)
      .sort(([, a], [, b]) => b - a)
      .slice(0, 40),
  ); // the 40 commonest families
  return f;
}

/** A lot changed: every cached count is recounted at its next use (served once more meanwhile). */
export function ageFacetCounts(): void {
  const stale = Date.now() - FRESH_MS;
  for (const v of cache.values()) v.at = Math.min(v.at, stale);
}

/** Forget every cached count (tests). */
export function forgetFacetCounts(): void {
  cache.clear();
}
