import { notFound } from "next/navigation";
import { SaleBoard } from "@/components/live/SaleBoard";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { getSale } from "@/lib/services/sales";

export const metadata = { title: "Sale" };

export default async function SalePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("account.read", `/sales/${id}`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const data = await getSale(id, viewer).catch((e) => { if (e instanceof ApiError && e.code === "not_found") notFound(); throw e; });
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">{data.sale.title}</h1>
      <p className="text-sm text-flash-700">Prices move live. A bid in a lot&apos;s last {Math.round(data.sale.softCloseSeconds / 60)} minutes moves that lot&apos;s close to {Math.round(data.sale.softCloseSeconds / 60)} minutes after the bid.</p>
      <SaleBoard initial={data} />
    </div>
  );
}
