import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { PriceHistory } from "@/components/catalogue/PriceHistory";
import { DocumentLinks } from "@/components/documents/DocumentLinks";
import { When } from "@/components/time/When";
import { LotView } from "@/components/lots/LotView";
import { formatCents } from "@/lib/money/cents";
import { ApiError } from "@/lib/api/errors";
import { currentViewer } from "@/lib/auth/guards";
import { priceHistoryForFamilies } from "@/lib/services/catalogue/price-history";
import { summaryFor } from "@/lib/services/lot-summary";
import { getLot, saleLotOf } from "@/lib/services/lots";
import { consignorRecord } from "@/lib/services/track-record";

export const metadata = { title: "Lot" };

/**
 * A lot's evidence page. Anyone may read a listed lot (the public catalogue links here); a lot not yet
 * listed is for its consignor and the house, so a signed-out visitor is asked to sign in and comes back.
 */
export default async function LotPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await currentViewer().catch(() => null);
  const data = await getLot(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") {
      if (!viewer && /^[0-9a-f-]{36}$/i.test(id)) redirect(`/sign-in?from=${encodeURIComponent(`/lots/${id}`)}`);
      notFound();
    }
    throw e;
  });
  const [{ summary, chart }, record, sale] = await Promise.all([
    summaryFor(data.items),
    consignorRecord(data.lot.consignorId),
    saleLotOf(id),
  ]);
  const history = await priceHistoryForFamilies(summary.families.map((f) => f.key));
  const actions =
    sale?.phase === "open" ? (
      <p className="card flex flex-wrap items-center gap-3 text-sm">
        This lot is offered in <strong>{sale.saleTitle}</strong>.
        {viewer ? (
          <Link
            href={`/sales/${sale.saleId}/lots/${sale.saleLotId}`}
            className="btn-primary"
            data-testid="back-to-bidding"
          >
            Back to bidding on this lot
          </Link>
        ) : (
          <Link href={`/sign-in?from=${encodeURIComponent(`/lots/${id}`)}`} className="btn-primary">
            Sign in to bid
          </Link>
        )}
      </p>
    ) : sale?.phase === "sold" ? (
      <p className="card text-sm" data-testid="lot-outcome">
        <Link href={`/sales/${sale.saleId}/lots/${sale.saleLotId}`} className="underline underline-offset-2">
          Sold in <strong>{sale.saleTitle}</strong>
        </Link>
        {sale.hammerCents != null ? (
          <>
            {" "}
            for <strong className="code">{formatCents(sale.hammerCents)}</strong>
          </>
        ) : null}
        {sale.closedAt ? (
          <>
            {" "}
            on <When iso={sale.closedAt} />
          </>
        ) : null}
        .
      </p>
    ) : sale ? (
      <p className="card text-sm" data-testid="lot-outcome">
        Offered in <strong>{sale.saleTitle}</strong>; it closed unsold.
      </p>
    ) : !viewer ? (
      <p className="card text-sm">
        <Link
          href={`/sign-in?from=${encodeURIComponent(`/lots/${id}`)}`}
          className="font-medium underline underline-offset-4"
        >
          Sign in
        </Link>{" "}
        to watch this lot and bid when it is offered.
      </p>
    ) : null;
  return (
    <div className="space-y-6">
      <LotView
        data={data}
        summary={summary}
        chart={chart}
        record={record}
        actions={
          <>
            {actions}
            <DocumentLinks
              links={[
                { href: `/api/lots/${id}/sheet`, label: "Lot sheet (PDF)" },
                ...(sale ? [{ href: `/api/sales/${sale.saleId}/catalogue`, label: "Sale catalogue (PDF)" }] : []),
              ]}
            />
          </>
        }
      />
      <PriceHistory series={history} />
    </div>
  );
}
