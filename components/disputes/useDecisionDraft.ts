"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch, type Path, type UseFormSetError } from "react-hook-form";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import type { Outcome } from "@/lib/disputes/rules";
import { formatCents, parseMoneyToCents } from "@/lib/money/cents";
import type { SettlementFigures } from "@/lib/money/refunds";
import { DecisionSchema, RefundPreviewSchema } from "@/lib/validation/disputes";

export type DecisionLine = {
  id: string;
  position: number;
  designation: string;
  quantity: number;
  soldAsSet: boolean;
  labelBrand: string;
  makerName: string | null;
};
export type ClaimedLine = { itemId: string; position: number; tubes: number; supported: boolean; soldAsSet: boolean };
export type LineValue = { itemId: string; valueCents: number; singleValueCents?: number };
type LineValues = { value: string; single: string };
type RulingValues = { upheld: boolean; tubes: number; worth: string };
export type DecisionValues = { outcome: Outcome; reasons: string; lines: LineValues[]; rulings: RulingValues[] };
/** The refund the server works out (its settlement, lib/money/refunds.ts), as far as the form shows it. */
export type RefundWorkedOut = SettlementFigures;
type Ruling = { itemId: string; upheld: boolean; tubes: number; worthCents?: number };
type Amounts = { ok: true; lines: LineValue[]; rulings: Ruling[] } | { ok: false };

/** A matched set of two or more tubes also carries one tube's value alone. */
export const isMatchedSet = (l: DecisionLine) => l.soldAsSet && l.quantity >= 2;

const dollars = (c: number | undefined) => (c === undefined ? "" : (c / 100).toFixed(2));

/** Form text to the schema's shape; money problems become field errors. */
function amountsFrom(
  v: DecisionValues,
  lines: DecisionLine[],
  claimed: ClaimedLine[],
  setError: UseFormSetError<DecisionValues>,
): Amounts {
  let bad = false;
  const cents = (text: string, path: Path<DecisionValues>, optional: boolean) => {
    if (optional && text.trim() === "") return undefined;
    try {
      return parseMoneyToCents(text);
    } catch {
      bad = true;
      setError(path, { message: "Enter an amount like 12.50" });
      return 0;
    }
  };
  const outLines = lines.map((l, i) => ({
    itemId: l.id,
    valueCents: cents(v.lines[i]!.value, `lines.${i}.value`, false)!,
    ...(isMatchedSet(l) ? { singleValueCents: cents(v.lines[i]!.single, `lines.${i}.single`, true) } : {}),
  }));
  const outRulings = claimed.map((c, i) => ({
    itemId: c.itemId,
    upheld: v.rulings[i]!.upheld,
    tubes: Number(v.rulings[i]!.tubes),
    worthCents: cents(v.rulings[i]!.worth, `rulings.${i}.worth`, true),
  }));
  return bad ? { ok: false } : { ok: true, lines: outLines, rulings: outRulings };
}

/** What is recorded: a partial refund carries the line values and rulings, the other outcomes only the reasons. */
function decisionBody(v: DecisionValues, amounts: (v: DecisionValues) => Amounts) {
  if (v.outcome !== "partial-refund") return { outcome: v.outcome, reasons: v.reasons };
  const p = amounts(v);
  return p.ok ? { outcome: v.outcome, reasons: v.reasons, lines: p.lines, rulings: p.rulings } : null;
}

/** The draft as it opens: a partial refund, the given line values in dollars, each claimed line's own ruling. */
function startingValues(lines: DecisionLine[], claimed: ClaimedLine[], values: LineValue[]): DecisionValues {
  const byItem = new Map(values.map((d) => [d.itemId, d]));
  return {
    outcome: "partial-refund",
    reasons: "",
    lines: lines.map((l) => ({
      value: dollars(byItem.get(l.id)?.valueCents),
      single: dollars(byItem.get(l.id)?.singleValueCents),
    })),
    rulings: claimed.map((c) => ({ upheld: c.supported, tubes: c.tubes, worth: "" })),
  };
}

type DraftInput = {
  caseId: string;
  lines: DecisionLine[];
  claimed: ClaimedLine[];
  defaults: LineValue[];
  heldLines: LineValue[] | null;
};

/**
 * The mediator's decision as it is being drafted: the form (line values start from the held values of an early
 * release, else the even split), the refund worked out on request, the early release of the undisputed share and
 * the final recording.
 */
export function useDecisionDraft({ caseId, lines, claimed, defaults, heldLines }: DraftInput) {
  const router = useRouter();
  const form = useForm<DecisionValues>({ defaultValues: startingValues(lines, claimed, heldLines ?? defaults) });
  const { setError, getValues } = form;
  const { message, run } = useApiSubmit<DecisionValues>(setError);
  const [preview, setPreview] = useState<RefundWorkedOut | null>(null);
  const outcome = useWatch({ control: form.control, name: "outcome" });
  const amounts = (v: DecisionValues) => amountsFrom(v, lines, claimed, setError);

  async function workOut() {
    const p = amounts(getValues());
    if (!p.ok) return;
    const checked = RefundPreviewSchema.safeParse({ lines: p.lines, rulings: p.rulings });
    if (!checked.success) {
      setPreview(null);
      await run(async () => {
        throw new Error(checked.error.issues[0]?.message ?? "Check the values");
      });
      return;
    }
    await run(async () => {
      setPreview(
        (
          await apiFetch<{ settlement: RefundWorkedOut }>(`/api/disputes/${caseId}/refund-preview`, {
            json: checked.data,
          })
        ).settlement,
      );
    });
  }

  async function releaseShare() {
    const p = amounts(getValues());
    if (!p.ok) return;
    if (
      await run(async () => {
        const { release } = await apiFetch<{ release: { payoutCents: number } }>(
          `/api/disputes/${caseId}/release-undisputed`,
          { json: { lines: p.lines } },
        );
        return `Released ${formatCents(release.payoutCents)} to the consignor; the claimed lines' share stays held.`;
      })
    )
      router.refresh();
  }

  async function record(v: DecisionValues) {
    const body = decisionBody(v, amounts);
    if (!body) return;
    const checked = DecisionSchema.safeParse(body);
    if (!checked.success) {
      for (const issue of checked.error.issues)
        setError((issue.path[0] === "reasons" ? "reasons" : "root") as Path<DecisionValues>, {
          message: issue.message,
        });
      return;
    }
    if (
      await run(async () => {
        await apiFetch(`/api/disputes/${caseId}/decision`, { json: checked.data });
        return "Decision recorded; the money has moved and both parties have the written decision.";
      })
    )
      router.refresh();
  }

  return { form, message, preview, outcome, workOut, releaseShare, record };
}
