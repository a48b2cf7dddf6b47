// PATCH /api/want-lists/:id — pause, resume or rename; DELETE removes it (the dealer's own lists only)
import { parseParams, readJson, route } from "@/lib/api/route";
import { deleteWantList, updateWantList } from "@/lib/services/want-lists";
import { IdParam } from "@/lib/validation/common";
import { WantListPatchSchema } from "@/lib/validation/want-lists";

export const PATCH = route<{ id: string }>({ permission: "lots.bid" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  return { wantList: await updateWantList(viewer, id, await readJson(req, WantListPatchSchema, 2 * 1024)) };
});

export const DELETE = route<{ id: string }>({ permission: "lots.bid" }, async ({ params, viewer }) => {
  await deleteWantList(viewer, parseParams(IdParam, params).id);
  return { deleted: true };
});
