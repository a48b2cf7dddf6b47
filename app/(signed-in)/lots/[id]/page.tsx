import Link from "next/link";
import { notFound } from "next/navigation";
import { LotView } from "@/components/lots/LotView";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { summaryFor } from "@/lib/services/lot-summary";
import { getLot } from "@/lib/services/lots";
import { saleLotOf } from "@/lib/services/sales";
import { consignorRecord } from "@/lib/services/track-record";

export const metadata = { title: "Lot" };

export default async function LotPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("account.read", `/lots/${id}`);
  const data = await getLot(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const [{ summary, chart }, record, offered] = await Promise.all([summaryFor(data.items), consignorRecord(data.lot.consignorId), saleLotOf(id)]);
  return (
    <>
      {offered ? (
        <p className="mb-3 text-sm">
          <Link href={`/sales/${offered.saleId}/lots/${offered.saleLotId}`} className="underline underline-offset-2" data-testid="back-to-bidding">
            {offered.phase === "open" ? "← Back to bidding on this lot" : "← This lot in its sale"}
          </Link>
        </p>
      ) : null}
      <LotView data={data} summary={summary} chart={chart} record={record} />
    </>
  );
}
