// PATCH /api/admin/users/:id — grant or remove roles
import { z } from "zod";
import { parseWith, readJson, route } from "@/lib/api/route";
import { setRoles } from "@/lib/services/accounts";
import { RolesUpdateSchema } from "@/lib/validation/account";

const Params = z.object({ id: z.uuid("Not an account id") });

export const PATCH = route<{ id: string }>({ permission: "users.manage" }, async ({ req, params, viewer }) => {
  const { id } = parseWith(Params, params);
  const { roles } = await readJson(req, RolesUpdateSchema);
  return { account: await setRoles(viewer.id, id, roles) };
});
