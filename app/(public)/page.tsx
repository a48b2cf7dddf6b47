import Link from "next/link";
import { currentViewer } from "@/lib/auth/guards";
import { homeFor } from "@/lib/auth/roles";

export default async function HomePage() {
  const viewer = await currentViewer().catch(() => null);
  return (
    <div className="space-y-10">
      <section className="max-w-3xl space-y-4">
        <h1 className="text-3xl font-semibold tracking-tight">Wholesale lots of vintage valves, bought on the evidence</h1>
        <p className="text-lg text-flash-700">
          Estates, retired technicians and shops clearing stock consign boxes of tubes with their test readings, vacuum-loss
          flags, codes read off the glass and photos. Dealers read each lot&apos;s evidence at a glance and bid live. The house
          holds the money until the tubes have been inspected, and mediators settle a tube credited to the wrong maker.
        </p>
        <div className="flex flex-wrap gap-3">
          {viewer ? (
            <Link href={homeFor(viewer.roles)} className="btn-primary">Go to your desk</Link>
          ) : (
            <>
              <Link href="/sign-up" className="btn-primary">Open an account</Link>
              <Link href="/sign-in" className="btn-quiet">Sign in</Link>
            </>
          )}
          <Link href="/reference" className="btn-quiet">Look up a designation or code</Link>
        </div>
      </section>
      <section aria-labelledby="what" className="grid gap-4 md:grid-cols-3">
        <h2 id="what" className="sr-only">What Getterline works out for you</h2>
        {[
          ["Types and equivalents", "Decodes US and European designations, lists exact equivalents apart from substitutes with caveats, and reads date and source codes with their ambiguities shown."],
          ["Readings and matched sets", "Grades each tube against its type's published figures and finds the most matched pairs and quads a box can give."],
          ["Who really made it", "Keeps the printed label apart from the attributed maker and ranks makers by construction and codes, with the features that agree and conflict."],
        ].map(([t, d]) => (
          <div key={t} className="card">
            <h3 className="font-semibold">{t}</h3>
            <p className="mt-2 text-sm text-flash-700">{d}</p>
          </div>
        ))}
      </section>
    </div>
  );
}
