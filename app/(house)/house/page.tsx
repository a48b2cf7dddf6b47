import Link from "next/link";
import { CaseStateBadge } from "@/components/disputes/CaseStateBadge";
import { DeskHome } from "@/components/DeskHome";
import { DeskCount } from "@/components/house/DeskCount";
import { When } from "@/components/time/When";
import { requirePageViewer } from "@/lib/auth/guards";
import { formatCents } from "@/lib/money/cents";
import { houseDesk } from "@/lib/services/house-desk";

export const metadata = { title: "House desk" };

/** The house's home: what needs doing now (counts that open their queues), then the work it can start. */
export default async function HouseHome() {
  const viewer = await requirePageViewer("house.manage", "/house");
  const d = await houseDesk();
  const rec = d.reconciliation;
  const recText =
    rec.lastRunAt == null
      ? "never run"
      : rec.ok
        ? "ledger and processor agree"
        : `${rec.differences} difference${rec.differences === 1 ? "" : "s"}`;
  return (
    <DeskHome
      title={`House desk · ${viewer.name}`}
      intro="What needs the house now, then the work you can start from here."
      actions={[
        { href: "/house/sales/new", title: "Schedule a sale", text: "Offer approved lots in a live sale." },
        {
          href: "/house/settings",
          title: "House settings",
          text: "Premium, commission, bidding, payment, inspection, claims, shipping zones and tax; every change kept.",
        },
        { href: "/house/users", title: "Accounts and roles", text: "Grant mediator and house roles." },
        { href: "/house/reference", title: "Reference data", text: "Correct the figures readings are graded against." },
        { href: "/house/makers", title: "Maker registry", text: "Source codes and their makers." },
        { href: "/reference", title: "Valve reference", text: "What dealers see when they look a type up." },
      ]}
    >
      <section aria-labelledby="now-h" className="space-y-3">
        <h2 id="now-h" className="text-lg font-semibold">
          Now
        </h2>
        <div className="grid grid-cols-2 gap-3 md:grid-cols-3 lg:grid-cols-5">
          <DeskCount
            href="/house/review"
            testId="desk-review"
            count={d.review.count}
            label={d.review.count === 1 ? "Lot waiting for review" : "Lots waiting for review"}
            note={
              d.review.oldestSubmittedAt ? (
                <>
                  oldest since <When iso={d.review.oldestSubmittedAt} />
                </>
              ) : (
                "queue empty"
              )
            }
          />
          <DeskCount
            href="/sales"
            testId="desk-sales"
            count={`${d.sales.live.length} / ${d.sales.upcoming.length}`}
            label="Sales live / upcoming"
            note={`${d.sales.live.reduce((n, s) => n + s.open, 0)} lots open for bids now`}
          />
          <DeskCount
            href="/house/finance#invoices"
            testId="desk-overdue"
            count={d.overdue.count}
            label={d.overdue.count === 1 ? "Invoice overdue" : "Invoices overdue"}
            note={d.overdue.count ? `${formatCents(d.overdue.totalCents)} unpaid past due` : "none past due"}
          />
          <DeskCount
            href="#claims"
            testId="desk-claims"
            count={d.claims.count}
            label={d.claims.count === 1 ? "Open claim" : "Open claims"}
            note={
              d.claims.first[0]?.deadline ? (
                <>
                  next deadline <When iso={d.claims.first[0].deadline} />
                </>
              ) : (
                "no deadline running"
              )
            }
          />
          <DeskCount
            href="/house/finance#reconciliation"
            testId="desk-reconciliation"
            count={rec.lastRunAt == null ? "–" : rec.ok ? "OK" : rec.differences}
            alert={rec.ok === false}
            label="Reconciliation"
            note={
              <>
                {recText}
                {rec.lastRunAt ? (
                  <>
                    {" "}
                    · <When iso={rec.lastRunAt} />
                  </>
                ) : null}
                {rec.inFlight ? ` · ${rec.inFlight} in flight` : ""}
              </>
            }
          />
        </div>
      </section>
      <div className="grid gap-4 lg:grid-cols-2">
        <section id="claims" aria-labelledby="claims-h" className="card space-y-2">
          <h2 id="claims-h" className="font-semibold">
            Open claims, nearest deadline first
          </h2>
          {d.claims.first.length ? (
            <ul className="divide-y divide-flash-100 text-sm">
              {d.claims.first.map((c) => (
                <li key={c.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                  <Link href={`/disputes/${c.id}`} className="min-w-0 underline underline-offset-2">
                    <span className="code">{c.number}</span> · {c.lotTitle}
                  </Link>
                  <span className="flex flex-wrap items-center gap-2 text-flash-700">
                    <CaseStateBadge state={c.state} />
                    {c.deadline ? (
                      <span>
                        due <When iso={c.deadline} />
                      </span>
                    ) : null}
                  </span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-flash-600">No open claims.</p>
          )}
        </section>
        <section aria-labelledby="overdue-h" className="card space-y-2">
          <h2 id="overdue-h" className="font-semibold">
            Overdue invoices, oldest first
          </h2>
          {d.overdue.oldest.length ? (
            <ul className="divide-y divide-flash-100 text-sm">
              {d.overdue.oldest.map((i) => (
                <li key={i.id} className="flex flex-wrap justify-between gap-2 py-2">
                  <Link href={`/invoices/${i.id}`} className="code underline underline-offset-2">
                    {i.number}
                  </Link>
                  <span className="text-flash-700">
                    <span className="code">{formatCents(i.totalCents)}</span> · due <When iso={i.dueAt} />
                  </span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-flash-600">Nothing is overdue.</p>
          )}
        </section>
        <section aria-labelledby="sales-h" className="card space-y-2 lg:col-span-2">
          <h2 id="sales-h" className="font-semibold">
            Sales live and upcoming
          </h2>
          {d.sales.live.length + d.sales.upcoming.length ? (
            <ul className="divide-y divide-flash-100 text-sm">
              {[
                ...d.sales.live.map((s) => ({ s, live: true })),
                ...d.sales.upcoming.map((s) => ({ s, live: false })),
              ].map(({ s, live }) => (
                <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                  <Link href={`/sales/${s.id}`} className="underline underline-offset-2">
                    {s.title}
                  </Link>
                  <span className="text-flash-700">
                    <span className={live ? "font-medium text-glow-700" : ""}>{live ? "Live" : "Upcoming"}</span> ·{" "}
                    {s.open} of {s.lots} lots open
                    {live && s.nextClose ? (
                      <>
                        {" "}
                        · next close <When iso={s.nextClose} />
                      </>
                    ) : !live ? (
                      <>
                        {" "}
                        · opens <When iso={s.startsAt} />
                      </>
                    ) : null}
                  </span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-flash-600">No sale is live or scheduled.</p>
          )}
        </section>
      </div>
    </DeskHome>
  );
}
