import type { DesignationTerm } from "../../catalogue/relations";
import type { CatalogueQuery } from "../../validation/catalogue";

/** Conditions and their bound values, named :p0, :p1 … so every value reaches SQL as a parameter. */
export class SqlPart {
  readonly values: Record<string, unknown> = {};
  private readonly conditions: string[] = [];
  private n = 0;

  bind(value: unknown): string {
    const name = `p${this.n++}`;
    this.values[name] = value;
    return `:${name}`;
  }

  and(condition: string): void {
    this.conditions.push(condition);
  }

  where(): string {
    return this.conditions.length ? this.conditions.join(" AND ") : "true";
  }
}

/** Lots sold longer ago than this leave the catalogue (price history keeps them). */
export const SOLD_SHOWN_DAYS = 90;

const STATUS_SQL = {
  approved: "e.stage = 'listed'",
  upcoming: "(e.stage = 'in-sale' AND e.sale_starts_at > now())",
  live: "(e.stage = 'in-sale' AND e.sale_starts_at <= now())",
  sold: `(e.stage = 'sold' AND e.sold_at > now() - interval '${SOLD_SHOWN_DAYS} days')`,
} as const;

/** Words of a search as a prefix query: "voss carton" finds "Voss estate … cartons". */
export function wordsQuery(q: string): string | null {
  const words = q
    .toLowerCase()
    .split(/[^\p{L}\p{N}]+/u)
    .filter((w) => w.length > 0)
    .slice(0, 8);
  return words.length ? words.map((w) => `${w}:*`).join(" & ") : null;
}

/**
 * The WHERE of a catalogue search (every filter but paging), shared by the result page and the facet counts:
 * a facet says how many lots of the current result have each value.
 */
export function filterSql(q: CatalogueQuery, term: DesignationTerm | null, opts: { search?: boolean } = {}): SqlPart {
  const p = new SqlPart();
  const statuses = q.status.length ? q.status : (["approved", "upcoming", "live", "sold"] as const);
  p.and(`(${statuses.map((s) => STATUS_SQL[s]).join(" OR ")})`);
  if (q.q && opts.search !== false) {
    const either: string[] = [];
    if (term) either.push(`e.designations && ARRAY[${p.bind([...term.related.keys()])}]::varchar[]`);
    const words = wordsQuery(q.q);
    if (words) either.push(`e.search_tsv @@ to_tsquery('simple', ${p.bind(words)})`);
    p.and(either.length ? `(${either.join(" OR ")})` : "false");
  }
  const overlap = (col: string, values: readonly string[]) => {
    if (values.length) p.and(`e.${col} && ARRAY[${p.bind(values)}]::varchar[]`);
  };
  overlap("families", q.family);
  overlap("conditions", q.condition);
  overlap("maker_bases", q.basis);
  overlap("grades", q.grade);
  overlap(
    "hazards",
    q.hazard.filter((h) => h !== "none"),
  );
  if (q.hazard.includes("none")) p.and("cardinality(e.hazards) = 0");
  if (q.tested) p.and(q.tested === "yes" ? "e.tested" : "NOT e.tested");
  if (q.noVacuumLoss) p.and("e.vacuum_loss_tubes = 0");
  if (q.sets.includes("pairs")) p.and("e.pairs > 0");
  if (q.sets.includes("quads")) p.and("e.quads > 0");
  if (q.estMinCents !== undefined) p.and(`e.estimate_high_cents >= ${p.bind(q.estMinCents)}`);
  if (q.estMaxCents !== undefined) p.and(`e.estimate_low_cents <= ${p.bind(q.estMaxCents)}`);
  if (q.record === "clean") p.and("e.consignor_upheld = 0");
  return p;
}
