"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { apiFetch } from "@/lib/client/api";

/** Run a reconciliation now (it also runs on its own every ten minutes). */
export function ReconcileButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex items-center gap-2">
      <button
        type="button"
        className="btn-quiet"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setError(null);
          try {
            await apiFetch("/api/house/finance", { method: "POST" });
            router.refresh();
          } catch (e) {
            setError((e as Error).message);
          } finally {
            setBusy(false);
          }
        }}
      >
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
