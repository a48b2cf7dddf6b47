// GET /api/valves/types/:designation — decode, equivalents, reference figures and hazards (404 with candidates)
// PATCH /api/valves/types/:designation — the house corrects a reference row (history kept)
import { z } from "zod";
import { parseWith, readJson, route } from "@/lib/api/route";
import { editReferenceType, lookupType } from "@/lib/services/valve-types";
import { DesignationParam, ReferenceEditSchema } from "@/lib/validation/valves";

const Params = z.object({ designation: DesignationParam });
const Edit = ReferenceEditSchema.extend({ expectedRevision: z.number().int().positive() });

export const GET = route<{ designation: string }>({ public: true }, async ({ params }) => {
  const { designation } = parseWith(Params, params);
  return lookupType(designation);
});

export const PATCH = route<{ designation: string }>(
  { permission: "reference.edit" },
  async ({ req, params, viewer }) => {
    const { designation } = parseWith(Params, params);
    const { expectedRevision, ...edit } = await readJson(req, Edit);
    return { reference: await editReferenceType(viewer.id, designation, expectedRevision, edit) };
  },
);
