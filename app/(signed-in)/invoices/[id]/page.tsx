import { notFound } from "next/navigation";
import { DocumentLinks } from "@/components/documents/DocumentLinks";
import { InvoiceView } from "@/components/invoices/InvoiceView";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { getInvoice } from "@/lib/services/invoices";

export const metadata = { title: "Invoice" };

export default async function InvoicePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("account.read", `/invoices/${id}`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const inv = await getInvoice(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const house = viewer.roles.includes("admin");
  const mediator = "readOnly" in inv;
  // The same parties as the download routes allow: the buyer and the house; the mediator the invoice only.
  const papers = [
    ...(house || inv.isBuyer || mediator ? [{ href: `/api/invoices/${id}/pdf`, label: "Invoice (PDF)" }] : []),
    ...(house || inv.isBuyer ? [{ href: `/api/invoices/${id}/packing-slip`, label: "Packing slip (PDF)" }] : []),
  ];
  return (
    <>
      <DocumentLinks links={papers} className="mb-3" />
      {"readOnly" in inv ? (
        <p className="mb-3 rounded-md border border-flash-300 bg-flash-50 px-3 py-2 text-sm" role="note">
          You mediate this invoice&apos;s claim: you can read it here, but not change it.
        </p>
      ) : null}
      <InvoiceView initial={inv} house={house} />
    </>
  );
}
