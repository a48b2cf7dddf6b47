// POST /api/valves/types — the house adds a type to the reference table (revision 1 with who and why)
import { readJson, route } from "@/lib/api/route";
import { addReferenceType } from "@/lib/services/reference-curation";
import { ReferenceAddSchema } from "@/lib/validation/valves";

export const POST = route({ permission: "reference.edit" }, async ({ req, viewer }) => {
  return { reference: await addReferenceType(viewer.id, await readJson(req, ReferenceAddSchema)) };
});
