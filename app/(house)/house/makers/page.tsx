import { RegistryImport } from "@/components/house/RegistryImport";
import { requirePageViewer } from "@/lib/auth/guards";
import { registryEntries } from "@/lib/services/makers";
import { SOURCE_CODE_CAVEAT } from "@/lib/valves/source-code";

export const metadata = { title: "Maker registry" };

export default async function MakersPage() {
  await requirePageViewer("house.manage", "/house/makers");
  const entries = await registryEntries();
  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-semibold">Maker registry</h1>
      <p className="max-w-3xl text-flash-700">
        Source codes and the makers they are registered to. {SOURCE_CODE_CAVEAT}
      </p>
      <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">
                Code
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Maker
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Data
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Notes
              </th>
            </tr>
          </thead>
          <tbody>
            {entries.map((e) => (
              <tr key={e.code} className="border-t border-flash-200">
                <td className="code px-3 py-1.5">{e.code}</td>
                <td className="px-3 py-1.5">{e.makerName}</td>
                <td className="px-3 py-1.5">{e.isDemo ? "Demo (invented)" : "Registered"}</td>
                <td className="px-3 py-1.5 text-flash-700">{e.notes}</td>
              </tr>
            ))}
            {entries.length === 0 ? (
              <tr>
                <td colSpan={4} className="px-3 py-3 text-flash-600">
                  No codes yet. Import a CSV below.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <RegistryImport />
    </div>
  );
}
