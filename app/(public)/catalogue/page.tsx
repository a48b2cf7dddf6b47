import Link from "next/link";
import { Filters } from "@/components/catalogue/Filters";
import { LotCard } from "@/components/catalogue/LotCard";
import { SaveWantList } from "@/components/catalogue/SaveWantList";
import { SORT_WORDS } from "@/components/catalogue/words";
import { FormAlert } from "@/components/forms/Field";
import { ApiError } from "@/lib/api/errors";
import { currentViewer } from "@/lib/auth/guards";
import { can } from "@/lib/auth/roles";
import { SORTS } from "@/lib/catalogue/cursor";
import { searchCatalogue, type CatalogueResult } from "@/lib/services/catalogue/search";
import {
  CatalogueQuerySchema,
  queryToSearchParams,
  searchParamsToObject,
  type CatalogueQuery,
} from "@/lib/validation/catalogue";

export const metadata = { title: "Catalogue" };

const ESTIMATE_BANDS: [string, number | undefined, number | undefined][] = [
  ["Under $50", undefined, 5_000],
  ["$50 to $200", 5_000, 20_000],
  ["$200 to $1,000", 20_000, 100_000],
  ["Over $1,000", 100_000, undefined],
];

export default async function CataloguePage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const raw = await searchParams;
  const viewer = await currentViewer().catch(() => null);
  const parsed = CatalogueQuerySchema.safeParse(searchParamsToObject(raw));
  let result: CatalogueResult | null = null;
  let problem: string | null = parsed.success
    ? null
    : parsed.error.issues.map((i) => `${i.path.join(".") || "search"}: ${i.message}`).join("; ");
  const q: CatalogueQuery = parsed.success ? parsed.data : CatalogueQuerySchema.parse({});
  if (parsed.success) {
    result = await searchCatalogue(q).catch((e: unknown) => {
      if (e instanceof ApiError && e.status < 500) {
        problem = e.message;
        return null;
      }
      throw e;
    });
  }
  const here = `/catalogue?${queryToSearchParams(q).toString()}`;
  const sort = q.sort ?? (q.q ? "relevance" : "newest");
  return (
    <div className="space-y-5">
      <header className="space-y-3">
        <h1 className="text-2xl font-semibold">Catalogue</h1>
        <form action="/catalogue" method="get" role="search" className="flex flex-wrap items-end gap-2">
          <label className="min-w-0 flex-1 basis-64">
            <span className="label">Type, equivalent or words</span>
            <input
              name="q"
              defaultValue={q.q}
              maxLength={120}
              placeholder="e.g. 6922, ecc 83, EL84, estate"
              className="input code mt-1 w-full"
              autoComplete="off"
            />
          </label>
          <label>
            <span className="label">Order</span>
            <select name="sort" defaultValue={sort} className="input mt-1">
              {SORTS.filter((s) => s !== "relevance" || q.q).map((s) => (
                <option key={s} value={s}>
                  {SORT_WORDS[s]}
                </option>
              ))}
            </select>
          </label>
          {q.status.map((s) => (
            <input key={s} type="hidden" name="status" value={s} />
          ))}
          <button type="submit" className="btn-primary">
            Search
          </button>
        </form>
        {problem ? <FormAlert>{problem}</FormAlert> : null}
        {result ? (
          <p className="text-sm text-flash-700" aria-live="polite">
            <strong>{result.facets.total.toLocaleString("en-US")}</strong> lot{result.facets.total === 1 ? "" : "s"}
            {result.term ? (
              <>
                {" "}
                with <span className="code">{result.term.designation}</span> or a related type
              </>
            ) : q.q ? (
              <> matching “{q.q}”</>
            ) : null}
            {q.cursor ? (
              <>
                {" "}
                ·{" "}
                <Link
                  href={`/catalogue?${queryToSearchParams({ ...q, cursor: undefined }).toString()}`}
                  className="underline"
                >
                  back to the first page
                </Link>
              </>
            ) : null}
          </p>
        ) : null}
      </header>
      {result ? (
        <div className="grid gap-6 lg:grid-cols-[16rem_1fr]">
          <aside aria-label="Filters">
            <details className="card lg:hidden">
              <summary className="cursor-pointer font-medium">Filters</summary>
              <div className="mt-3">
                <Filters q={q} facets={result.facets} />
              </div>
            </details>
            <div className="hidden lg:block">
              <Filters q={q} facets={result.facets} />
            </div>
            <div className="mt-4 hidden space-y-1 lg:block">
              <h3 className="text-xs font-semibold uppercase tracking-wide text-flash-600">Estimate</h3>
              <ul className="text-sm">
                {ESTIMATE_BANDS.map(([label, min, max]) => (
                  <li key={label}>
                    <Link
                      className="underline-offset-4 hover:underline"
                      href={`/catalogue?${queryToSearchParams({ ...q, estMinCents: min, estMaxCents: max, cursor: undefined }).toString()}`}
                    >
                      {label}
                    </Link>
                  </li>
                ))}
              </ul>
            </div>
          </aside>
          <section aria-label="Lots" className="space-y-4">
            {result.term ? (
              <div className="card">
                <SaveWantList
                  designation={result.term.designation}
                  condition={q.condition}
                  noVacuumLoss={q.noVacuumLoss === "1"}
                  signedIn={Boolean(viewer)}
                  isDealer={Boolean(viewer && can(viewer.roles, "lots.bid"))}
                  here={here}
                />
              </div>
            ) : null}
            {result.lots.length ? (
              <ul className="space-y-3">
                {result.lots.map((l) => (
                  <LotCard key={l.id} lot={l} />
                ))}
              </ul>
            ) : (
              <p className="card text-flash-700">
                No lot matches this search yet.{result.term ? " Save it as a want list to hear of the next one." : ""}
              </p>
            )}
            {result.nextCursor ? (
              <Link
                href={`/catalogue?${queryToSearchParams({ ...q, cursor: result.nextCursor }).toString()}`}
                className="btn-quiet"
                rel="next"
              >
                More lots
              </Link>
            ) : null}
          </section>
        </div>
      ) : null}
    </div>
  );
}
