import { notFound } from "next/navigation";
import { LotView } from "@/components/lots/LotView";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { summaryFor } from "@/lib/services/lot-summary";
import { getLot } from "@/lib/services/lots";
import { consignorRecord } from "@/lib/services/track-record";

export const metadata = { title: "Lot" };

export default async function LotPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("account.read", `/lots/${id}`);
  const data = await getLot(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const [{ summary, chart }, record] = await Promise.all([summaryFor(data.items), consignorRecord(data.lot.consignorId)]);
  return <LotView data={data} summary={summary} chart={chart} record={record} />;
}
