import Link from "next/link";
import { notFound } from "next/navigation";
import { CaseEvidence } from "@/components/disputes/CaseEvidence";
import { CaseThread } from "@/components/disputes/CaseThread";
import { ClaimedItems } from "@/components/disputes/ClaimedItems";
import { DecisionSummary } from "@/components/disputes/DecisionSummary";
import { ReturnPanel } from "@/components/disputes/ReturnPanel";
import { CaseStateBadge } from "@/components/disputes/CaseStateBadge";
import { utcText } from "@/components/disputes/words";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { REASON_WORDS, REMEDY_WORDS, STANCE_WORDS, type Remedy } from "@/lib/disputes/rules";
import { getCase } from "@/lib/services/disputes/cases";
import { getLot } from "@/lib/services/lots";

export const metadata = { title: "Claim" };

export default async function CasePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("account.read", `/disputes/${id}`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const c = await getCase(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const { items: lotItems } = await getLot(viewer, c.lotId).catch(() => ({
    items: [] as { id: string; position: number; designation: string }[],
  }));
  const mine = c.role === "mediator" && c.mediatorId === viewer.id;
  const canWrite = c.role === "buyer" || c.role === "consignor" || mine;
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-semibold">
            Claim <span className="code">{c.number}</span>
          </h1>
          <CaseStateBadge state={c.state} />
        </div>
        <p className="text-flash-700">
          <Link href={`/lots/${c.lotId}`} className="underline">
            {c.lotTitle}
          </Link>
          {" · "}
          <Link href={`/invoices/${c.invoiceId}`} className="underline">
            invoice {c.invoiceNumber}
          </Link>
          {c.role === "mediator" ? " (read only)" : ""} · {REASON_WORDS[c.reason]} · asks for:{" "}
          {REMEDY_WORDS[c.remedy as Remedy] ?? c.remedy}
        </p>
        <p className="text-sm text-flash-700">
          Buyer {c.buyer} · consignor {c.consignor} ·{" "}
          {c.answeredAt ? (
            <>
              consignor answered {utcText(c.answeredAt)}: <strong>{c.stance ? STANCE_WORDS[c.stance] : ""}</strong>
            </>
          ) : c.deadlinePassed ? (
            <strong className="text-fault-700">
              the consignor did not answer by {utcText(c.answerDueAt)}; the mediator decides on the buyer&apos;s
              evidence
            </strong>
          ) : (
            <>
              consignor&apos;s answer due by <strong>{utcText(c.answerDueAt)}</strong>
            </>
          )}{" "}
          · {c.takenAt ? "with a mediator" : "waiting for a mediator"}
        </p>
        {c.role === "mediator" ? (
          <p>
            <Link href={`/mediation/cases/${c.id}`} className="btn-primary inline-block">
              Open the mediator&apos;s workspace
            </Link>
          </p>
        ) : null}
        {c.invoiceState === "disputed" ? (
          <p className="text-sm text-flash-600">
            {c.undisputedReleasedAt
              ? `The share of the lot the claim does not cover was paid to the consignor on ${utcText(c.undisputedReleasedAt)}; the rest`
              : "The payment for the lot"}{" "}
            stays held by the house until the claim is decided.
          </p>
        ) : null}
      </header>
      {c.decision ? <DecisionSummary c={c} /> : null}
      {c.state === "awaiting-return" ? (
        <ReturnPanel
          caseId={c.id}
          role={c.role}
          dueAt={c.returnDueAt}
          shippedAt={c.returnShippedAt}
          carrier={c.returnCarrier}
          tracking={c.returnTracking}
        />
      ) : null}
      <ClaimedItems items={c.items} />
      <CaseEvidence
        caseId={c.id}
        lotId={c.lotId}
        photos={c.photos}
        canAdd={canWrite && c.state !== "closed"}
        items={lotItems.map((i) => ({ id: i.id, label: `Line ${i.position}: ${i.designation}` }))}
      />
      <CaseThread
        caseId={c.id}
        messages={c.messages}
        canWrite={canWrite}
        asksStance={c.role === "consignor" && !c.answeredAt}
        closed={c.state === "closed"}
      />
    </div>
  );
}
