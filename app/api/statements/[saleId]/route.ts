// GET /api/statements/:saleId?format=csv|pdf|json[&consignorId=] — a consignor's settlement statement for a sale
import { z } from "zod";
import { parseParams, parseWith, route } from "@/lib/api/route";
import { statementCsv, statementFor, statementPdf } from "@/lib/services/statements";

const Params = z.object({ saleId: z.uuid() });
const Query = z.object({ format: z.enum(["csv", "pdf", "json"]).default("json"), consignorId: z.uuid().optional() });

export const GET = route<{ saleId: string }>({ permission: "account.read" }, async ({ req, params, viewer }) => {
  const { saleId } = parseParams(Params, params);
  const q = parseWith(Query, {
    format: req.nextUrl.searchParams.get("format") ?? undefined,
    consignorId: req.nextUrl.searchParams.get("consignorId") ?? undefined,
  });
  const st = await statementFor(viewer, saleId, q.consignorId);
  const name = `getterline-statement-${saleId.slice(0, 8)}`;
  if (q.format === "csv")
    return new Response(statementCsv(st), {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="${name}.csv"`,
      },
    });
  if (q.format === "pdf")
    return new Response(new Uint8Array(await statementPdf(st)), {
      headers: { "content-type": "application/pdf", "content-disposition": `attachment; filename="${name}.pdf"` },
    });
  return st;
});
