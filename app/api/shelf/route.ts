// GET /api/shelf — the viewer's shelf (proposed, waiting, confirmed); POST /api/shelf — put a tube on it
import { readJson, route } from "@/lib/api/route";
import { addShelfTube, listShelf } from "@/lib/services/shelf";
import { ShelfTubeSchema } from "@/lib/validation/shelf";

export const GET = route({ permission: "shelf.use" }, async ({ viewer }) => listShelf(viewer));

export const POST = route({ permission: "shelf.use" }, async ({ req, viewer }) => {
  const tube = await addShelfTube(viewer, await readJson(req, ShelfTubeSchema));
  return Response.json({ tube }, { status: 201 });
});
