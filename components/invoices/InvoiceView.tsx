"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import { When } from "@/components/time/When";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { formatCents } from "@/lib/money/cents";
import type { presentInvoice } from "@/lib/services/invoices";
import { InvoiceAddresses } from "./InvoiceAddresses";
import { PayForm } from "./PayForm";
import { INVOICE_STATE_WORDS } from "./words";

type Invoice = ReturnType<typeof presentInvoice>;

/** An invoice as its buyer, its consignor or the house sees it, refreshing while a payment is being confirmed. */
export function InvoiceView({ initial, house }: { initial: Invoice; house: boolean }) {
  const router = useRouter();
  const qc = useQueryClient();
  const { data: inv } = useQuery({
    queryKey: ["invoice", initial.id],
    queryFn: () => apiFetch<Invoice>(`/api/invoices/${initial.id}`),
    initialData: initial,
    refetchInterval: (q) => (q.state.data?.state === "awaiting-payment" ? 1500 : false),
  });
  // Deadlines are judged against the moment the view was first drawn; the server decides again on every action.
  const [drawnAt] = useState(() => Date.now());
  const { message, setMessage, run } = useApiSubmit();
  const [carrier, setCarrier] = useState("");
  const [tracking, setTracking] = useState("");

  function act(path: string, json?: unknown) {
    return run(async () => {
      await apiFetch(path, { method: "POST", json: json ?? {} });
      await qc.invalidateQueries({ queryKey: ["invoice", initial.id] });
      router.refresh();
      return "Done.";
    });
  }

  const rows: [string, number][] = [
    ["Hammer price", inv.hammerCents],
    [`Buyer's premium (${inv.premiumBp / 100} %)`, inv.premiumCents],
    [inv.shippingZone ? `Shipping (zone ${inv.shippingZone})` : "Shipping", inv.shippingCents],
    ...(inv.taxCents ? [[`Sales tax (${inv.taxBp / 100} %)`, inv.taxCents] as [string, number]] : []),
  ];
  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold">
          Invoice <span className="code">{inv.number}</span>
        </h1>
        <span
          data-testid="invoice-state"
          className="rounded-full border border-flash-300 bg-flash-100 px-2.5 py-0.5 text-xs font-medium"
        >
          {INVOICE_STATE_WORDS[inv.state] ?? inv.state}
        </span>
      </header>
      <p className="text-flash-700">
        {inv.title} · {inv.tubeCount} tubes · due {inv.dueAt.slice(0, 10)}
      </p>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <table className="card w-full max-w-lg text-sm">
        <tbody>
          {rows.map(([k, v]) => (
            <tr
              key={k}
              data-testid={`invoice-line-${k
                .split(" ")[0]!
                .toLowerCase()
                .replace(/[^a-z]/g, "")}`}
            >
              <td className="py-1">{k}</td>
              <td className="code py-1 text-right">{formatCents(v)}</td>
            </tr>
          ))}
          <tr className="border-t border-flash-300 font-semibold">
            <td className="py-1">Total</td>
            <td data-testid="invoice-total" className="code py-1 text-right">
              {formatCents(inv.totalCents)}
            </td>
          </tr>
          {inv.refundedCents ? (
            <tr className="text-sound-700">
              <td className="py-1">Refunded to the buyer after a claim</td>
              <td data-testid="invoice-refunded" className="code py-1 text-right">
                −{formatCents(inv.refundedCents)}
              </td>
            </tr>
          ) : null}
          {inv.commissionCents != null ? (
            <tr className="text-flash-600">
              <td className="py-1">Seller&apos;s commission (from the consignor&apos;s side)</td>
              <td className="code py-1 text-right">{formatCents(inv.commissionCents)}</td>
            </tr>
          ) : null}
        </tbody>
      </table>
      <InvoiceAddresses house={inv.addresses.house} buyer={inv.addresses.buyer} origin={inv.addresses.origin} />
      {inv.unexpectedCharges.map((u, i) => (
        <p key={i} data-testid="unexpected-refund" className="card text-sm">
          A further payment of <span className="code">{formatCents(u.amountCents)}</span> was not owed on this invoice.{" "}
          {u.state === "refunded"
            ? `It was refunded to the card in full on ${u.refundedAt?.slice(0, 10)}.`
            : "Its refund to the card is under way."}
        </p>
      ))}
      {inv.lastPaymentError && inv.state === "awaiting-payment" ? (
        <FormAlert>Last attempt: {inv.lastPaymentError}</FormAlert>
      ) : null}
      {inv.isBuyer && inv.state === "awaiting-payment" ? (
        <PayForm invoiceId={inv.id} totalText={formatCents(inv.totalCents)} onPaid={setMessage} />
      ) : null}
      <ol className="card space-y-1 text-sm">
        <li>Paid: {inv.paidAt ? <When iso={inv.paidAt} /> : "not yet"}</li>
        <li>
          Shipped:{" "}
          {inv.shippedAt ? `${inv.shippedAt.slice(0, 10)} with ${inv.carrier}, tracking ${inv.tracking}` : "not yet"}
        </li>
        <li>
          Delivered: {inv.deliveredAt ? <When iso={inv.deliveredAt} style="date" /> : "not yet"}
          {inv.inspectionEndsAt ? (
            <>
              {" "}
              · inspection window ends <When iso={inv.inspectionEndsAt} />
            </>
          ) : null}
        </li>
        <li>Released to the consignor: {inv.releasedAt ? inv.releasedAt.slice(0, 10) : "not yet"}</li>
      </ol>
      {inv.isBuyer &&
      inv.state === "delivered" &&
      inv.inspectionEndsAt &&
      Date.parse(inv.inspectionEndsAt) > drawnAt ? (
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className="btn-primary" onClick={() => void act(`/api/invoices/${inv.id}/accept`)}>
            I have inspected the tubes: release payment now
          </button>
          <Link href={`/invoices/${inv.id}/claim`} className="btn-quiet">
            Something is not as listed: open a claim
          </Link>
        </div>
      ) : null}
      {inv.disputeId ? (
        <p className="card text-sm">
          A claim is {inv.state === "disputed" ? "open" : "recorded"} on this lot:{" "}
          <Link href={`/disputes/${inv.disputeId}`} className="font-medium underline">
            read the claim
          </Link>
          {inv.state === "disputed" ? ". Payment stays held until it is decided." : "."}
        </p>
      ) : null}
      {house && inv.state === "paid-held" ? (
        <form
          className="card flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            void act(`/api/house/invoices/${inv.id}/ship`, { carrier, tracking });
          }}
          aria-label="Record the shipment"
        >
          <label className="text-sm">
            <span className="label">Carrier</span>
            <input className="input mt-1" value={carrier} onChange={(e) => setCarrier(e.target.value)} />
          </label>
          <label className="text-sm">
            <span className="label">Tracking number</span>
            <input className="input mt-1" value={tracking} onChange={(e) => setTracking(e.target.value)} />
          </label>
          <button type="submit" className="btn-primary">
            Mark shipped
          </button>
        </form>
      ) : null}
      {house && inv.state === "awaiting-payment" && Date.parse(inv.dueAt) < drawnAt ? (
        <div className="card flex flex-wrap items-center gap-2 text-sm">
          <span>Unpaid past its due date.</span>
          <button
            type="button"
            className="btn-quiet"
            onClick={() => void act(`/api/house/invoices/${inv.id}/cancel`, { offerToUnderbidder: false })}
          >
            Cancel the invoice
          </button>
          <button
            type="button"
            className="btn-primary"
            onClick={() => void act(`/api/house/invoices/${inv.id}/cancel`, { offerToUnderbidder: true })}
          >
            Cancel and offer to the under-bidder
          </button>
        </div>
      ) : null}
      {house && inv.state === "shipped" ? (
        <button type="button" className="btn-primary" onClick={() => void act(`/api/house/invoices/${inv.id}/deliver`)}>
          Mark delivered
        </button>
      ) : null}
      {(inv.isConsignor || house) && inv.saleId ? (
        <p className="text-sm">
          Settlement statement for this sale:{" "}
          <a className="underline" href={`/api/statements/${inv.saleId}?format=pdf`}>
            PDF
          </a>{" "}
          ·{" "}
          <a className="underline" href={`/api/statements/${inv.saleId}?format=csv`}>
            CSV
          </a>
        </p>
      ) : null}
    </div>
  );
}
