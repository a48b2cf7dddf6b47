import Link from "next/link";
import { When } from "@/components/time/When";
import { notFound } from "next/navigation";
import { ReferenceEditForm } from "@/components/house/ReferenceEditForm";
import { requirePageViewer } from "@/lib/auth/guards";
import { ReferenceRowActions } from "@/components/house/ReferenceRowActions";
import { houseReferenceRow, referenceHistory } from "@/lib/services/valve-types";
import { describeRowSource } from "@/lib/valves/sources";

export const metadata = { title: "Correct a reference row" };

export default async function EditReferencePage({ params }: { params: Promise<{ designation: string }> }) {
  await requirePageViewer("reference.edit", "/house/reference");
  const { designation } = await params;
  const ref = await houseReferenceRow(designation);
  if (!ref) notFound();
  const history = await referenceHistory(designation);
  const amp = ref.characteristics?.kind === "amplifier" ? ref.characteristics : undefined;
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href="/house/reference" className="underline">
          Reference data
        </Link>{" "}
        / <span className="code">{designation}</span>
      </p>
      <h1 className="text-2xl font-semibold">
        Correct <span className="code">{designation}</span>{" "}
        <span className="text-base font-normal text-flash-600">revision {ref.revision}</span>
      </h1>
      <ReferenceEditForm
        designation={designation}
        revision={ref.revision}
        initial={{
          reason: "",
          source: ref.source,
          heaterVolts: ref.heater?.volts ?? null,
          heaterAmps: ref.heater?.amps ?? null,
          introducedYear: ref.introduced?.year ?? null,
          plateVolts: amp?.plateVolts ?? null,
          gridVolts: amp?.gridVolts ?? null,
          screenVolts: amp?.screenVolts ?? null,
          mu: amp?.mu ?? null,
          gmMicromho: amp?.gmMicromho ?? null,
          plateCurrentMa: amp?.plateCurrentMa ?? null,
          rpOhms: amp?.rpOhms ?? null,
          note: ref.note ?? "",
        }}
      />
      <p className="text-sm text-flash-700">
        Source: <span className="code">{ref.source}</span> ({describeRowSource(ref.source)}).{" "}
        {ref.verification
          ? `Checked against ${ref.verification.against} by ${ref.verification.by} on ${ref.verification.on}.`
          : "Not yet checked against a data sheet."}
        {ref.retired ? " Retired: not on file." : ""}
      </p>
      <ReferenceRowActions designation={designation} retired={ref.retired} />
      <section aria-labelledby="hist" className="space-y-2">
        <h2 id="hist" className="text-lg font-semibold">
          History
        </h2>
        {history.length ? (
          <ol className="space-y-2">
            {history.map((h) => (
              <li key={h.revision} className="card text-sm">
                <p>
                  <strong>Revision {h.revision}</strong> · {h.changedBy} · <When iso={h.at} />
                </p>
                <p className="text-flash-700">{h.reason}</p>
              </li>
            ))}
          </ol>
        ) : (
          <p className="text-sm text-flash-700">Unchanged since it was loaded from published figures.</p>
        )}
      </section>
    </div>
  );
}
