// GET /api/health — 200 when the database answers, 503 while it does not
import { databaseUp } from "@/lib/services/health";

export const dynamic = "force-dynamic";

export async function GET() {
  const up = await databaseUp();
  return Response.json(up ? { status: "ok", db: "up" } : { status: "degraded", db: "down" }, {
    status: up ? 200 : 503,
    headers: { "Cache-Control": "no-store" },
  });
}
