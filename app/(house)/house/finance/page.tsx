import Link from "next/link";
import { When } from "@/components/time/When";
import { ReconcileButton } from "@/components/house/ReconcileButton";
import { UnexpectedCharges } from "@/components/house/UnexpectedCharges";
import { INVOICE_STATE_WORDS } from "@/components/invoices/words";
import { requirePageViewer } from "@/lib/auth/guards";
import { formatCents } from "@/lib/money/cents";
import { accountWords } from "@/lib/money/account-words";
import { ACCOUNTS } from "@/lib/money/ledger";
import { listInvoices } from "@/lib/services/invoices";
import { balances, trialBalance } from "@/lib/services/ledger";
import { recentReconciliations } from "@/lib/services/reconcile";
import { listUnexpectedCharges } from "@/lib/services/unexpected-charges";
import { recentIgnoredEvents } from "@/lib/services/webhooks";

export const metadata = { title: "Finance" };

const signed = (c: number) => (c < 0 ? `(${formatCents(-c)})` : formatCents(c));

export default async function FinancePage() {
  const viewer = await requirePageViewer("house.manage", "/house/finance");
  const [b, tb, runs, invoices, unexpected, ignored] = await Promise.all([
    balances(),
    trialBalance(),
    recentReconciliations(5),
    listInvoices(viewer),
    listUnexpectedCharges(),
    recentIgnoredEvents(10),
  ]);
  const last = runs[0];
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-semibold">Finance</h1>
      <div className="grid gap-4 lg:grid-cols-2">
        <section aria-labelledby="ledger-h" className="card space-y-2">
          <h2 id="ledger-h" className="font-semibold">
            Ledger balances
          </h2>
          <p className="text-xs text-flash-600">
            Debit balances positive, credit balances in brackets. Every movement is a balanced set of entries written
            with its state change.
          </p>
          <table className="w-full text-sm">
            <tbody>
              {ACCOUNTS.map((a) => (
                <tr key={a} className="border-t border-flash-100">
                  <td className="py-1">{accountWords(a)}</td>
                  <td className="code py-1 text-right">{signed(b[a])}</td>
                </tr>
              ))}
              <tr className="border-t border-flash-300 font-semibold">
                <td className="py-1">Debits − credits</td>
                <td data-testid="trial-balance" className="code py-1 text-right">
                  {signed(tb)}
                </td>
              </tr>
            </tbody>
          </table>
        </section>
        <section id="reconciliation" aria-labelledby="rec-h" className="card space-y-2">
          <div className="flex items-center justify-between">
            <h2 id="rec-h" className="font-semibold">
              Reconciliation with the processor
            </h2>
            <ReconcileButton />
          </div>
          {last ? (
            <>
              <p className={`text-sm font-medium ${last.ok ? "text-sound-700" : "text-fault-700"}`}>
                {last.ok ? "Ledger and processor agree" : `${last.differences.length} difference(s) found`} ·{" "}
                <When iso={last.ranAt} />
              </p>
              <table className="w-full text-sm">
                <thead className="text-left text-flash-600">
                  <tr>
                    <th className="py-1 font-medium" />
                    <th className="py-1 text-right font-medium">Ledger</th>
                    <th className="py-1 text-right font-medium">Processor</th>
                  </tr>
                </thead>
                <tbody>
                  <tr>
                    <td className="py-1">Cash held</td>
                    <td className="code py-1 text-right">{formatCents(last.ledger.cashCents)}</td>
                    <td className="code py-1 text-right">{formatCents(last.processor.availableCents)}</td>
                  </tr>
                  <tr>
                    <td className="py-1">Processor fees</td>
                    <td className="code py-1 text-right">{formatCents(last.ledger.processorFeesCents)}</td>
                    <td className="code py-1 text-right">{formatCents(last.processor.feesCents)}</td>
                  </tr>
                </tbody>
              </table>
              {last.differences.length ? (
                <ul className="list-disc pl-5 text-sm text-fault-700">
                  {last.differences.map((d) => (
                    <li key={d}>{d}</li>
                  ))}
                </ul>
              ) : null}
              {last.inFlight?.length ? (
                <p className="text-sm text-flash-700">
                  In flight, not yet confirmed by the processor&apos;s message and left out of the comparison:{" "}
                  {last.inFlight.map((c) => `${c.chargeId} (${formatCents(c.amountCents)})`).join(", ")}.
                </p>
              ) : null}
            </>
          ) : (
            <p className="text-sm text-flash-600">No reconciliation has run yet.</p>
          )}
        </section>
      </div>
      <UnexpectedCharges charges={unexpected} />
      {ignored.length ? (
        <section aria-labelledby="ignored-h" className="space-y-2">
          <h2 id="ignored-h" className="text-lg font-semibold">
            Processor messages set aside
          </h2>
          <p className="text-sm text-flash-600">Signed messages that were not ours to act on, kept with the reason.</p>
          <ul className="card space-y-1 text-sm">
            {ignored.map((e) => (
              <li key={e.eventId}>
                <span className="code">{e.eventId}</span> · {e.type} · {e.reason ?? "no reason kept"} ·{" "}
                <When iso={e.receivedAt} />
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section id="invoices" aria-labelledby="inv-h" className="space-y-2">
        <h2 id="inv-h" className="text-lg font-semibold">
          Invoices
        </h2>
        <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
          <table className="min-w-full text-sm">
            <thead className="bg-flash-100 text-left text-flash-700">
              <tr>
                {["Invoice", "Lot", "Total", "State"].map((h) => (
                  <th key={h} scope="col" className="px-3 py-2 font-medium">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {invoices.map((i) => (
                <tr key={i.id} className="border-t border-flash-200">
                  <td className="px-3 py-2">
                    <Link href={`/invoices/${i.id}`} className="code underline">
                      {i.number}
                    </Link>
                  </td>
                  <td className="px-3 py-2">{i.title}</td>
                  <td className="code px-3 py-2">{formatCents(i.totalCents)}</td>
                  <td className="px-3 py-2">{INVOICE_STATE_WORDS[i.state] ?? i.state}</td>
                </tr>
              ))}
              {invoices.length === 0 ? (
                <tr>
                  <td colSpan={4} className="px-3 py-4 text-flash-600">
                    No invoices yet.
                  </td>
                </tr>
              ) : null}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}
