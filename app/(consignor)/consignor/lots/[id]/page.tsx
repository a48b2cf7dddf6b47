import { notFound } from "next/navigation";
import { LotEditor } from "@/components/lots/LotEditor";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { getLot } from "@/lib/services/lots";
import { referenceRowsForClient } from "@/lib/services/reference-table";

export const metadata = { title: "Your lot" };

export default async function ConsignorLotPage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageViewer("lots.consign");
  const { id } = await params;
  const data = await getLot(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  if (data.lot.consignorId !== viewer.id) notFound();
  return <LotEditor initial={data} reference={await referenceRowsForClient()} />;
}
