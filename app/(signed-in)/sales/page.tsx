import Link from "next/link";
import { requirePageViewer } from "@/lib/auth/guards";
import { listSales } from "@/lib/services/sales";
import { When } from "@/components/time/When";

export const metadata = { title: "Sales" };

export default async function SalesPage() {
  await requirePageViewer("account.read", "/sales");
  const sales = await listSales();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Sales</h1>
      <p className="text-flash-700">
        Live and past sales. Lots close one after another; a bid in the final minutes moves that lot&apos;s close.
      </p>
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>
              {["Sale", "Starts", "Lots", "Still open", "Closing between"].map((h) => (
                <th key={h} scope="col" className="px-3 py-2 font-medium">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {sales.map((s) => (
              <tr key={s.id} className="border-t border-flash-200">
                <td className="px-3 py-2">
                  <Link href={`/sales/${s.id}`} className="font-medium underline underline-offset-2">
                    {s.title}
                  </Link>
                </td>
                <td className="px-3 py-2">
                  <When iso={s.startsAt} />
                </td>
                <td className="px-3 py-2">{s.lots}</td>
                <td className="px-3 py-2">{s.open}</td>
                <td className="px-3 py-2">
                  {s.firstClose ? (
                    <>
                      <When iso={s.firstClose} /> – <When iso={s.lastClose} />
                    </>
                  ) : (
                    "—"
                  )}
                </td>
              </tr>
            ))}
            {sales.length === 0 ? (
              <tr>
                <td colSpan={5} className="px-3 py-4 text-flash-600">
                  No sales yet.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
