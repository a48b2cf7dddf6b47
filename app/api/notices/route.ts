// GET /api/notices — the viewer's latest in-app notices
import { route } from "@/lib/api/route";
import { listNotices } from "@/lib/services/notices";

export const GET = route({ permission: "account.read" }, async ({ viewer }) => ({
  notices: await listNotices(viewer.id),
}));
