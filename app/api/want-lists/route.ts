// GET /api/want-lists — the dealer's want lists; POST saves one (at most 100 per dealer)
import { readJson, route } from "@/lib/api/route";
import { createWantList, listWantLists } from "@/lib/services/want-lists";
import { WantListCreateSchema } from "@/lib/validation/want-lists";

export const GET = route({ permission: "lots.bid" }, async ({ viewer }) => ({
  wantLists: await listWantLists(viewer),
}));

export const POST = route({ permission: "lots.bid" }, async ({ req, viewer }) => {
  const created = await createWantList(viewer, await readJson(req, WantListCreateSchema, 8 * 1024));
  return Response.json({ wantList: created }, { status: 201 });
});
