// GET /api/lots/import-template — the CSV template for bulk import, with example rows
import { csvTemplate } from "@/lib/lots/csv-import";

export function GET() {
  return new Response(csvTemplate(), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": 'attachment; filename="getterline-lot-template.csv"',
    },
  });
}
