"use client";

import { useState } from "react";
import { apiFetch } from "@/lib/client/api";

/** Ask the house to offer an unsold lot again; asking twice changes nothing. */
export function RelistButton({ lotId }: { lotId: string }) {
  const [state, setState] = useState<"idle" | "busy" | "asked" | "failed">("idle");
  if (state === "asked")
    return (
      <p role="status" className="text-xs text-sound-700">
        Asked: the house will offer it in a later sale.
      </p>
    );
  return (
    <button
      type="button"
      className="btn-quiet px-2 py-1 text-xs"
      disabled={state === "busy"}
      onClick={async () => {
        setState("busy");
        try {
          await apiFetch(`/api/lots/${lotId}/relist`, { json: {} });
          setState("asked");
        } catch {
          setState("failed");
        }
      }}
    >
      {state === "failed" ? "Could not ask; try again" : "Offer it again in a later sale"}
    </button>
  );
}
