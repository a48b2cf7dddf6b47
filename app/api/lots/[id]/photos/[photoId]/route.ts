// DELETE /api/lots/:id/photos/:photoId — the consignor removes a photo while the lot is editable
import { z } from "zod";
import { parseParams, route } from "@/lib/api/route";
import { removePhoto } from "@/lib/services/lot-photos";

const Params = z.object({ id: z.uuid(), photoId: z.uuid() });

export const DELETE = route<{ id: string; photoId: string }>(
  { permission: "lots.consign" },
  async ({ params, viewer }) => {
    const { id, photoId } = parseParams(Params, params);
    await removePhoto(viewer, id, photoId);
    return { removed: true };
  },
);
