"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback, useMemo, useState } from "react";
import type { ReferenceType } from "@/lib/valves/reference-row";
import { referenceTable } from "@/lib/valves/reference-table";
import { CautionStrip } from "@/components/CautionStrip";
import { FormAlert } from "@/components/forms/Field";
import { apiFetch } from "@/lib/client/api";
import { formatCents } from "@/lib/money/cents";
import type { getLot, ItemView } from "@/lib/services/lots";
import { CsvImportPanel } from "./CsvImportPanel";
import { ItemForm, toInput } from "./ItemForm";
import { PhotoPanel } from "./PhotoPanel";
import { ItemsGrid } from "./ItemsGrid";
import { LotDetailsForm } from "./LotDetailsForm";
import { LotTrail } from "./LotTrail";
import { StateBadge } from "./StateBadge";

export type LotData = Awaited<ReturnType<typeof getLot>>;

/**
 * The consignor's workbench for one lot: details, items (grid and form),
 * bulk import, photos and the review trail. Data comes from /api/lots/:id
 * through TanStack Query; every change refetches it.
 */
export function LotEditor({
  initial,
  reference,
}: {
  initial: LotData;
  reference: { revision: string; rows: readonly ReferenceType[] };
}) {
  const table = useMemo(() => referenceTable(reference.rows, reference.revision), [reference]);
  const qc = useQueryClient();
  const id = initial.lot.id;
  const key = ["lot", id];
  const { data } = useQuery({
    queryKey: key,
    queryFn: () => apiFetch<LotData>(`/api/lots/${id}`),
    initialData: initial,
  });
  const [editing, setEditing] = useState<ItemView | "new" | null>(null);
  const [message, setMessage] = useState<{ tone: "fault" | "sound"; text: string } | null>(null);
  const refresh = useCallback(() => qc.invalidateQueries({ queryKey: ["lot", id] }), [qc, id]);
  const editable = data.lot.state === "draft" || data.lot.state === "needs-changes";

  const quick = useMutation({
    mutationFn: ({ item, patch }: { item: ItemView; patch: Partial<ItemView> }) =>
      apiFetch(`/api/lots/${id}/items/${item.id}`, { method: "PUT", json: { ...toInput(item), ...patch } }),
    onSuccess: () => {
      setMessage({ tone: "sound", text: "Saved." });
      void refresh();
    },
    onError: (e) => setMessage({ tone: "fault", text: e.message }),
  });
  const remove = useMutation({
    mutationFn: (item: ItemView) => apiFetch(`/api/lots/${id}/items/${item.id}`, { method: "DELETE" }),
    onSuccess: () => {
      setMessage({ tone: "sound", text: "Item removed." });
      void refresh();
    },
    onError: (e) => setMessage({ tone: "fault", text: e.message }),
  });
  const submit = useMutation({
    mutationFn: () => apiFetch(`/api/lots/${id}/submit`, { method: "POST" }),
    onSuccess: () => {
      setMessage({ tone: "sound", text: "Sent to the house for review. You will get an e-mail when they decide." });
      void refresh();
    },
    onError: (e) => setMessage({ tone: "fault", text: e.message }),
  });
  const onQuickChange = useCallback(
    (item: ItemView, patch: Partial<ItemView>) => quick.mutate({ item, patch }),
    [quick],
  );
  const onRemove = useCallback(
    (item: ItemView) => {
      if (window.confirm(`Remove line ${item.position} (${item.designation})?`)) remove.mutate(item);
    },
    [remove],
  );

  const lastAsk = [...data.events].reverse().find((e) => e.kind === "changes-requested");
  // Handling and shipping cautions for every hazard the items carry (from our type data or declared).
  const cautions = new Map<string, { title: string; caution: string; kind: string; types: string[] }>();
  for (const i of data.items) {
    for (const n of i.typeHazards) {
      if (n.certainty === "always") continue;
      const c = cautions.get(n.kind) ?? { title: n.title, caution: n.caution, kind: n.kind, types: [] };
      if (!c.types.includes(i.designation)) c.types.push(i.designation);
      cautions.set(n.kind, c);
    }
  }
  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold">{data.lot.title}</h1>
        <StateBadge state={data.lot.state} />
        {editable ? (
          <button
            type="button"
            className="btn-primary ml-auto"
            disabled={submit.isPending || data.items.length === 0}
            onClick={() => submit.mutate()}
          >
            {data.lot.state === "needs-changes" ? "Resubmit for review" : "Submit for review"}
          </button>
        ) : null}
      </header>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      {[...cautions.values()].map((c) => (
        <CautionStrip key={c.kind} anchor={c.kind === "mercury-vapour" ? "mercury" : c.kind}>
          <strong>{c.title}</strong> ({c.types.join(", ")}). {c.caution}
        </CautionStrip>
      ))}
      {data.lot.state === "needs-changes" && lastAsk ? (
        <FormAlert>The house asked for changes: {lastAsk.comment}</FormAlert>
      ) : null}
      {data.lot.state === "approved" ? (
        <p className="card text-sm">
          Approved and locked. Estimate {money(data.lot.estimateLowCents)}–{money(data.lot.estimateHighCents)}, reserve{" "}
          {money(data.lot.reserveCents ?? null)}. The house records any correction as a dated amendment.
        </p>
      ) : null}
      <section aria-labelledby="items-h" className="space-y-3">
        <div className="flex items-center gap-3">
          <h2 id="items-h" className="text-lg font-semibold">
            Items
          </h2>
          {editable && editing === null ? (
            <button type="button" className="btn-quiet" onClick={() => setEditing("new")}>
              Add an item
            </button>
          ) : null}
        </div>
        {editing !== null ? (
          <div className="card">
            <ItemForm
              table={table}
              lotId={id}
              item={editing === "new" ? undefined : editing}
              onDone={() => {
                setEditing(null);
                void refresh();
              }}
            />
          </div>
        ) : null}
        <ItemsGrid
          items={data.items}
          editable={editable}
          onEdit={(i) => setEditing(i)}
          onRemove={onRemove}
          onQuickChange={onQuickChange}
        />
      </section>
      {editable ? <CsvImportPanel lotId={id} onApplied={() => void refresh()} /> : null}
      <PhotoPanel
        lotId={id}
        photos={data.photos}
        editable={editable}
        onChange={() => void refresh()}
        items={data.items.map((i) => ({
          id: i.id,
          label: `Line ${i.position}: ${i.designation}${i.labelBrand ? ` (${i.labelBrand})` : ""}`,
        }))}
      />
      <section aria-labelledby="details-h" className="space-y-2">
        <h2 id="details-h" className="text-lg font-semibold">
          Lot details
        </h2>
        <LotDetailsForm
          lotId={id}
          readOnly={!editable}
          initial={{
            title: data.lot.title,
            provenance: data.lot.provenance,
            shippingOrigin: data.lot.shippingOrigin,
            testerKind: data.lot.testerKind as never,
            testerNotes: data.lot.testerNotes,
          }}
        />
      </section>
      <section aria-labelledby="trail-h" className="space-y-2">
        <h2 id="trail-h" className="text-lg font-semibold">
          Trail
        </h2>
        <LotTrail events={data.events} />
      </section>
    </div>
  );
}

function money(c: number | null | undefined) {
  return c == null ? "—" : formatCents(c);
}
