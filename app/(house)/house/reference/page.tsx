import Link from "next/link";
import { requirePageViewer } from "@/lib/auth/guards";
import { ReferenceImportPanel } from "@/components/house/ReferenceImportPanel";
import { listReferenceTypes } from "@/lib/services/valve-types";
import { baseFamilyLabel } from "@/lib/valves/designation";

export const metadata = { title: "Reference data" };

export default async function HouseReferencePage() {
  await requirePageViewer("reference.edit", "/house/reference");
  const rows = await listReferenceTypes();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Reference data</h1>
      <p className="max-w-3xl text-flash-700">
        The one table decoding, grading, summaries, attribution and mediation read:{" "}
        {rows.filter((r) => !r.retired).length} types on file
        {rows.some((r) => r.retired) ? `, ${rows.filter((r) => r.retired).length} retired` : ""}. Correct a row when a
        data sheet says otherwise; every change is kept with who made it and why, and reaches every page at once.
      </p>
      <p>
        <Link href="/house/reference/new" className="btn-primary inline-block">
          Add a type
        </Link>
      </p>
      <ReferenceImportPanel />
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>
              {["Type", "Also", "Kind", "Heater", "Base", "Gm µmho", "Source", "Checked", "Rev."].map((h) => (
                <th key={h} scope="col" className="px-3 py-2 font-medium">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.designation} className="border-t border-flash-200">
                <td className="px-3 py-1.5">
                  <Link
                    className="code underline underline-offset-2"
                    href={`/house/reference/${encodeURIComponent(r.designation)}`}
                  >
                    {r.designation}
                  </Link>
                </td>
                <td className="code px-3 py-1.5 text-flash-600">{r.aliases.join(", ")}</td>
                <td className="px-3 py-1.5">{r.kind.replace(/-/g, " ")}</td>
                <td className="code px-3 py-1.5">
                  {r.heater ? `${r.heater.volts} V ${r.heater.amps} A` : r.heater === null ? "none" : ""}
                </td>
                <td className="px-3 py-1.5">{baseFamilyLabel(r.base)}</td>
                <td className="code px-3 py-1.5">
                  {r.characteristics?.kind === "amplifier"
                    ? (r.characteristics.gmMicromho?.toLocaleString("en") ?? "")
                    : ""}
                </td>
                <td className="code px-3 py-1.5">
                  {r.source}
                  {r.retired ? <span className="ml-1 font-sans text-xs text-glow-700">retired</span> : null}
                </td>
                <td className="px-3 py-1.5 text-flash-600">
                  {r.verification ? `${r.verification.on}, ${r.verification.by}` : ""}
                </td>
                <td className="px-3 py-1.5">{r.revision}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
