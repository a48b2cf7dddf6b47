// POST /api/valves/types/:designation/retire — retire a type (or put it back on file), history kept
import { z } from "zod";
import { parseWith, readJson, route } from "@/lib/api/route";
import { setReferenceRetired } from "@/lib/services/reference-curation";
import { DesignationParam, ReferenceRetireSchema } from "@/lib/validation/valves";

const Params = z.object({ designation: DesignationParam });

export const POST = route<{ designation: string }>(
  { permission: "reference.edit" },
  async ({ req, params, viewer }) => {
    const { designation } = parseWith(Params, params);
    const { retired, reason } = await readJson(req, ReferenceRetireSchema);
    return setReferenceRetired(viewer.id, designation, retired, reason);
  },
);
