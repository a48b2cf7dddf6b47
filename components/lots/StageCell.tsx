import Link from "next/link";
import type { ConsignedLot } from "@/lib/services/consignor-desk";
import { formatCents } from "@/lib/money/cents";
import { canRelist } from "@/lib/lots/lifecycle";
import { When } from "@/components/time/When";
import { RelistButton } from "./RelistButton";

/** Where a consigned lot is now, in words, with what follows from it (live figures, invoice, claim, relisting). */
export function StageCell({ lot }: { lot: ConsignedLot }) {
  const s = lot.sale;
  return (
    <div className="space-y-0.5">
      <p className="font-medium" data-testid={`stage-${lot.id}`}>
        {lot.stageWords}
      </p>
      {s && (lot.stage === "in-sale" || lot.stage === "scheduled") ? (
        <p className="text-xs text-flash-700">
          {s.bidCount ? (
            <>
              <span className="code">{formatCents(s.priceCents)}</span> · {s.bidCount} bids · reserve{" "}
              {s.reserveMet ? "reached" : "not reached"}
            </>
          ) : (
            "No bids yet"
          )}
          {" · closes "}
          <When iso={s.closesAt} />
          {" · "}
          <Link href={`/sales/${s.id}/lots/${s.saleLotId}`} className="underline">
            follow
          </Link>
        </p>
      ) : null}
      {s && s.hammerCents != null ? (
        <p className="text-xs text-flash-700">
          Hammer <span className="code">{formatCents(s.hammerCents)}</span> in {s.title}
        </p>
      ) : null}
      {canRelist(lot.stage) ? (
        <div className="space-y-1">
          <p className="text-xs text-flash-700">
            Closed <When iso={s?.closesAt} style="date" /> without a sale.
          </p>
          <RelistButton lotId={lot.id} />
        </div>
      ) : null}
      {lot.invoice ? (
        <Link href={`/invoices/${lot.invoice.id}`} className="text-xs underline">
          Invoice
        </Link>
      ) : null}
      {lot.claimId ? (
        <>
          {" "}
          ·{" "}
          <Link href={`/disputes/${lot.claimId}`} className="text-xs underline">
            Claim
          </Link>
        </>
      ) : null}
    </div>
  );
}
