import Link from "next/link";
import { notFound } from "next/navigation";
import { CaseEvidence } from "@/components/disputes/CaseEvidence";
import { CaseStateBadge } from "@/components/disputes/CaseStateBadge";
import { CaseThread } from "@/components/disputes/CaseThread";
import { DecisionForm } from "@/components/disputes/DecisionForm";
import { DecisionSummary } from "@/components/disputes/DecisionSummary";
import { ItemWeighingCard } from "@/components/disputes/ItemWeighingCard";
import { TakeCaseButton } from "@/components/disputes/TakeCaseButton";
import { utcText } from "@/components/disputes/words";
import { ApiError } from "@/lib/api/errors";
import { requirePageViewer } from "@/lib/auth/guards";
import { REASON_WORDS, REMEDY_WORDS, STANCE_WORDS, type Remedy } from "@/lib/disputes/rules";
import { formatCents } from "@/lib/money/cents";
import { getCase } from "@/lib/services/disputes/cases";
import { workspace } from "@/lib/services/disputes/mediation";

export const metadata = { title: "Mediator's workspace" };

export default async function WorkspacePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageViewer("disputes.mediate", `/mediation/cases/${id}`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const c = await getCase(viewer, id).catch((e) => {
    if (e instanceof ApiError && e.code === "not_found") notFound();
    throw e;
  });
  const ws = await workspace(viewer, id, c);
  const mine = c.mediatorId === viewer.id;
  const canDecide = mine && !c.decision && (Boolean(c.answeredAt) || c.deadlinePassed);
  const why = c.decision
    ? null
    : !c.mediatorId
      ? "Take the case from the queue to decide it."
      : !mine
        ? "Another mediator has this case."
        : `The consignor has until ${utcText(c.answerDueAt)} to answer; decide once they answer or the deadline passes.`;
  const itemById = new Map(c.items.map((i) => [i.id, i]));
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href="/mediation" className="underline">
          Mediation
        </Link>{" "}
        /{" "}
        <Link href={`/disputes/${c.id}`} className="underline">
          claim {c.number}
        </Link>
      </p>
      <header className="space-y-2">
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-semibold">
            Workspace: claim <span className="code">{c.number}</span>
          </h1>
          <CaseStateBadge state={c.state} />
          {!c.mediatorId && !c.decision ? <TakeCaseButton caseId={c.id} number={c.number} /> : null}
        </div>
        <p className="text-flash-700">
          <Link href={`/lots/${c.lotId}`} className="underline">
            {c.lotTitle}
          </Link>{" "}
          · {REASON_WORDS[c.reason]} · asks for: {REMEDY_WORDS[c.remedy as Remedy] ?? c.remedy}
        </p>
        <p className="text-sm text-flash-700">
          Sold for {formatCents(c.sale.hammerCents)} hammer + {formatCents(c.sale.premiumCents)} premium; commission{" "}
          {c.sale.commissionCents != null ? formatCents(c.sale.commissionCents) : "—"}; {c.sale.tubeCount} tubes ·{" "}
          {c.answeredAt ? (
            <>
              consignor {c.stance ? STANCE_WORDS[c.stance].toLowerCase() : "answered"} ({utcText(c.answeredAt)})
            </>
          ) : c.deadlinePassed ? (
            <strong className="text-fault-700">no answer by the deadline: decide on the buyer&apos;s evidence</strong>
          ) : (
            <>answer due {utcText(c.answerDueAt)}</>
          )}
        </p>
        <p
          data-testid="weighing-summary"
          className="rounded-md border border-glow-200 bg-glow-50 px-3 py-2 text-sm font-medium text-glow-700"
        >
          {ws.summary.words}
        </p>
        <p className="text-sm text-flash-600">
          Standard: more likely than not. A source code is evidence, not proof; construction features from several
          sub-assemblies weigh more than one. Rebranding alone is not misdescription.
        </p>
      </header>
      {c.decision ? <DecisionSummary c={c} /> : null}
      <section aria-labelledby="compare-h" className="space-y-3">
        <h2 id="compare-h" className="text-lg font-semibold">
          Line by line
        </h2>
        {ws.weighings.map((w) => (
          <ItemWeighingCard key={w.itemId} item={itemById.get(w.itemId)!} w={w} />
        ))}
      </section>
      <CaseEvidence
        caseId={c.id}
        lotId={c.lotId}
        photos={c.photos}
        canAdd={mine && c.state !== "closed"}
        items={c.items.map((i) => ({ id: i.id, label: `Line ${i.position}: ${i.designation}` }))}
      />
      {!c.decision ? (
        <DecisionForm
          caseId={c.id}
          canDecide={canDecide}
          why={why}
          lines={ws.lines}
          defaults={ws.defaults}
          heldLines={c.heldLines}
          wholeLotAsked={c.remedy === "return-whole-lot"}
          releasedEarly={c.releasedEarly}
          claimed={ws.weighings.map((w) => ({
            itemId: w.itemId,
            position: w.position,
            tubes: w.tubes,
            supported: w.verdict === "supports",
            soldAsSet: itemById.get(w.itemId)!.soldAsSet,
          }))}
        />
      ) : null}
      <CaseThread
        caseId={c.id}
        messages={c.messages}
        canWrite={mine}
        asksStance={false}
        closed={c.state === "closed"}
      />
    </div>
  );
}
