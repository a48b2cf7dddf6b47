// GET /api/shelf/:id — one shelf tube with its ranked candidate makers
import { parseParams, route } from "@/lib/api/route";
import { shelfTube } from "@/lib/services/shelf";
import { IdParam } from "@/lib/validation/common";

export const GET = route<{ id: string }>({ permission: "shelf.use" }, async ({ params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  return shelfTube(viewer, id);
});
