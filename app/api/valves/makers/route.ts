// GET /api/valves/makers — the house's maker registry (source code → maker), demo rows marked
import { route } from "@/lib/api/route";
import { registryEntries } from "@/lib/services/makers";

export const GET = route({ permission: "account.read" }, async () => ({ entries: await registryEntries() }));
