import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { CautionStrip } from "@/components/CautionStrip";
import { ClaimForm } from "@/components/disputes/ClaimForm";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { openingRefusal } from "@/lib/disputes/rules";
import { getInvoice } from "@/lib/services/invoices";
import { getLot } from "@/lib/services/lots";

export const metadata = { title: "Open a claim" };

/** Why a claim cannot be opened now, judged at the time of this request (the page renders per request). */
function refusalAtRequest(inv: { state: string; deliveredAt: string | null; inspectionEndsAt: string | null }) {
  return openingRefusal(
    {
      state: inv.state,
      deliveredAtMs: inv.deliveredAt ? Date.parse(inv.deliveredAt) : null,
      inspectionEndsAtMs: inv.inspectionEndsAt ? Date.parse(inv.inspectionEndsAt) : null,
    },
    Date.now(),
  );
}

export default async function ClaimPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("lots.bid", `/invoices/${id}/claim`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const inv = await getInvoice(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  if (!inv.isBuyer) notFound();
  if (inv.disputeId) redirect(`/disputes/${inv.disputeId}`);
  const refusal = refusalAtRequest(inv);
  const { items } = await getLot(viewer, inv.lotId);
  return (
    <div className="space-y-5">
      <p className="text-sm">
        <Link href={`/invoices/${inv.id}`} className="underline">
          Invoice {inv.number}
        </Link>
      </p>
      <h1 className="text-2xl font-semibold">Open a claim: {inv.title}</h1>
      <p className="max-w-3xl text-flash-700">
        Tell the house what is not as listed. The payment stays held while the claim is open; the consignor answers, and
        a mediator compares your evidence with the listing line by line.
      </p>
      <CautionStrip anchor="high-voltage">
        Retesting puts lethal voltages on the tester: follow its manual and local electrical practice. Handle cracked or
        broken glass with gloves, and never break open a tube that may contain beryllium oxide, mercury or radioactive
        material.
      </CautionStrip>
      {refusal ? (
        <p role="alert" className="rounded-md border border-fault-600 bg-fault-50 px-3 py-2 text-sm text-fault-700">
          {refusal}
        </p>
      ) : (
        <ClaimForm
          invoiceId={inv.id}
          windowEnds={inv.inspectionEndsAt!}
          lines={items.map((i) => ({
            id: i.id,
            position: i.position,
            designation: i.designation,
            quantity: i.quantity,
            labelBrand: i.labelBrand,
            makerName: i.makerName,
            makerBasis: i.makerBasis,
            sourceCode: i.sourceCode,
            dateCode: i.dateCode,
            soldAsSet: i.soldAsSet,
          }))}
        />
      )}
    </div>
  );
}
