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
    void fresh.then((f) => cache.set(key, { at: Date.now(), facets: Promise.resolve(f) }), () => undefined);
    return hit.facets;
  }
  cache.set(key, { at: Date.now(), facets: fresh });
  return fresh;
}

async function countFacets(query: CatalogueQuery, term: DesignationTerm | null): Promise<CatalogueFacets> {
  const p = filterSql(query, term);
  const rows = await db().query<{ facet: string; value: string; n: string }>(
    `WITH hits AS MATERIALIZED (
       SELECT e.families, e.conditions, e.maker_bases, e.grades, e.hazards, e.tested, e.vacuum_loss_tubes, e.pairs, e.quads,
              CASE WHEN e.stage = 'listed' THEN 'approved' WHEN e.stage = 'sold' THEN 'sold' WHEN e.sale_starts_at > now() THEN 'upcoming' ELSE 'live' END AS status
         FROM catalogue_entries e WHERE ${p.where()})
     SELECT 'total' AS facet, '' AS value, COUNT(*) AS n FROM hits
     UNION ALL SELECT 'status', status, COUNT(*) FROM hits GROUP BY status
     UNION ALL (SELECT 'family', v, COUNT(*) FROM hits, unnest(families) v GROUP BY v ORDER BY COUNT(*) DESC LIMIT 40)
     UNION ALL SELECT 'condition', v, COUNT(*) FROM hits, unnest(conditions) v GROUP BY v
     UNION ALL SELECT 'basis', v, COUNT(*) FROM hits, unnest(maker_bases) v GROUP BY v
     UNION ALL SELECT 'grade', v, COUNT(*) FROM hits, unnest(grades) v GROUP BY v
     UNION ALL SELECT 'hazard', v, COUNT(*) FROM hits, unnest(hazards) v GROUP BY v
     UNION ALL SELECT 'flags', 'tested', COUNT(*) FILTER (WHERE tested) FROM hits
     UNION ALL SELECT 'flags', 'noVacuumLoss', COUNT(*) FILTER (WHERE vacuum_loss_tubes = 0) FROM hits
     UNION ALL SELECT 'flags', 'pairs', COUNT(*) FILTER (WHERE pairs > 0) FROM hits
     UNION ALL SELECT 'flags', 'quads', COUNT(*) FILTER (WHERE quads > 0) FROM hits`,
    { replacements: p.values, type: QueryTypes.SELECT },
  );
  const f: CatalogueFacets = { total: 0, status: {}, family: {}, condition: {}, basis: {}, grade: {}, hazard: {}, tested: 0, noVacuumLoss: 0, pairs: 0, quads: 0 };
  for (const r of rows) {
    const n = Number(r.n);
    if (r.facet === "total") f.total = n;
    else if (r.facet === "flags") f[r.value as "tested" | "noVacuumLoss" | "pairs" | "quads"] = n;
    else (f[r.facet as "status"] as Record<string, number>)[r.value] = n;
  }
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
