import Link from "next/link";
import { requirePageViewer } from "@/lib/auth/guards";
import { listLots } from "@/lib/services/lots";
import { formatCents } from "@/lib/money/cents";

export const metadata = { title: "Approved lots" };

export default async function LotsPage() {
  const viewer = await requirePageViewer("account.read", "/lots");
  const lots = await listLots(viewer, "approved");
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Approved lots</h1>
      <p className="text-flash-700">Lots the house has reviewed and approved, with their evidence.</p>
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>{["Lot", "Consignor", "Lines", "Tubes", "Estimate"].map((h) => <th key={h} scope="col" className="px-3 py-2 font-medium">{h}</th>)}</tr>
          </thead>
          <tbody>
            {lots.map((l) => (
              <tr key={l.id} className="border-t border-flash-200">
                <td className="px-3 py-2"><Link href={`/lots/${l.id}`} className="font-medium underline underline-offset-2">{l.title}</Link></td>
                <td className="px-3 py-2">{l.consignorName}</td>
                <td className="px-3 py-2">{l.lines}</td>
                <td className="px-3 py-2">{l.tubes}</td>
                <td className="px-3 py-2">{l.estimateLowCents != null && l.estimateHighCents != null ? `${formatCents(l.estimateLowCents)}–${formatCents(l.estimateHighCents)}` : "—"}</td>
              </tr>
            ))}
            {lots.length === 0 ? <tr><td colSpan={5} className="px-3 py-4 text-flash-600">No approved lots yet.</td></tr> : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
