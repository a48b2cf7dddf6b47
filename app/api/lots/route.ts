// GET /api/lots?scope=mine|approved|review — lots for the viewer; POST /api/lots — a consignor starts a lot
import { z } from "zod";
import { assertCan } from "@/lib/auth/guards";
import { parseWith, readJson, route } from "@/lib/api/route";
import { createLot, listLots } from "@/lib/services/lots";
import { LotDetailsSchema } from "@/lib/validation/lots";

const Scope = z.object({ scope: z.enum(["mine", "approved", "review"]).default("approved") });
const SCOPE_PERMISSION = { mine: "lots.consign", approved: "account.read", review: "house.manage" } as const;

export const GET = route({ permission: "account.read" }, async ({ req, viewer }) => {
  const { scope } = parseWith(Scope, { scope: req.nextUrl.searchParams.get("scope") ?? undefined });
  assertCan(viewer, SCOPE_PERMISSION[scope]);
  return { lots: await listLots(viewer, scope) };
});

export const POST = route({ permission: "lots.consign" }, async ({ req, viewer }) => {
  const lot = await createLot(viewer, await readJson(req, LotDetailsSchema));
  return Response.json({ lot }, { status: 201 });
});
