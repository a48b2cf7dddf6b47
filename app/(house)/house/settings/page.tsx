import { SettingsForm } from "@/components/house/settings/SettingsForm";
import { When } from "@/components/time/When";
import { requirePageViewer } from "@/lib/auth/guards";
import { currentSettings, settingsHistory } from "@/lib/services/house-settings";

export const metadata = { title: "House settings" };

export default async function HouseSettingsPage() {
  await requirePageViewer("house.manage", "/house/settings");
  const [{ version, settings }, history] = await Promise.all([currentSettings(), settingsHistory(50)]);
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-2xl font-semibold">House settings</h1>
        <p className="max-w-3xl text-flash-700">
          Premium, commission, bidding, payment, inspection, claims, shipping, tax and the house’s own address on its
          papers. Each save is a new version, kept with who made it and why. A sale keeps the version in force when it
          was scheduled, so a change never alters a sale already scheduled or live. In force now:{" "}
          <strong>version {version}</strong>.
        </p>
      </header>
      <div className="grid gap-6 xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <SettingsForm version={version} initial={settings} />
        <section aria-labelledby="history-h" className="card space-y-3 self-start">
          <h2 id="history-h" className="text-lg font-semibold">
            History
          </h2>
          <ol className="space-y-3 text-sm">
            {history.map((v) => (
              <li key={v.version} className="border-t border-flash-100 pt-2 first:border-0 first:pt-0">
                <p>
                  <strong>Version {v.version}</strong> · <When iso={v.changedAt} /> ·{" "}
                  {v.changedBy ?? "set up by the exchange"}
                </p>
                <p className="text-flash-700">{v.reason}</p>
                {v.changes.length ? (
                  <ul className="mt-1 list-disc pl-5 font-mono text-xs text-flash-700">
                    {v.changes.slice(0, 12).map((c) => (
                      <li key={c}>{c}</li>
                    ))}
                    {v.changes.length > 12 ? <li>and {v.changes.length - 12} more</li> : null}
                  </ul>
                ) : null}
              </li>
            ))}
          </ol>
        </section>
      </div>
    </div>
  );
}
