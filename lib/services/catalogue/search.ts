import { QueryTypes } from "sequelize";
import { ApiError } from "../../api/errors";
import { decodeCursor, encodeCursor, type CatalogueSort, type Cursor } from "../../catalogue/cursor";
import {
  designationTerm,
  RELATION_ORDER,
  relationRank,
  type DesignationTerm,
  type Relation,
} from "../../catalogue/relations";
import type { CatalogueQuery, CatalogueStatus } from "../../validation/catalogue";
import { db } from "../../../models";
import { currentReferenceTable } from "../reference-table";
import { catalogueFacets, type CatalogueFacets } from "./facets";
import { filterSql, wordsQuery, type SqlPart } from "./filters";

export type CatalogueMatch = { designation: string; relation: Relation; quantity: number };
export type CatalogueLot = {
  id: string;
  title: string;
  status: CatalogueStatus;
  closesAt: string | null;
  startsAt: string | null;
  soldAt: string | null;
  estimateLowCents: number | null;
  estimateHighCents: number | null;
  priceCents: number | null;
  bids: number | null;
  tubes: number;
  families: string[];
  grades: string[];
  hazards: string[];
  vacuumLossTubes: number;
  pairs: number;
  quads: number;
  thumbnail: string | null;
  saleLotId: string | null;
  saleId: string | null;
  matches: CatalogueMatch[];
};
export type CatalogueResult = {
  lots: CatalogueLot[];
  facets: CatalogueFacets;
  nextCursor: string | null;
  term: { designation: string; typed: string } | null;
};

type Row = {
  lot_id: string;
  title: string;
  stage: string;
  sale_lot_id: string | null;
  sale_starts_at: Date | null;
  closes_at: Date | null;
  sold_at: Date | null;
  hammer_cents: number | null;
  listed_at: Date;
  estimate_low_cents: number | null;
  estimate_high_cents: number | null;
  tubes: number;
  families: string[];
  grades: string[];
  hazards: string[];
  vacuum_loss_tubes: number;
  pairs: number;
  quads: number;
  thumb_photo_id: string | null;
  rank: number;
  listed_us: string;
  closes_us: string | null;
  live_price: number | null;
  live_bids: number | null;
  live_closes_at: Date | null;
  sale_id: string | null;
};

type Tier = { rank: number; where: (p: SqlPart) => string };

/**
 * Relevance, as tiers read in order: lots whose closest item is the searched type, then the same type under
 * another name, then each looser relation, then lots found by words alone; newest first within a tier. Each
 * tier is one query the newest-first index can serve, so a common type costs no more than a rare one.
 */
function relevanceTiers(term: DesignationTerm, words: string | null): Tier[] {
  const tiers: Tier[] = [];
  const closer: string[] = [];
  for (const r of RELATION_ORDER) {
    const names = [...term.related].filter(([, rel]) => rel === r).map(([d]) => d);
    if (!names.length) continue;
    const before = [...closer];
    tiers.push({
      rank: relationRank(r),
      where: (p) =>
        `e.designations && ARRAY[${p.bind(names)}]::varchar[]${before.length ? ` AND NOT e.designations && ARRAY[${p.bind(before)}]::varchar[]` : ""}`,
    });
    closer.push(...names);
  }
  if (words)
    tiers.push({
      rank: 9,
      where: (p) =>
        `e.search_tsv @@ to_tsquery('simple', ${p.bind(words)}) AND NOT e.designations && ARRAY[${p.bind(closer)}]::varchar[]`,
    });
  return tiers;
}

const US = (col: string) => `(extract(epoch from ${col}) * 1000000)::bigint`;
const AT = (param: string) => `('epoch'::timestamptz + (${param} || ' microseconds')::interval)`;

/** ORDER BY and the keyset condition after a cursor, per index-ordered sort (relevance is read in tiers). */
function order(
  sort: Exclude<CatalogueSort, "relevance">,
  cursor: Cursor | null,
  p: SqlPart,
): { orderBy: string; after: string } {
  const id = cursor ? p.bind(cursor.id) : "";
  const [k0] = cursor?.k ?? [];
  switch (sort) {
    case "newest":
      return {
        orderBy: "listed_at DESC, lot_id DESC",
        after: cursor ? `(listed_at, lot_id) < (${AT(p.bind(String(k0)))}, ${id}::uuid)` : "",
      };
    case "closing":
      return {
        orderBy: "closes_at ASC NULLS LAST, lot_id ASC",
        after: !cursor
          ? ""
          : k0 === null || k0 === undefined
            ? `(closes_at IS NULL AND lot_id > ${id}::uuid)`
            : `(closes_at > ${AT(p.bind(String(k0)))} OR (closes_at = ${AT(p.bind(String(k0)))} AND lot_id > ${id}::uuid) OR closes_at IS NULL)`,
      };
    case "estimate":
      return {
        orderBy: "estimate_low_cents ASC NULLS LAST, lot_id ASC",
        after: !cursor
          ? ""
          : k0 === null || k0 === undefined
            ? `(estimate_low_cents IS NULL AND lot_id > ${id}::uuid)`
            : `(estimate_low_cents > ${p.bind(k0)} OR (estimate_low_cents = ${p.bind(k0)} AND lot_id > ${id}::uuid) OR estimate_low_cents IS NULL)`,
      };
  }
}

function keyOf(sort: CatalogueSort, r: Row): Cursor["k"] {
  switch (sort) {
    case "relevance":
      return [r.rank, Number(r.listed_us)];
    case "newest":
      return [Number(r.listed_us)];
    case "closing":
      return [r.closes_us === null ? null : Number(r.closes_us)];
    case "estimate":
      return [r.estimate_low_cents];
  }
}

function statusOf(r: Pick<Row, "stage" | "sale_starts_at">, now: number): CatalogueStatus {
  if (r.stage === "sold") return "sold";
  if (r.stage === "in-sale") return r.sale_starts_at && r.sale_starts_at.getTime() > now ? "upcoming" : "live";
  return "approved";
}

/**
 * Search the public catalogue: approved lots, lots in upcoming and live sales, and lots sold in the last 90
 * days. A typed designation finds every lot with an item of that type or a related one, best relation first,
 * and says which item matched and how; words search titles, provenance and origin. Keyset paging; facet
 * counts over the whole result. Reserves, maximum bids and consignors' details are never read here.
 */
export async function searchCatalogue(query: CatalogueQuery): Promise<CatalogueResult> {
  const term = query.q ? designationTerm(query.q, await currentReferenceTable()) : null;
  const sort: CatalogueSort = query.sort ?? (query.q ? "relevance" : "newest");
  const cursor = query.cursor ? decodeCursor(query.cursor, sort) : null;
  if (query.cursor && !cursor)
    throw new ApiError(
      "bad_request",
      "That page link is not valid (the cursor is malformed or for another sort): start the search again",
      { cursor: "Not a valid cursor" },
    );
  const facetsPending = catalogueFacets(query, term); // counted alongside the page, not after it
  facetsPending.catch(() => undefined); // awaited below; this only keeps an early failure from going unhandled
  const rows =
    sort === "relevance" && term ? await tieredRows(query, term, cursor) : await sortedRows(query, term, sort, cursor);
  const page = rows.slice(0, query.limit);
  const [matches, facets] = await Promise.all([
    matchesFor(
      page.map((r) => r.lot_id),
      term,
    ),
    facetsPending,
  ]);
  const now = Date.now();
  return {
    lots: page.map((r) => {
      const status = statusOf(r, now);
      return {
        id: r.lot_id,
        title: r.title,
        status,
        startsAt: r.sale_starts_at?.toISOString() ?? null,
        closesAt:
          status === "live" || status === "upcoming"
            ? ((r.live_closes_at ?? r.closes_at)?.toISOString() ?? null)
            : null,
        soldAt: r.sold_at?.toISOString() ?? null,
        estimateLowCents: r.estimate_low_cents,
        estimateHighCents: r.estimate_high_cents,
        priceCents: status === "sold" ? r.hammer_cents : status === "live" ? r.live_price : null,
        bids: status === "live" ? r.live_bids : null,
        tubes: r.tubes,
        families: r.families,
        grades: r.grades,
        hazards: r.hazards,
        vacuumLossTubes: r.vacuum_loss_tubes,
        pairs: r.pairs,
        quads: r.quads,
        thumbnail: r.thumb_photo_id ? `/api/photos/${r.thumb_photo_id}?size=list` : null,
        saleLotId: status === "live" || status === "upcoming" ? r.sale_lot_id : null,
        saleId: status === "live" || status === "upcoming" ? r.sale_id : null,
        matches: matches.get(r.lot_id) ?? [],
      };
    }),
    facets,
    nextCursor:
      rows.length > query.limit
        ? encodeCursor({ s: sort, k: keyOf(sort, page.at(-1)!), id: page.at(-1)!.lot_id })
        : null,
    term: term ? { designation: term.designation, typed: term.typed } : null,
  };
}

/** Which items of each lot matched the searched type, and how: best relation first, then most tubes. */
const SELECT_ENTRY = `e.lot_id, e.title, e.stage, e.sale_lot_id, e.sale_starts_at, e.closes_at, e.sold_at, e.hammer_cents, e.listed_at,
  e.estimate_low_cents, e.estimate_high_cents, e.tubes, e.families, e.grades, e.hazards, e.vacuum_loss_tubes, e.pairs, e.quads, e.thumb_photo_id,
  ${US("e.listed_at")} AS listed_us, ${US("e.closes_at")} AS closes_us`;
/** The names SELECT_ENTRY yields plus the rank, for the outer queries' select lists. */
const ENTRY_OUT = [
  "lot_id",
  "title",
  "stage",
  "sale_lot_id",
  "sale_starts_at",
  "closes_at",
  "sold_at",
  "hammer_cents",
  "listed_at",
  "estimate_low_cents",
  "estimate_high_cents",
  "tubes",
  "families",
  "grades",
  "hazards",
  "vacuum_loss_tubes",
  "pairs",
  "quads",
  "thumb_photo_id",
  "listed_us",
  "closes_us",
  "rank",
] as const;
const entryOut = (alias: string) => ENTRY_OUT.map((c) => `${alias}.${c}`).join(", ");

/** One page in a sort that follows an index (newest, closing, estimate; relevance by words alone). */
async function sortedRows(
  query: CatalogueQuery,
  term: DesignationTerm | null,
  sort: CatalogueSort,
  cursor: Cursor | null,
): Promise<Row[]> {
  const p = filterSql(query, term);
  const { orderBy, after } = order(
    sort === "relevance" ? "newest" : sort,
    cursor && sort === "relevance" ? { ...cursor, k: [cursor.k[1] ?? null] } : cursor,
    p,
  );
  return db().query<Row>(
    `SELECT ${entryOut("y")}, sl.price_cents AS live_price, sl.bid_count AS live_bids, sl.closes_at AS live_closes_at, sl.sale_id
       FROM (SELECT ${entryOut("x")} FROM (SELECT ${SELECT_ENTRY}, 0 AS rank FROM catalogue_entries e WHERE ${p.where()}) x
              ${after ? `WHERE ${after}` : ""} ORDER BY ${orderBy} LIMIT ${p.bind(query.limit + 1)}) y
       LEFT JOIN sale_lots sl ON sl.id = y.sale_lot_id
      ORDER BY ${orderBy
        .split(", ")
        .map((o) => `y.${o}`)
        .join(", ")}`,
    { replacements: p.values, type: QueryTypes.SELECT },
  );
}

/** One page by relevance: tier after tier (see relevanceTiers) until the page is full. */
async function tieredRows(query: CatalogueQuery, term: DesignationTerm, cursor: Cursor | null): Promise<Row[]> {
  const out: Row[] = [];
  const [k0, k1] = cursor?.k ?? [];
  for (const tier of relevanceTiers(term, wordsQuery(query.q))) {
    if (cursor && tier.rank < (k0 ?? 0)) continue;
    const p = filterSql(query, term, { search: false });
    p.and(tier.where(p));
    if (cursor && tier.rank === k0)
      p.and(`(e.listed_at, e.lot_id) < (${AT(p.bind(String(k1)))}, ${p.bind(cursor.id)}::uuid)`);
    const rows = await db().query<Row>(
      `SELECT ${entryOut("y")}, sl.price_cents AS live_price, sl.bid_count AS live_bids, sl.closes_at AS live_closes_at, sl.sale_id
         FROM (SELECT ${SELECT_ENTRY}, ${tier.rank} AS rank FROM catalogue_entries e WHERE ${p.where()}
                ORDER BY e.listed_at DESC, e.lot_id DESC LIMIT ${p.bind(query.limit + 1 - out.length)}) y
         LEFT JOIN sale_lots sl ON sl.id = y.sale_lot_id ORDER BY y.listed_at DESC, y.lot_id DESC`,
      { replacements: p.values, type: QueryTypes.SELECT },
    );
    out.push(...rows);
    if (out.length > query.limit) break;
  }
  return out;
}

async function matchesFor(lotIds: string[], term: DesignationTerm | null): Promise<Map<string, CatalogueMatch[]>> {
  const out = new Map<string, CatalogueMatch[]>();
  if (!term || !lotIds.length) return out;
  const rows = await db().query<{ lot_id: string; designation: string; quantity: string }>(
    `SELECT lot_id, designation, SUM(quantity) AS quantity FROM lot_items WHERE lot_id IN (:lotIds) AND designation IN (:names) GROUP BY lot_id, designation`,
    { replacements: { lotIds, names: [...term.related.keys()] }, type: QueryTypes.SELECT },
  );
  for (const r of rows) {
    const m = { designation: r.designation, relation: term.related.get(r.designation)!, quantity: Number(r.quantity) };
    out.set(r.lot_id, [...(out.get(r.lot_id) ?? []), m]);
  }
  for (const ms of out.values())
    ms.sort((a, b) => relationRank(a.relation) - relationRank(b.relation) || b.quantity - a.quantity);
  return out;
}

/** Count the broad searches once at start (every visitor's first page), so nobody waits for them. */
export async function warmCatalogue(): Promise<void> {
  const { CatalogueQuerySchema } = await import("../../validation/catalogue");
  for (const status of [[], ["approved"], ["live", "upcoming"], ["sold"]] as const)
    await searchCatalogue(CatalogueQuerySchema.parse({ status }));
}
