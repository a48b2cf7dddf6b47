// GET /api/photos/:id?size=list|thumb|full — a lot photo, for those who may see the lot (anyone once it is listed)
import { z } from "zod";
import { parseParams, parseWith, route } from "@/lib/api/route";
import { photoResponse } from "@/lib/api/upload";
import { readPhoto } from "@/lib/services/lot-photos";
import { IdParam } from "@/lib/validation/common";

const Query = z.object({ size: z.enum(["list", "thumb", "full"]).default("thumb") });

export const GET = route<{ id: string }>({ public: true }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const { size } = parseWith(Query, { size: req.nextUrl.searchParams.get("size") ?? undefined });
  return photoResponse(await readPhoto(viewer, id, size));
});
