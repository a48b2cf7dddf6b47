"use client";

import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { formatCents } from "@/lib/money/cents";
import { MAX_RETURN_POSTAGE_CENTS } from "@/lib/money/return-refund";
import { ReturnShipmentSchema, type ReturnShipmentInput } from "@/lib/validation/disputes";
import { utcText } from "./words";

/** A refund-on-return case: the buyer records the return shipment; the consignor confirms it arrived. */
export function ReturnPanel({
  caseId,
  role,
  dueAt,
  shippedAt,
  carrier,
  tracking,
  postageCents,
}: {
  caseId: string;
  role: string;
  dueAt: string | null;
  shippedAt: string | null;
  carrier: string | null;
  tracking: string | null;
  postageCents: number;
}) {
  const router = useRouter();
  const { register, handleSubmit, setError, formState } = useForm<ReturnShipmentInput>({
    resolver: zodResolver(ReturnShipmentSchema),
    defaultValues: { carrier: "", tracking: "", postageCents: 0, postageReceipt: "" },
  });
  const { message, run } = useApiSubmit<ReturnShipmentInput>(setError);
  const done = async (call: () => Promise<unknown>, text: string) => {
    if (
      await run(async () => {
        await call();
        return text;
      })
    )
      router.refresh();
  };

  return (
    <section aria-labelledby="return-h" className="card space-y-3">
      <h2 id="return-h" className="font-semibold">
        Return of the lot
      </h2>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      {shippedAt ? (
        <p className="text-sm">
          Shipped back {utcText(shippedAt)} with {carrier}, tracking <span className="code">{tracking}</span>
          {postageCents > 0 ? <>; return postage {formatCents(postageCents)}, repaid with the refund</> : null}.
        </p>
      ) : (
        <p className="text-sm">
          The buyer ships the whole lot back by {dueAt ? utcText(dueAt) : "the return deadline"}; if it is not shipped
          by then, the payment goes to the consignor. The refund covers the hammer price, premium, shipping and tax; the
          return postage is repaid too, up to {formatCents(MAX_RETURN_POSTAGE_CENTS)}.
        </p>
      )}
      <p className="text-sm text-flash-700">
        Pack each tube on its own, in its box if it has one, with cushioning all round: glass breaks in transit and
        broken glass cuts. Tubes that may hold mercury or radioactive material ship under the carrier&apos;s and local
        rules.
      </p>
      {role === "buyer" && !shippedAt ? (
        <form
          onSubmit={handleSubmit((v) =>
            done(
              () => apiFetch(`/api/disputes/${caseId}/return`, { json: v }),
              "Return recorded; the consignor is told.",
            ),
          )}
          className="flex flex-wrap items-end gap-3"
          noValidate
          aria-label="Record the return shipment"
        >
          <Field id="r-carrier" label="Carrier" error={formState.errors.carrier?.message}>
            <input id="r-carrier" className="input" {...register("carrier")} />
          </Field>
          <Field id="r-tracking" label="Tracking number" error={formState.errors.tracking?.message}>
            <input id="r-tracking" className="input code" {...register("tracking")} />
          </Field>
          <Field id="r-postage" label="Postage you paid ($)" error={formState.errors.postageCents?.message}>
            <input
              id="r-postage"
              className="input code w-28"
              inputMode="decimal"
              placeholder="0.00"
              {...register("postageCents", {
                setValueAs: (v: string) => (v === "" || v == null ? 0 : Math.round(Number(v) * 100)),
              })}
            />
          </Field>
          <Field id="r-receipt" label="Postage receipt no. (optional)" error={formState.errors.postageReceipt?.message}>
            <input id="r-receipt" className="input code" {...register("postageReceipt")} />
          </Field>
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            Record the return
          </button>
        </form>
      ) : null}
      {role === "consignor" && shippedAt ? (
        <button
          type="button"
          className="btn-primary"
          onClick={() =>
            void done(
              () => apiFetch(`/api/disputes/${caseId}/return-received`, { json: {} }),
              "Receipt confirmed; the buyer is refunded.",
            )
          }
        >
          The lot has arrived back: refund the buyer
        </button>
      ) : null}
    </section>
  );
}
