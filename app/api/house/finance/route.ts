// GET /api/house/finance — ledger balances and the latest reconciliations; POST runs a reconciliation now
import { route } from "@/lib/api/route";
import { balances, trialBalance } from "@/lib/services/ledger";
import { reconcile, recentReconciliations } from "@/lib/services/reconcile";

export const GET = route({ permission: "house.manage" }, async () => ({
  balances: await balances(), trialBalanceCents: await trialBalance(), reconciliations: await recentReconciliations(),
}));

export const POST = route({ permission: "house.manage" }, async () => ({ reconciliation: await reconcile() }));
