// POST /api/valves/types/import — preview or apply a reference-table CSV (all or nothing, line-numbered errors)
import { readJson, route } from "@/lib/api/route";
import { importReferenceCsv } from "@/lib/services/reference-curation";
import { ReferenceImportSchema } from "@/lib/validation/valves";

export const POST = route({ permission: "reference.edit" }, async ({ req, viewer }) => {
  const { csv, apply, reason } = await readJson(req, ReferenceImportSchema, 3 * 1024 * 1024);
  return importReferenceCsv(viewer.id, csv, apply, reason);
});
