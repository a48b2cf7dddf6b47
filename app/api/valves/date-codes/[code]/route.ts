// GET /api/valves/date-codes/:code?type=… — ranked readings of a code off the glass, with reasons
import { parseWith, route } from "@/lib/api/route";
import { readCodeForType } from "@/lib/services/date-codes";
import { DateCodeQuery } from "@/lib/validation/valves";

export const GET = route<{ code: string }>({ public: true }, async ({ req, params }) => {
  const sp = req.nextUrl.searchParams;
  const q = parseWith(DateCodeQuery, {
    code: params.code,
    type: sp.get("type") || undefined,
    endOfProduction: sp.get("endOfProduction") || undefined,
  });
  return readCodeForType(q);
});
