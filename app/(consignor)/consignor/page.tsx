import Link from "next/link";
import { CautionStrip } from "@/components/CautionStrip";
import { StateBadge } from "@/components/lots/StateBadge";
import { requirePageViewer } from "@/lib/auth/guards";
import { listLots } from "@/lib/services/lots";

export const metadata = { title: "My consignments" };

export default async function ConsignorHome() {
  const viewer = await requirePageViewer("lots.consign", "/consignor");
  const lots = await listLots(viewer, "mine");
  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end gap-4">
        <div className="space-y-1">
          <h1 className="text-2xl font-semibold tracking-tight">My consignments · {viewer.name}</h1>
          <p className="max-w-3xl text-flash-700">Turn a box of valves into a lot a dealer can trust: what each tube is, how it tested, the codes on its glass and who really made it.</p>
        </div>
        <Link href="/consignor/lots/new" className="btn-primary ml-auto">Start a lot</Link>
      </header>
      <CautionStrip anchor="high-voltage">Tube testers and amplifiers carry lethal voltages. Getterline never asks you to power equipment; list what you know.</CautionStrip>
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>{["Lot", "State", "Lines", "Tubes", "Last change"].map((h) => <th key={h} scope="col" className="px-3 py-2 font-medium">{h}</th>)}</tr>
          </thead>
          <tbody>
            {lots.map((l) => (
              <tr key={l.id} className="border-t border-flash-200">
                <td className="px-3 py-2"><Link href={`/consignor/lots/${l.id}`} className="font-medium underline underline-offset-2">{l.title}</Link></td>
                <td className="px-3 py-2"><StateBadge state={l.state} /></td>
                <td className="px-3 py-2">{l.lines}</td>
                <td className="px-3 py-2">{l.tubes}</td>
                <td className="px-3 py-2">{l.updatedAt.slice(0, 10)}</td>
              </tr>
            ))}
            {lots.length === 0 ? <tr><td colSpan={5} className="px-3 py-4 text-flash-600">No lots yet. Start one for your first box.</td></tr> : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
