// GET /api/sales/:id/catalogue — a sale's printed catalogue (PDF), public once the sale is scheduled
import { parseParams, route } from "@/lib/api/route";
import { saleCataloguePdf } from "@/lib/documents/sale-catalogue";
import { pdfResponse } from "@/lib/documents/response";
import { saleCatalogueDocument } from "@/lib/services/documents/sale-catalogue";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ public: true }, async ({ params }) => {
  const id = parseParams(IdParam, params).id;
  const doc = await saleCatalogueDocument(id);
  return pdfResponse(await saleCataloguePdf(doc), `getterline-sale-${id.slice(0, 8)}`);
});
