// GET /api/admin/users — the house's list of accounts
import { route } from "@/lib/api/route";
import { listAccounts } from "@/lib/services/accounts";

export const GET = route({ permission: "users.manage" }, async () => ({ accounts: await listAccounts() }));
