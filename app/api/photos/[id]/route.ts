// GET /api/photos/:id?size=thumb|full — a lot photo, only for those who may see the lot
import { z } from "zod";
import { parseParams, parseWith, route } from "@/lib/api/route";
import { readPhoto } from "@/lib/services/lot-photos";
import { IdParam } from "@/lib/validation/common";

const Query = z.object({ size: z.enum(["thumb", "full"]).default("thumb") });

export const GET = route<{ id: string }>({ permission: "account.read" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const { size } = parseWith(Query, { size: req.nextUrl.searchParams.get("size") ?? undefined });
  const obj = await readPhoto(viewer, id, size);
  return new Response(new Uint8Array(obj.body), {
    headers: {
      "content-type": obj.contentType,
      "content-length": String(obj.contentLength),
      "cache-control": "private, max-age=300",
      "x-content-type-options": "nosniff",
      "content-disposition": "inline",
    },
  });
});
