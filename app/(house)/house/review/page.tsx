import Link from "next/link";
import { requirePageViewer } from "@/lib/auth/guards";
import { listLots } from "@/lib/services/lots";
import { When } from "@/components/time/When";

export const metadata = { title: "Review queue" };

export default async function ReviewQueuePage() {
  const viewer = await requirePageViewer("house.manage", "/house/review");
  const lots = await listLots(viewer, "review");
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Review queue</h1>
      <p className="text-flash-700">
        Lots consignors have submitted, oldest first. Open one to read its evidence and decide.
      </p>
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>
              {["Lot", "Consignor", "Lines", "Tubes", "Submitted", "Note"].map((h) => (
                <th key={h} scope="col" className="px-3 py-2 font-medium">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {lots.map((l) => (
              <tr key={l.id} className="border-t border-flash-200">
                <td className="px-3 py-2">
                  <Link href={`/house/lots/${l.id}`} className="font-medium underline underline-offset-2">
                    {l.title}
                  </Link>
                </td>
                <td className="px-3 py-2">{l.consignorName}</td>
                <td className="px-3 py-2">{l.lines}</td>
                <td className="px-3 py-2">{l.tubes}</td>
                <td className="px-3 py-2">
                  <When iso={l.submittedAt} />
                </td>
                <td className="px-3 py-2">{l.extraReview ? "Extra review: consignor's record" : ""}</td>
              </tr>
            ))}
            {lots.length === 0 ? (
              <tr>
                <td colSpan={6} className="px-3 py-4 text-flash-600">
                  Nothing waiting for review.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
