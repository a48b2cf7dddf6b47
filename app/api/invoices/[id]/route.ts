// GET /api/invoices/:id — one invoice, for its buyer, its consignor or the house
import { parseParams, route } from "@/lib/api/route";
import { getInvoice } from "@/lib/services/invoices";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ params, viewer }) =>
  getInvoice(viewer, parseParams(IdParam, params).id),
);
