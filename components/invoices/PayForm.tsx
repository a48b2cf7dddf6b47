"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormAlert } from "@/components/forms/Field";
import { ApiClientError, apiFetch } from "@/lib/client/api";
import type { z } from "zod";
import { CardPaymentSchema, type CardPayment } from "@/lib/validation/payments";

type CardForm = z.input<typeof CardPaymentSchema>;

type Outcome = { status: "succeeded" } | { status: "requires_action"; redirectUrl: string } | { status: "processing" };

/**
 * Card payment for one invoice. The card goes to the payment processor
 * through our server in memory only; the page then waits for the
 * processor's confirmation to arrive. `onPaid` carries the words for the
 * invoice to keep once this form has gone (paid here, or elsewhere).
 */
export function PayForm({
  invoiceId,
  totalText,
  onPaid,
}: {
  invoiceId: string;
  totalText: string;
  onPaid: (m: { tone: "sound"; text: string }) => void;
}) {
  const qc = useQueryClient();
  const [firstAttempt] = useState(() => crypto.randomUUID());
  const [message, setMessage] = useState<{ tone: "fault" | "sound"; text: string } | null>(null);
  const { register, handleSubmit, formState, reset } = useForm<CardForm, unknown, CardPayment>({
    resolver: zodResolver(CardPaymentSchema),
    defaultValues: { attemptKey: firstAttempt },
  });

  // One attempt per submit, never retried on its own: a refused card gets a new attempt key from the user.
  const pay = useMutation({
    mutationFn: (values: CardPayment) => apiFetch<Outcome>(`/api/invoices/${invoiceId}/pay`, { json: values }),
  });

  async function onSubmit(values: CardPayment) {
    setMessage(null);
    try {
      const r = await pay.mutateAsync(values);
      if (r.status === "requires_action") {
        setMessage({ tone: "sound", text: "Your card asks you to confirm the payment; taking you there…" });
        window.location.assign(r.redirectUrl);
        return;
      }
      onPaid({ tone: "sound", text: "Payment received. Waiting for the processor's confirmation…" });
      void qc.invalidateQueries({ queryKey: ["invoice", invoiceId] });
    } catch (e) {
      const reason = e instanceof ApiClientError ? e.details?.reason : undefined;
      if (reason === "already-paid" || reason === "in-progress") {
        // Paid, or being paid, from another tab or device: nothing was charged here. Show the invoice as it stands;
        // the words stay on the invoice once this form has gone.
        onPaid({ tone: "sound", text: (e as Error).message });
        void qc.invalidateQueries({ queryKey: ["invoice", invoiceId] });
        return;
      }
      // A refused attempt: the next one is new.
      reset({ ...values, number: "", cvc: "", attemptKey: crypto.randomUUID() });
      setMessage({ tone: "fault", text: (e as Error).message });
    }
  }

  const e = formState.errors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="card space-y-3" noValidate aria-label="Pay by card">
      <h2 className="text-lg font-semibold">Pay {totalText} by card</h2>
      <p className="text-sm text-flash-700">
        The house holds your payment in escrow until you have received and inspected the tubes.
      </p>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <input type="hidden" {...register("attemptKey")} />
      <div className="grid gap-3 sm:grid-cols-4">
        <div className="sm:col-span-2">
          <Field id="card-number" label="Card number" error={e.number?.message}>
            <input
              id="card-number"
              inputMode="numeric"
              autoComplete="cc-number"
              className="input code"
              {...register("number")}
            />
          </Field>
        </div>
        <Field id="card-month" label="Expiry month" error={e.expMonth?.message}>
          <input
            id="card-month"
            inputMode="numeric"
            autoComplete="cc-exp-month"
            className="input"
            {...register("expMonth")}
          />
        </Field>
        <Field id="card-year" label="Expiry year" error={e.expYear?.message}>
          <input
            id="card-year"
            inputMode="numeric"
            autoComplete="cc-exp-year"
            className="input"
            {...register("expYear")}
          />
        </Field>
        <Field id="card-cvc" label="Security code" error={e.cvc?.message}>
          <input id="card-cvc" inputMode="numeric" autoComplete="cc-csc" className="input" {...register("cvc")} />
        </Field>
      </div>
      <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
        Pay now
      </button>
    </form>
  );
}
