// POST /api/notices/read — mark the viewer's notices read
import { route } from "@/lib/api/route";
import { markNoticesRead } from "@/lib/services/notices";

export const POST = route({ permission: "account.read" }, async ({ viewer }) => {
  await markNoticesRead(viewer.id);
  return { read: true };
});
