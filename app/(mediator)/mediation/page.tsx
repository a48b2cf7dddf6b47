import Link from "next/link";
import { CaseStateBadge } from "@/components/disputes/CaseStateBadge";
import { TakeCaseButton } from "@/components/disputes/TakeCaseButton";
import { utcText } from "@/components/disputes/words";
import { requirePageViewer } from "@/lib/auth/guards";
import { REASON_WORDS, OUTCOME_WORDS } from "@/lib/disputes/rules";
import { mediationQueue } from "@/lib/services/disputes/cases";
import { type CaseSummary } from "@/lib/services/disputes/presenters";

export const metadata = { title: "Mediation" };

function answer(c: CaseSummary) {
  if (c.answered) return <span>answered</span>;
  if (c.deadlinePassed)
    return <strong className="text-fault-700">no answer; deadline passed {utcText(c.answerDueAt)}</strong>;
  return <span>due {utcText(c.answerDueAt)}</span>;
}

export default async function MediationHome() {
  const viewer = await requirePageViewer("disputes.mediate", "/mediation");
  const q = await mediationQueue(viewer);
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <h1 className="text-2xl font-semibold">Mediation · {viewer.name}</h1>
        <p className="max-w-3xl text-flash-700">
          Weigh a buyer&apos;s evidence against what a listing claimed, line by line: codes, construction and readings.
          Take a claim from the queue; decide once the consignor has answered or their deadline has passed.
        </p>
        <p className="text-sm">
          <Link href="/shelf" className="underline">
            Attribution workbench
          </Link>{" "}
          ·{" "}
          <Link href="/reference" className="underline">
            Valve reference
          </Link>
        </p>
      </header>
      <section aria-labelledby="queue-h" className="space-y-2">
        <h2 id="queue-h" className="text-lg font-semibold">
          Queue ({q.waiting.length})
        </h2>
        {q.waiting.length ? (
          <table className="card w-full text-sm">
            <thead>
              <tr className="text-left text-flash-600">
                <th className="py-1">Claim</th>
                <th>Lot</th>
                <th>Reason</th>
                <th>Opened</th>
                <th>Consignor&apos;s answer</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {q.waiting.map((c) => (
                <tr key={c.id} className="border-t border-flash-100 align-top">
                  <td className="py-1.5">
                    <Link href={`/disputes/${c.id}`} className="code underline">
                      {c.number}
                    </Link>
                  </td>
                  <td>{c.lotTitle}</td>
                  <td>{REASON_WORDS[c.reason]}</td>
                  <td>{utcText(c.createdAt)}</td>
                  <td>{answer(c)}</td>
                  <td className="py-1.5 text-right">
                    <TakeCaseButton caseId={c.id} number={c.number} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p className="text-sm text-flash-600">No claims waiting.</p>
        )}
      </section>
      <section aria-labelledby="mine-h" className="space-y-2">
        <h2 id="mine-h" className="text-lg font-semibold">
          My cases ({q.mine.length})
        </h2>
        {q.mine.length ? (
          <ul className="space-y-1 text-sm">
            {q.mine.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center gap-2">
                <Link href={`/mediation/cases/${c.id}`} className="code underline">
                  {c.number}
                </Link>{" "}
                {c.lotTitle} · {REASON_WORDS[c.reason]} · <CaseStateBadge state={c.state} /> · {answer(c)}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-flash-600">None open.</p>
        )}
      </section>
      {q.recent.length ? (
        <section aria-labelledby="recent-h" className="space-y-2">
          <h2 id="recent-h" className="text-lg font-semibold">
            Recently decided
          </h2>
          <ul className="space-y-1 text-sm">
            {q.recent.map((c) => (
              <li key={c.id}>
                <Link href={`/disputes/${c.id}`} className="code underline">
                  {c.number}
                </Link>{" "}
                {c.lotTitle} · {c.outcome ? OUTCOME_WORDS[c.outcome] : ""}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
