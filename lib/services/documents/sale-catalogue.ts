import { QueryTypes } from "sequelize";
import { ApiError } from "../../api/errors";
import type { ProxyState } from "../../auction/proxy";
import type { SaleCatalogueDoc } from "../../documents/sale-catalogue";
import { db } from "../../../models";

const OUTCOME_WORDS: Record<string, string> = { open: "", sold: "sold", unsold: "unsold", withdrawn: "withdrawn" };

/**
 * A sale's printed catalogue. A sale is public once the house has scheduled it with its lots (there is no
 * draft sale), so anyone may print it. Prints what the public catalogue shows (title, contents, estimate,
 * opening price, closing time): never the reserve, the consignor or a bidder.
 */
export async function saleCatalogueDocument(saleId: string): Promise<SaleCatalogueDoc> {
  const [sale] = await db().query<{ title: string; starts_at: Date }>(
    `SELECT title, starts_at FROM sales WHERE id = :saleId`,
    { replacements: { saleId }, type: QueryTypes.SELECT },
  );
  if (!sale) throw new ApiError("not_found", "No such sale");
  const rows = await db().query<{
    position: number;
    title: string;
    phase: string;
    closes_at: Date;
    state: ProxyState;
    estimate_low_cents: number | null;
    estimate_high_cents: number | null;
    contents: { designation: string; tubes: number }[] | null;
  }>(
    `SELECT sl.position, l.title, sl.phase, sl.closes_at, sl.state, l.estimate_low_cents, l.estimate_high_cents,
            (SELECT jsonb_agg(jsonb_build_object('designation', d, 'tubes', n) ORDER BY first)
               FROM (SELECT COALESCE(NULLIF(li.designation, ''), li.designation_typed) AS d, SUM(li.quantity)::int AS n, MIN(li.position) AS first
                       FROM lot_items li WHERE li.lot_id = l.id GROUP BY 1) x) AS contents
       FROM sale_lots sl JOIN lots l ON l.id = sl.lot_id
      WHERE sl.sale_id = :saleId ORDER BY sl.position`,
    { replacements: { saleId }, type: QueryTypes.SELECT },
  );
  return {
    title: sale.title,
    startsAt: sale.starts_at.toISOString(),
    preparedAt: new Date().toISOString(),
    lots: rows.map((r) => {
      const contents = r.contents ?? [];
      return {
        position: r.position,
        title: r.title,
        tubes: contents.reduce((n, c) => n + c.tubes, 0),
        contents: contents.map((c) => `${c.tubes} x ${c.designation}`).join(", ") || "no items listed",
        estimate:
          r.estimate_low_cents != null
            ? { lowCents: r.estimate_low_cents, highCents: r.estimate_high_cents ?? r.estimate_low_cents }
            : null,
        openingCents: r.state.terms.openingCents,
        closesAt: r.closes_at.toISOString(),
        outcome: OUTCOME_WORDS[r.phase] ?? r.phase,
      };
    }),
  };
}
