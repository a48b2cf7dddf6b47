import Link from "next/link";
import { LotCard } from "@/components/catalogue/LotCard";
import type { CatalogueLot } from "@/lib/services/catalogue/search";
import { currentViewer } from "@/lib/auth/guards";
import { homeFor } from "@/lib/auth/roles";
import { searchCatalogue } from "@/lib/services/catalogue/search";
import { CatalogueQuerySchema } from "@/lib/validation/catalogue";

export default async function HomePage() {
  const viewer = await currentViewer().catch(() => null);
  const [soon, recent] = await Promise.all([
    searchCatalogue(CatalogueQuerySchema.parse({ status: ["live", "upcoming"], sort: "closing", limit: 4 })),
    searchCatalogue(CatalogueQuerySchema.parse({ status: ["approved"], sort: "newest", limit: 4 })),
  ]);
  return (
    <div className="space-y-10">
      <section className="max-w-3xl space-y-4">
        <h1 className="text-3xl font-semibold tracking-tight">
          Wholesale lots of vintage valves, bought on the evidence
        </h1>
        <p className="text-lg text-flash-700">
          Estates, retired technicians and shops clearing stock consign boxes of tubes with their test readings,
          vacuum-loss flags, codes read off the glass and photos. Dealers read each lot&apos;s evidence at a glance and
          bid live. The house holds the money until the tubes have been inspected, and mediators settle a tube credited
          to the wrong maker.
        </p>
        <form action="/catalogue" method="get" role="search" className="flex max-w-xl gap-2">
          <label htmlFor="home-q" className="sr-only">
            Search the catalogue by type, equivalent or words
          </label>
          <input
            id="home-q"
            name="q"
            maxLength={120}
            placeholder="Search lots: 6922, ecc 83, EL84…"
            className="input code min-w-0 flex-1"
          />
          <button type="submit" className="btn-primary">
            Search
          </button>
        </form>
        <div className="flex flex-wrap gap-3">
          {viewer ? (
            <Link href={homeFor(viewer.roles)} className="btn-primary">
              Go to your desk
            </Link>
          ) : (
            <>
              <Link href="/sign-up" className="btn-primary">
                Open an account
              </Link>
              <Link href="/sign-in" className="btn-quiet">
                Sign in
              </Link>
            </>
          )}
          <Link href="/catalogue" className="btn-quiet">
            Browse the catalogue
          </Link>
          <Link href="/reference" className="btn-quiet">
            Look up a designation or code
          </Link>
        </div>
      </section>
      <LotShelf title="Closing soonest" lots={soon.lots} href="/catalogue?status=live&status=upcoming&sort=closing" />
      <LotShelf title="Newly listed" lots={recent.lots} href="/catalogue?status=approved&sort=newest" />
      <section aria-labelledby="what" className="grid gap-4 md:grid-cols-3">
        <h2 id="what" className="sr-only">
          What Getterline works out for you
        </h2>
        {[
          [
            "Types and equivalents",
            "Decodes US and European designations, lists exact equivalents apart from substitutes with caveats, and reads date and source codes with their ambiguities shown.",
          ],
          [
            "Readings and matched sets",
            "Grades each tube against its type's published figures and finds the most matched pairs and quads a box can give.",
          ],
          [
            "Who really made it",
            "Keeps the printed label apart from the attributed maker and ranks makers by construction and codes, with the features that agree and conflict.",
          ],
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

function LotShelf({ title, lots, href }: { title: string; lots: CatalogueLot[]; href: string }) {
  if (!lots.length) return null;
  return (
    <section aria-label={title} className="space-y-3">
      <div className="flex items-baseline justify-between gap-3">
        <h2 className="text-xl font-semibold">{title}</h2>
        <Link href={href} className="text-sm underline">
          See all
        </Link>
      </div>
      <ul className="grid gap-3 md:grid-cols-2">
        {lots.map((l) => (
          <LotCard key={l.id} lot={l} />
        ))}
      </ul>
    </section>
  );
}
