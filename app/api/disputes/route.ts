// GET /api/disputes — the viewer's own claims, as buyer or consignor
import { route } from "@/lib/api/route";
import { myCases } from "@/lib/services/disputes/cases";

export const GET = route({ permission: "account.read" }, async ({ viewer }) => ({ disputes: await myCases(viewer) }));
