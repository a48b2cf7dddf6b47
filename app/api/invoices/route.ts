// GET /api/invoices — invoices the viewer is party to (the house sees all)
import { route } from "@/lib/api/route";
import { listInvoices } from "@/lib/services/invoices";

export const GET = route({ permission: "account.read" }, async ({ viewer }) => ({
  invoices: await listInvoices(viewer),
}));
