// GET /api/account/me — the signed-in person, with roles fresh from the database
import { route } from "@/lib/api/route";
import { homeFor } from "@/lib/auth/roles";

export const GET = route({ permission: "account.read" }, async ({ viewer }) => ({
  id: viewer.id,
  email: viewer.email,
  name: viewer.name,
  roles: viewer.roles,
  home: homeFor(viewer.roles),
}));
