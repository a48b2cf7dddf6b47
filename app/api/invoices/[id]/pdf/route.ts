// GET /api/invoices/:id/pdf — the invoice as a PDF, for its buyer, the house and (read-only) its claim's mediator
import { parseParams, route } from "@/lib/api/route";
import { invoicePdf } from "@/lib/documents/invoice";
import { pdfResponse } from "@/lib/documents/response";
import { invoiceDocument } from "@/lib/services/documents/invoice-docs";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ params, viewer }) => {
  const doc = await invoiceDocument(viewer, parseParams(IdParam, params).id);
  return pdfResponse(await invoicePdf(doc), `getterline-invoice-${doc.number}`);
});
