// GET /api/lots/:id/sheet — a printable lot sheet (PDF) for anyone who may see the lot's page
import { parseParams, route } from "@/lib/api/route";
import { lotSheetPdf } from "@/lib/documents/lot-sheet";
import { pdfResponse } from "@/lib/documents/response";
import { lotSheetDocument } from "@/lib/services/documents/lot-sheet";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ public: true }, async ({ params, viewer }) => {
  const doc = await lotSheetDocument(viewer, parseParams(IdParam, params).id);
  return pdfResponse(await lotSheetPdf(doc), `getterline-lot-${doc.lotId.slice(0, 8)}`);
});
