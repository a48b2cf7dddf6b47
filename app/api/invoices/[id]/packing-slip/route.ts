// GET /api/invoices/:id/packing-slip — the parcel's packing slip (types and counts, cautions, no prices), for the buyer and the house
import { parseParams, route } from "@/lib/api/route";
import { packingSlipPdf } from "@/lib/documents/packing-slip";
import { pdfResponse } from "@/lib/documents/response";
import { packingSlipDocument } from "@/lib/services/documents/invoice-docs";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ params, viewer }) => {
  const doc = await packingSlipDocument(viewer, parseParams(IdParam, params).id);
  return pdfResponse(await packingSlipPdf(doc), `getterline-packing-slip-${doc.invoiceNumber}`);
});
