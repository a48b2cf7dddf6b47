// POST /api/shelf/:id/accept — accept a construction match for a shelf tube
import { z } from "zod";
import { parseParams, readJson, route } from "@/lib/api/route";
import { acceptMatch } from "@/lib/services/shelf";
import { IdParam } from "@/lib/validation/common";

const Body = z.object({ makerName: z.string().trim().min(1).max(120) });

export const POST = route<{ id: string }>({ permission: "shelf.use" }, async ({ req, params, viewer }) => {
  const { id } = parseParams(IdParam, params);
  const { makerName } = await readJson(req, Body);
  return { tube: await acceptMatch(viewer, id, makerName) };
});
