"use client";

import { useMutation } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";

/** Ask the house to offer an unsold lot again; asking twice changes nothing. */
export function RelistButton({ lotId }: { lotId: string }) {
  const ask = useMutation({ mutationFn: () => apiFetch(`/api/lots/${lotId}/relist`, { json: {} }) });
  if (ask.isSuccess)
    return (
      <p role="status" className="text-xs text-sound-700">
        Asked: the house will offer it in a later sale.
      </p>
    );
  return (
    <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={ask.isPending} onClick={() => ask.mutate()}>
      {ask.isError ? "Could not ask; try again" : "Offer it again in a later sale"}
    </button>
  );
}
