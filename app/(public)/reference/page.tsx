import type { Metadata } from "next";
import Link from "next/link";
import { DateCodeAnswer } from "@/components/valves/DateCodeAnswer";
import { TypeAnswer } from "@/components/valves/TypeAnswer";
import { PriceHistory } from "@/components/catalogue/PriceHistory";
import { priceHistoryForDesignation } from "@/lib/services/catalogue/price-history";
import { ApiError } from "@/lib/api/errors";
import { readCodeForType, type DateCodeAnswer as CodeData } from "@/lib/services/date-codes";
import { lookupType, type TypeLookup } from "@/lib/services/valve-types";
import { DateCodeQuery, DesignationParam } from "@/lib/validation/valves";
import { SOURCES } from "@/lib/valves/sources";

export const metadata: Metadata = { title: "Valve reference" };

type Search = { q?: string; code?: string; type?: string };

async function typeResult(q: string): Promise<{ data?: TypeLookup; error?: string; candidates?: string[] }> {
  const parsed = DesignationParam.safeParse(q);
  if (!parsed.success) return { error: parsed.error.issues[0]!.message };
  try {
    return { data: await lookupType(parsed.data) };
  } catch (e) {
    if (e instanceof ApiError)
      return { error: e.message, candidates: (e.details?.candidates as string[] | undefined) ?? [] };
    throw e;
  }
}

async function codeResult(code: string, type?: string): Promise<{ data?: CodeData; error?: string }> {
  const parsed = DateCodeQuery.safeParse({ code, type: type || undefined });
  if (!parsed.success) return { error: parsed.error.issues[0]!.message };
  try {
    return { data: await readCodeForType(parsed.data) };
  } catch (e) {
    if (e instanceof ApiError) return { error: e.message };
    throw e;
  }
}

export default async function ReferencePage({ searchParams }: { searchParams: Promise<Search> }) {
  const sp = await searchParams;
  const q = typeof sp.q === "string" ? sp.q : "";
  const code = typeof sp.code === "string" ? sp.code : "";
  const type = typeof sp.type === "string" ? sp.type : "";
  const t = q ? await typeResult(q) : null;
  const c = code ? await codeResult(code, type) : null;
  return (
    <div className="space-y-8">
      <header className="space-y-2">
        <h1 className="text-2xl font-semibold tracking-tight">Valve reference</h1>
        <p className="max-w-3xl text-flash-700">
          Type a designation as it is printed (12AX7, ecc 83, 6SN7GT) to read how it decodes, its published figures and
          its equivalents; or type a code off the glass to read its possible dates.
        </p>
      </header>
      <div className="grid gap-4 md:grid-cols-2">
        <form method="get" className="card space-y-3" role="search" aria-label="Look up a designation">
          <label htmlFor="q" className="label">
            Designation
          </label>
          <div className="flex gap-2">
            <input
              id="q"
              name="q"
              defaultValue={q}
              className="input code"
              placeholder="e.g. 12AX7, EL84, 6SN7GT"
              autoComplete="off"
              maxLength={200}
            />
            <button type="submit" className="btn-primary whitespace-nowrap">
              Look up
            </button>
          </div>
        </form>
        <form method="get" className="card space-y-3" aria-label="Read a date code">
          <div className="grid grid-cols-[1fr_9rem] gap-2">
            <div>
              <label htmlFor="code" className="label">
                Code off the glass
              </label>
              <input
                id="code"
                name="code"
                defaultValue={code}
                className="input code mt-1"
                placeholder="e.g. 5943 or X31-5943"
                autoComplete="off"
                maxLength={100}
              />
            </div>
            <div>
              <label htmlFor="type" className="label">
                On type (optional)
              </label>
              <input
                id="type"
                name="type"
                defaultValue={type}
                className="input code mt-1"
                placeholder="12AX7"
                autoComplete="off"
                maxLength={100}
              />
            </div>
          </div>
          <button type="submit" className="btn-quiet">
            Read the code
          </button>
        </form>
      </div>
      {t?.error ? (
        <div role="status" className="card border-fault-600">
          <p className="font-medium text-fault-700">{t.error}</p>
          {t.candidates?.length ? (
            <p className="mt-2 text-sm">
              Did you mean{" "}
              {t.candidates.map((x, i) => (
                <span key={x}>
                  {i ? ", " : ""}
                  <Link className="code underline" href={`/reference?q=${encodeURIComponent(x)}`}>
                    {x}
                  </Link>
                </span>
              ))}
              ?
            </p>
          ) : null}
        </div>
      ) : null}
      {t?.data ? <TypeAnswer data={t.data} /> : null}
      {t?.data ? (
        <PriceHistory series={await priceHistoryForDesignation(q)} heading="Price history in our sales" />
      ) : null}
      {c?.error ? (
        <p role="status" className="card font-medium text-fault-700">
          {c.error}
        </p>
      ) : null}
      {c?.data ? <DateCodeAnswer data={c.data} /> : null}
      <section aria-labelledby="sources-h" className="card space-y-2">
        <h2 id="sources-h" className="font-semibold">
          Sources
        </h2>
        <p className="text-sm text-flash-700">
          Every figure and rule carries one of these tags. “MEM” marks what was recalled from memory and awaits a check
          against a data sheet.
        </p>
        <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[6rem_1fr]">
          {SOURCES.map((s) => (
            <div key={s.tag} className="contents">
              <dt className="code font-medium">{s.tag}</dt>
              <dd>
                <span className="font-medium">{s.title}.</span> {s.publication}
              </dd>
            </div>
          ))}
        </dl>
      </section>
    </div>
  );
}
