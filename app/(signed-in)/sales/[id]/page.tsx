import { notFound } from "next/navigation";
import { DocumentLinks } from "@/components/documents/DocumentLinks";
import { SaleBoard } from "@/components/live/SaleBoard";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { getSale } from "@/lib/services/sales";

export const metadata = { title: "Sale" };

export default async function SalePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("account.read", `/sales/${id}`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const data = await getSale(id, viewer).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const secs = data.sale.softCloseSeconds;
  const span = secs % 60 === 0 ? `${secs / 60} ${secs === 60 ? "minute" : "minutes"}` : `${secs} seconds`;
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">{data.sale.title}</h1>
      <p className="text-sm text-flash-700">
        Prices move live. A bid in a lot&apos;s last {span} moves that lot&apos;s close to {span} after the bid.
      </p>
      <DocumentLinks links={[{ href: `/api/sales/${id}/catalogue`, label: "Sale catalogue (PDF)" }]} />
      <SaleBoard initial={data} />
    </div>
  );
}
