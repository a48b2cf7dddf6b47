"use client";

import { useState } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiClientError } from "@/lib/client/api";

export type FormMessage = { tone: "fault" | "sound"; text: string } | null;

/**
 * The one way our forms send to an API route: run the call, copy the
 * server's field errors into the form, and keep one message for the alert.
 * `run` returns true when the call succeeded.
 */
export function useApiSubmit<T extends FieldValues>(setError?: UseFormSetError<T>) {
  const [message, setMessage] = useState<FormMessage>(null);
  async function run(call: () => Promise<string | void>): Promise<boolean> {
    setMessage(null);
    try {
      const done = await call();
      if (done) setMessage({ tone: "sound", text: done });
      return true;
    } catch (e) {
      if (setError && e instanceof ApiClientError && e.fields) {
        for (const [k, v] of Object.entries(e.fields)) setError(k as Path<T>, { message: v });
      }
      setMessage({ tone: "fault", text: e instanceof Error ? e.message : "Something went wrong" });
      return false;
    }
  }
  return { message, setMessage, run };
}
