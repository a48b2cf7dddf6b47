"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiClientError } from "@/lib/client/api";

export type FormMessage = { tone: "fault" | "sound"; text: string } | null;

type Call = () => Promise<string | void>;

/**
 * The one way our forms send to an API route: the call runs as a TanStack Query mutation (never retried on
 * its own: a write is repeated only by the user), the server's field errors are copied into the form, and one
 * message is kept for the alert. `run` returns true when the call succeeded; `pending` is true meanwhile.
 */
export function useApiSubmit<T extends FieldValues>(setError?: UseFormSetError<T>) {
  const [message, setMessage] = useState<FormMessage>(null);
  const mutation = useMutation<string | void, Error, Call>({
    mutationFn: (call) => call(),
    onMutate: () => setMessage(null),
    onSuccess: (done) => {
      if (done) setMessage({ tone: "sound", text: done });
    },
    onError: (e) => {
      if (setError && e instanceof ApiClientError && e.fields) {
        for (const [k, v] of Object.entries(e.fields)) setError(k as Path<T>, { message: v });
      }
      setMessage({ tone: "fault", text: e instanceof Error ? e.message : "Something went wrong" });
    },
  });
  async function run(call: Call): Promise<boolean> {
    try {
      await mutation.mutateAsync(call);
      return true;
    } catch {
      return false;
    }
  }
  return { message, setMessage, run, pending: mutation.isPending };
}
