// POST /api/invoices/:id/pay — the buyer pays by card through the processor; the webhook confirms it
import { parseParams, readJson, route } from "@/lib/api/route";
import { payInvoice } from "@/lib/services/payments";
import { IdParam } from "@/lib/validation/common";
import { CardPaymentSchema } from "@/lib/validation/payments";

export const POST = route<{ id: string }>({ permission: "lots.bid" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  return payInvoice(viewer, id, await readJson(req, CardPaymentSchema, 4 * 1024));
});
