import Link from "next/link";
import { CautionStrip } from "@/components/CautionStrip";
import { StageCell } from "@/components/lots/StageCell";
import { requirePageViewer } from "@/lib/auth/guards";
import { formatCents } from "@/lib/money/cents";
import { consignorDesk } from "@/lib/services/consignor-desk";

export const metadata = { title: "My consignments" };

const net = (c: number | null) => (c == null ? "—" : formatCents(c));

export default async function ConsignorHome() {
  const viewer = await requirePageViewer("lots.consign", "/consignor");
  const { lots, sales } = await consignorDesk(viewer);
  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end gap-4">
        <div className="space-y-1">
          <h1 className="text-2xl font-semibold tracking-tight">My consignments · {viewer.name}</h1>
          <p className="max-w-3xl text-flash-700">
            Every lot you have handed us, from draft to the money in your account. Net is the hammer price less our
            commission, after any refund on a claim.
          </p>
        </div>
        <Link href="/consignor/address" className="btn-quiet ml-auto">
          Shipping address
        </Link>
        <Link href="/consignor/lots/new" className="btn-primary">
          Start a lot
        </Link>
      </header>
      <CautionStrip anchor="high-voltage">
        Tube testers and amplifiers carry lethal voltages. Getterline never asks you to power equipment; list what you
        know.
      </CautionStrip>
      {sales.length ? (
        <section aria-labelledby="by-sale-h" className="card space-y-1 text-sm">
          <h2 id="by-sale-h" className="font-semibold">
            Net to you, per sale
          </h2>
          <ul>
            {sales.map((s) => (
              <li key={s.id} className="flex justify-between gap-3">
                <span>{s.title}</span>
                <span className="code" data-testid={`sale-net-${s.id}`}>
                  {formatCents(s.netCents)}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <ul className="space-y-2 md:hidden" aria-label="Lots">
        {lots.map((l) => (
          <li key={l.id} className="card space-y-1 p-3">
            <Link href={`/consignor/lots/${l.id}`} className="font-medium underline underline-offset-2">
              {l.title}
            </Link>
            <StageCell lot={l} />
            <p className="flex justify-between text-xs text-flash-600">
              <span>
                {l.lines} lines · {l.tubes} tubes
              </span>
              <span>
                Net <span className="code">{net(l.netCents)}</span>
              </span>
            </p>
          </li>
        ))}
      </ul>
      <div className="hidden overflow-x-auto rounded-lg border border-flash-200 bg-white md:block">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>
              {["Lot", "Where it is", "Lines", "Tubes", "Net to you"].map((h) => (
                <th key={h} scope="col" className="px-3 py-2 font-medium">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {lots.map((l) => (
              <tr key={l.id} className="border-t border-flash-200 align-top">
                <td className="px-3 py-2">
                  <Link href={`/consignor/lots/${l.id}`} className="font-medium underline underline-offset-2">
                    {l.title}
                  </Link>
                </td>
                <td className="px-3 py-2">
                  <StageCell lot={l} />
                </td>
                <td className="px-3 py-2">{l.lines}</td>
                <td className="px-3 py-2">{l.tubes}</td>
                <td className="code px-3 py-2" data-testid={`net-${l.id}`}>
                  {net(l.netCents)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {lots.length === 0 ? <p className="text-flash-600">No lots yet. Start one for your first box.</p> : null}
    </div>
  );
}
