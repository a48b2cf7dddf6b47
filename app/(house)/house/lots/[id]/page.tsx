import { notFound } from "next/navigation";
import { AmendmentForm } from "@/components/house/AmendmentForm";
import { DecisionForm } from "@/components/house/DecisionForm";
import { LotView } from "@/components/lots/LotView";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { summaryFor } from "@/lib/services/lot-summary";
import { getLot } from "@/lib/services/lots";

export const metadata = { title: "Review a lot" };

export default async function HouseLotPage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageViewer("house.manage", "/house/review");
  const { id } = await params;
  const data = await getLot(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const { summary, chart } = await summaryFor(data.items);
  const est = summary.estimate.kind === "range" ? summary.estimate : null;
  const items = data.items.map((i) => ({ id: i.id, label: `Line ${i.position}: ${i.designation} ×${i.quantity}` }));
  const actions =
    data.lot.state === "in-review" ? (
      <DecisionForm lotId={id} suggestedLowCents={est?.lowCents} suggestedHighCents={est?.highCents} />
    ) : data.lot.state === "approved" ? (
      <AmendmentForm lotId={id} items={items} />
    ) : null;
  return <LotView data={data} summary={summary} chart={chart} actions={actions} />;
}
