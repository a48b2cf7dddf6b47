// GET /api/valves/source-codes/:code — which registered maker a source code names (evidence, not proof)
import { z } from "zod";
import { parseWith, route } from "@/lib/api/route";
import { lookupRegisteredCode } from "@/lib/services/makers";

export const GET = route<{ code: string }>({ public: true }, async ({ params }) => {
  const { code } = parseWith(
    z.object({ code: z.string().trim().min(1).max(24, "A source code is at most 24 characters") }),
    params,
  );
  return lookupRegisteredCode(code);
});
