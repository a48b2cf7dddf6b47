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

const TTL_MS = 20_000;
const MAX_CACHED = 500;
const cache = new Map<string, { at: number; facets: CatalogueFacets }>();

/**
 * Facet counts for a search. The same filters give the same counts for every page of a result, so they are
 * kept for a few seconds per filter set (paging and sort do not change them).
 */
export async function catalogueFacets(query: CatalogueQuery, term: DesignationTerm | null): Promise<CatalogueFacets> {
  const { cursor: _c, sort: _s, limit: _l, ...filters } = query;
  const key = JSON.stringify(filters);
  const hit = cache.get(key);
  if (hit && Date.now() - hit.at < TTL_MS) return hit.facets;
  const facets = await countFacets(query, term);
  if (cache.size >= MAX_CACHED) cache.delete(cache.keys().next().value!);
  cache.set(key, { at: Date.now(), facets });
  return facets;
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

/** Forget every cached count (a lot was listed, scheduled, sold or changed). */
export function forgetFacetCounts(): void {
  cache.clear();
}
