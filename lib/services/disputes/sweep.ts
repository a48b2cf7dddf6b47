/**
 * The dispute sweep: resume decisions whose money movement was interrupted,
 * refund returns the consignor has not confirmed in time, and release lots
 * the buyer did not send back by the return deadline. Every step is guarded,
 * so any number of instances may run it at once.
 */
import { DISPUTE_SETTINGS } from "../../disputes/rules";
import { release } from "../escrow";
import { refundReturnedLot } from "./returns";
import { settleDecision } from "./settle";
import { closeDispute } from "./tables/disputes";
import { overdueReturns, stuckSettling, unconfirmedReturns } from "./tables/sweep-queries";

/** One pass of the sweep; the number of cases it moved. */
export async function disputeSweep(): Promise<number> {
  let n = 0;
  for (const s of await stuckSettling()) {
    await settleDecision(s.id).catch((e: Error) => console.error("[disputes] resume failed", e.message));
    n++;
  }
  // Each case waits the receipt-confirmation days of its own sale's frozen settings version.
  for (const d of await unconfirmedReturns(DISPUTE_SETTINGS.receiptConfirmDays)) {
    await refundReturnedLot(d, "receipt was not confirmed in time").catch((e: Error) =>
      console.error("[disputes] refund failed", e.message),
    );
    n++;
  }
  for (const d of await overdueReturns()) {
    await release(d.invoice_id, `claim ${d.number}: the lot was not returned in time`, { fromDispute: true }).catch(
      (e: Error) => console.error("[disputes] release failed", e.message),
    );
    if (
      await closeDispute(
        d.id,
        "awaiting-return",
        "the buyer did not ship the lot back by the return deadline; payment released to the consignor",
      )
    )
      n++;
  }
  return n;
}
