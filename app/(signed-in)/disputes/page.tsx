import Link from "next/link";
import { CaseStateBadge } from "@/components/disputes/CaseStateBadge";
import { utcText } from "@/components/disputes/words";
import { requirePageViewer } from "@/lib/auth/guards";
import { REASON_WORDS } from "@/lib/disputes/rules";
import { myCases } from "@/lib/services/disputes/cases";

export const metadata = { title: "Claims" };

export default async function ClaimsPage() {
  const viewer = await requirePageViewer("account.read", "/disputes");
  const cases = await myCases(viewer);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Claims</h1>
      <p className="max-w-3xl text-flash-700">
        Claims you opened as a buyer, and claims on lots you consigned. A buyer opens one from a delivered invoice,
        inside its inspection window.
      </p>
      {cases.length ? (
        <table className="card w-full text-sm">
          <thead>
            <tr className="text-left text-flash-600">
              <th className="py-1">Claim</th>
              <th>Lot</th>
              <th>Reason</th>
              <th>Opened</th>
              <th>Where it stands</th>
            </tr>
          </thead>
          <tbody>
            {cases.map((c) => (
              <tr key={c.id} className="border-t border-flash-100">
                <td className="py-1.5">
                  <Link href={`/disputes/${c.id}`} className="code underline">
                    {c.number}
                  </Link>
                </td>
                <td>{c.lotTitle}</td>
                <td>{REASON_WORDS[c.reason]}</td>
                <td>{utcText(c.createdAt)}</td>
                <td>
                  <CaseStateBadge state={c.state} />
                  {!c.answered && c.state === "awaiting-answer" ? (
                    <span className="ml-2 text-flash-600">answer due {utcText(c.answerDueAt)}</span>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <p className="text-sm text-flash-600">No claims.</p>
      )}
    </div>
  );
}
