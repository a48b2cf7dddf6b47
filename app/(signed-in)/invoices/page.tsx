import Link from "next/link";
import { INVOICE_STATE_WORDS } from "@/components/invoices/words";
import { requirePageViewer } from "@/lib/auth/guards";
import { formatCents } from "@/lib/money/cents";
import { listInvoices } from "@/lib/services/invoices";

export const metadata = { title: "Invoices" };

export default async function InvoicesPage() {
  const viewer = await requirePageViewer("account.read", "/invoices");
  const invoices = await listInvoices(viewer);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Invoices</h1>
      <p className="text-flash-700">
        Lots you bought or sold. Payment is held by the house until the buyer&apos;s inspection window ends.
      </p>
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>
              {["Invoice", "Lot", "Your side", "Total", "State"].map((h) => (
                <th key={h} scope="col" className="px-3 py-2 font-medium">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {invoices.map((i) => (
              <tr key={i.id} className="border-t border-flash-200">
                <td className="px-3 py-2">
                  <Link href={`/invoices/${i.id}`} className="code underline">
                    {i.number}
                  </Link>
                </td>
                <td className="px-3 py-2">{i.title}</td>
                <td className="px-3 py-2">{i.isBuyer ? "Bought" : i.isConsignor ? "Sold" : "House"}</td>
                <td className="code px-3 py-2">{formatCents(i.totalCents)}</td>
                <td className="px-3 py-2">{INVOICE_STATE_WORDS[i.state] ?? i.state}</td>
              </tr>
            ))}
            {invoices.length === 0 ? (
              <tr>
                <td colSpan={5} className="px-3 py-4 text-flash-600">
                  No invoices yet.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
