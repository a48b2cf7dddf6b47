import Link from "next/link";
import { When } from "@/components/time/When";
import { formatCents } from "@/lib/money/cents";
import { UNEXPECTED_WHY_WORDS } from "@/lib/money/unexpected";
import type { UnexpectedCharge } from "@/lib/services/unexpected-charges";

function Refund({ c }: { c: UnexpectedCharge }) {
  return c.state === "refunded" ? (
    <span className="code break-all">{c.refundId}</span>
  ) : (
    <span className="text-fault-700">due{c.lastError ? `: ${c.lastError}` : ""}</span>
  );
}

/** Charges an invoice did not owe, each refunded automatically: a table on wide screens, cards on a phone. */
export function UnexpectedCharges({ charges }: { charges: UnexpectedCharge[] }) {
  return (
    <section aria-labelledby="unexpected-h" className="space-y-2">
      <h2 id="unexpected-h" className="text-lg font-semibold">
        Charges refunded automatically
      </h2>
      <p className="text-sm text-flash-600">
        A charge an invoice did not owe (a second payment, or one of the wrong amount) is refunded in full as soon as
        the processor reports it; the buyer and the house are told. The processor keeps its fee.
      </p>
      {charges.length === 0 ? (
        <p className="text-sm text-flash-600">None so far.</p>
      ) : (
        <>
          <div className="hidden overflow-x-auto rounded-lg border border-flash-200 bg-white md:block">
            <table className="min-w-full text-sm" data-testid="unexpected-charges">
              <thead className="bg-flash-100 text-left text-flash-700">
                <tr>
                  {["Invoice", "Payment", "Amount", "Fee kept", "Why", "Refund", "Seen"].map((h) => (
                    <th key={h} scope="col" className="px-3 py-2 font-medium">
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {charges.map((c) => (
                  <tr key={c.id} className="border-t border-flash-200">
                    <td className="px-3 py-2">
                      <Link href={`/invoices/${c.invoiceId}`} className="code underline">
                        {c.invoiceNumber}
                      </Link>
                    </td>
                    <td className="code px-3 py-2">{c.paymentIntentId}</td>
                    <td className="code px-3 py-2">{formatCents(c.amountCents)}</td>
                    <td className="code px-3 py-2">{formatCents(c.feeCents)}</td>
                    <td className="px-3 py-2">{UNEXPECTED_WHY_WORDS[c.why]}</td>
                    <td className="px-3 py-2">
                      <Refund c={c} />
                    </td>
                    <td className="px-3 py-2">
                      <When iso={c.detectedAt} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <ul className="space-y-2 md:hidden">
            {charges.map((c) => (
              <li key={c.id} className="card space-y-1 text-sm">
                <p className="flex justify-between gap-2">
                  <Link href={`/invoices/${c.invoiceId}`} className="code underline">
                    {c.invoiceNumber}
                  </Link>
                  <span className="code font-semibold">{formatCents(c.amountCents)}</span>
                </p>
                <p>{UNEXPECTED_WHY_WORDS[c.why]}</p>
                <p className="text-flash-600">
                  Payment <span className="code break-all">{c.paymentIntentId}</span> · fee kept{" "}
                  {formatCents(c.feeCents)}
                </p>
                <p className="text-flash-600">
                  Refund <Refund c={c} /> · seen <When iso={c.detectedAt} />
                </p>
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}
