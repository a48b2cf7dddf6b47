// GET /api/house/finance — ledger balances, the latest reconciliations, charges refunded automatically and
// processor messages set aside; POST runs a reconciliation now
import { route } from "@/lib/api/route";
import { balances, trialBalance } from "@/lib/services/ledger";
import { reconcile, recentReconciliations } from "@/lib/services/reconcile";
import { listUnexpectedCharges } from "@/lib/services/unexpected-charges";
import { recentIgnoredEvents } from "@/lib/services/webhooks";

export const GET = route({ permission: "house.manage" }, async () => ({
  balances: await balances(),
  trialBalanceCents: await trialBalance(),
  reconciliations: await recentReconciliations(),
  unexpectedCharges: await listUnexpectedCharges(),
  ignoredEvents: await recentIgnoredEvents(),
}));

export const POST = route({ permission: "house.manage" }, async () => ({ reconciliation: await reconcile() }));
