"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { apiFetch } from "@/lib/client/api";

/** Run a reconciliation now (it also runs on its own every ten minutes). */
export function ReconcileButton() {
  const router = useRouter();
  const reconcile = useMutation({
    mutationFn: () => apiFetch("/api/house/finance", { method: "POST" }),
    onSuccess: () => router.refresh(),
  });
  const busy = reconcile.isPending;
  const error = reconcile.error?.message ?? null;
  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" className="btn-quiet" disabled={busy} onClick={() => reconcile.mutate()}>
        {busy ? "Comparing…" : "Reconcile now"}
      </button>
      {error ? (
        <span role="alert" className="text-sm text-fault-700">
          {error}
        </span>
      ) : null}
    </span>
  );
}
