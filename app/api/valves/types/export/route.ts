// GET /api/valves/types/export — the reference table on file as CSV
import { route } from "@/lib/api/route";
import { exportReferenceCsv } from "@/lib/services/reference-curation";

export const GET = route({ permission: "reference.edit" }, async () => {
  return new Response(await exportReferenceCsv(), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": 'attachment; filename="reference-types.csv"',
    },
  });
});
