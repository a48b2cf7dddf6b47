// GET /api/sales — sales with counts; POST /api/sales — the house schedules approved lots into a sale
import { readJson, route } from "@/lib/api/route";
import { createSale, listSales } from "@/lib/services/sales";
import { SaleCreateSchema } from "@/lib/validation/sales";

export const GET = route({ permission: "account.read" }, async () => ({ sales: await listSales() }));

export const POST = route({ permission: "house.manage" }, async ({ req, viewer }) => {
  const sale = await createSale(viewer, await readJson(req, SaleCreateSchema));
  return Response.json({ sale }, { status: 201 });
});
