// GET /api/valves/types/:designation/history — who changed a reference row, when and why
import { z } from "zod";
import { parseWith, route } from "@/lib/api/route";
import { referenceHistory } from "@/lib/services/valve-types";
import { DesignationParam } from "@/lib/validation/valves";

export const GET = route<{ designation: string }>({ permission: "reference.edit" }, async ({ params }) => {
  const { designation } = parseWith(z.object({ designation: DesignationParam }), params);
  return { history: await referenceHistory(designation) };
});
