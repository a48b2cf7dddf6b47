"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { CONDITION_WORDS } from "@/components/lots/words";
import { CLOSENESS_WORDS } from "@/lib/catalogue/want-list";
import { apiFetch } from "@/lib/client/api";
import { formatCents } from "@/lib/money/cents";
import type { WantList } from "@/lib/services/want-lists";

/** One want list with what it asks for, its hits, and pause, resume and delete. */
export function WantListRow({ list }: { list: WantList }) {
  const router = useRouter();
  const qc = useQueryClient();
  const [problem, setProblem] = useState<string | null>(null);
  const change = useMutation({
    mutationFn: (body: { method: "PATCH" | "DELETE"; json?: unknown }) => apiFetch(`/api/want-lists/${list.id}`, body),
    onSuccess: () => {
      setProblem(null);
      void qc.invalidateQueries({ queryKey: ["want-lists"] });
      router.refresh();
    },
    onError: (e: Error) => setProblem(e.message),
  });
  const c = list.criteria;
  const asks = [
    `${c.minQuantity}+ × ${c.designation} ${CLOSENESS_WORDS[c.closeness]}`,
    c.conditions.length ? c.conditions.map((x) => CONDITION_WORDS[x] ?? x).join(" or ") : null,
    c.noVacuumLoss ? "no white getters" : null,
    c.maxEstimateCents ? `estimate up to ${formatCents(c.maxEstimateCents)}` : null,
  ]
    .filter(Boolean)
    .join(" · ");
  return (
    <li className="card space-y-2" data-testid="want-list">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="font-semibold">
          {list.name}{" "}
          {list.paused ? (
            <span className="ml-1 rounded-full border border-flash-300 px-2 py-0.5 text-xs font-medium text-flash-700">
              Paused
            </span>
          ) : null}
        </h2>
        <div className="flex gap-2">
          <button
            type="button"
            className="btn-quiet"
            disabled={change.isPending}
            onClick={() => change.mutate({ method: "PATCH", json: { paused: !list.paused } })}
          >
            {list.paused ? "Resume" : "Pause"}
          </button>
          <button
            type="button"
            className="btn-quiet"
            disabled={change.isPending}
            onClick={() => {
              if (window.confirm(`Delete the want list "${list.name}"?`)) change.mutate({ method: "DELETE" });
            }}
          >
            Delete
          </button>
        </div>
      </div>
      {problem ? <FormAlert>{problem}</FormAlert> : null}
      <p className="text-sm text-flash-800">
        <span className="code">{asks}</span>
      </p>
      <p className="text-sm text-flash-600">
        {list.hits ? `${list.hits} lot${list.hits === 1 ? "" : "s"} matched so far` : "No lot has matched yet"} ·{" "}
        <Link className="underline" href={`/catalogue?q=${encodeURIComponent(c.designation)}`}>
          search the catalogue now
        </Link>
      </p>
    </li>
  );
}
