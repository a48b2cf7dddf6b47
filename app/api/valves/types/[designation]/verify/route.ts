// POST /api/valves/types/:designation/verify — record that the row was checked against a named data sheet
import { z } from "zod";
import { parseWith, readJson, route } from "@/lib/api/route";
import { verifyReferenceType } from "@/lib/services/reference-curation";
import { DesignationParam, ReferenceVerifySchema } from "@/lib/validation/valves";

const Params = z.object({ designation: DesignationParam });

export const POST = route<{ designation: string }>(
  { permission: "reference.edit" },
  async ({ req, params, viewer }) => {
    const { designation } = parseWith(Params, params);
    const { against } = await readJson(req, ReferenceVerifySchema);
    return verifyReferenceType(viewer.id, designation, against);
  },
);
