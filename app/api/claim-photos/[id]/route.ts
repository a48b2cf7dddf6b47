// GET /api/claim-photos/:id?size=thumb|full — a photo of a claim's evidence, for those who may read the claim
import { z } from "zod";
import { parseParams, parseWith, route } from "@/lib/api/route";
import { photoResponse } from "@/lib/api/upload";
import { readDisputePhoto } from "@/lib/services/disputes/evidence";
import { IdParam } from "@/lib/validation/common";

const Query = z.object({ size: z.enum(["thumb", "full"]).default("thumb") });

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const { size } = parseWith(Query, { size: req.nextUrl.searchParams.get("size") ?? undefined });
  return photoResponse(await readDisputePhoto(viewer, id, size));
});
