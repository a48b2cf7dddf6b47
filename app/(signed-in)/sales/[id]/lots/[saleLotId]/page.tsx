import Link from "next/link";
import { notFound } from "next/navigation";
import { LiveLot } from "@/components/live/LiveLot";
import { PhotoGallery } from "@/components/lots/PhotoGallery";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { can } from "@/lib/auth/roles";
import { getLot } from "@/lib/services/lots";
import { getSaleLot } from "@/lib/services/sales";
import { recordForLot } from "@/lib/services/track-record";
import { ConsignorRecord } from "@/components/disputes/ConsignorRecord";

export const metadata = { title: "Live lot" };

export default async function LiveLotPage({ params }: { params: Promise<{ id: string; saleLotId: string }> }) {
  const { id, saleLotId } = await params;
  const viewer = await requirePageViewer("account.read", `/sales/${id}/lots/${saleLotId}`);
  if (!/^[0-9a-f-]{36}$/i.test(saleLotId)) notFound();
  const data = await getSaleLot(viewer, saleLotId).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  if (data.live.saleId !== id) notFound();
  const [record, lot] = await Promise.all([recordForLot(data.live.lotId), getLot(viewer, data.live.lotId)]);
  return (
    <div className="space-y-4">
      <p className="text-sm">
        <Link href={`/sales/${id}`} className="underline">
          {data.sale.title}
        </Link>{" "}
        / lot {data.live.position}
      </p>
      <h1 className="text-2xl font-semibold">{data.live.title}</h1>
      <p className="text-sm text-flash-700">Consigned by {data.live.consignor}</p>
      {record ? <ConsignorRecord record={record} /> : null}
      <LiveLot initial={data} canBid={can(viewer.roles, "lots.bid")} lotHref={`/lots/${data.live.lotId}`} />
      {lot.photos.length ? (
        <section aria-labelledby="photos-h" className="space-y-2">
          <h2 id="photos-h" className="text-lg font-semibold">
            Photos <span className="text-sm font-normal text-flash-600">({lot.photos.length})</span>
          </h2>
          <PhotoGallery
            photos={lot.photos}
            labelOf={Object.fromEntries(lot.items.map((i) => [i.id, `Line ${i.position}: ${i.designation}`]))}
          />
        </section>
      ) : null}
    </div>
  );
}
