import Link from "next/link";
import { DeskHome } from "@/components/DeskHome";
import { STANDING_SHORT } from "@/components/live/standing-words";
import { TimeLeft } from "@/components/live/TimeLeft";
import { When } from "@/components/time/When";
import { INVOICE_STATE_WORDS } from "@/components/invoices/words";
import { requirePageViewer } from "@/lib/auth/guards";
import { STATE_WORDS } from "@/lib/disputes/rules";
import { formatCents } from "@/lib/money/cents";
import { dealerDesk } from "@/lib/services/dealer-desk";
import { listWantLists } from "@/lib/services/want-lists";

export const metadata = { title: "Dealer desk" };

const lotHref = (l: { saleId: string; saleLotId: string }) => `/sales/${l.saleId}/lots/${l.saleLotId}`;

function Section({
  id,
  title,
  empty,
  children,
}: {
  id: string;
  title: string;
  empty: string | null;
  children: React.ReactNode;
}) {
  return (
    <section aria-labelledby={`${id}-h`} className="card space-y-2">
      <h2 id={`${id}-h`} className="text-lg font-semibold">
        {title}
      </h2>
      {empty ? (
        <p className="text-sm text-flash-600">{empty}</p>
      ) : (
        <ul className="divide-y divide-flash-100 text-sm">{children}</ul>
      )}
    </section>
  );
}

export default async function DealerHome() {
  const viewer = await requirePageViewer("lots.bid", "/dealer");
  const [desk, wants] = await Promise.all([dealerDesk(viewer), listWantLists(viewer)]);
  const open = desk.bidding.filter((b) => b.phase === "open");
  return (
    <DeskHome
      title={`Dealer desk · ${viewer.name}`}
      intro="Your bids, your wins and what you owe, in one place. Read a lot's evidence before you bid."
      actions={[
        { href: "/sales", title: "Live sales", text: "Bid on lots as they close; a late bid extends the close." },
        {
          href: "/catalogue",
          title: "Catalogue",
          text: "Find lots by type and equivalents, grade, matched sets and sale status, with pictures and price history.",
        },
        {
          href: "/reference",
          title: "Valve reference",
          text: "Decode a designation, list its equivalents and nominal figures, or read a date code.",
        },
        {
          href: "/dealer/address",
          title: "Shipping address",
          text: "Where lots you win ship to; shipping and tax on new invoices follow it.",
        },
        {
          href: "/shelf",
          title: "Unconfirmed shelf",
          text: "Tubes whose maker is not yet confirmed, with their best candidate makers.",
        },
      ]}
    >
      <div className="grid gap-4 lg:grid-cols-2">
        <Section
          id="bids"
          title="Lots I'm bidding on"
          empty={open.length ? null : "No open bids. Open a sale and set a ceiling on a lot."}
        >
          {open.map((b) => (
            <li
              key={b.saleLotId}
              className="flex flex-wrap items-baseline gap-x-3 py-2"
              data-testid={`desk-bid-${b.saleLotId}`}
            >
              <Link
                href={lotHref(b)}
                className="w-full min-w-0 sm:w-auto sm:flex-1 font-medium underline underline-offset-2"
              >
                {b.title}
              </Link>
              <span className={`font-medium ${b.standing === "leading" ? "text-sound-700" : "text-glow-700"}`}>
                {STANDING_SHORT[b.standing]}
              </span>
              <span className="w-full text-flash-700">
                <span className="code">{formatCents(b.priceCents)}</span> now · my ceiling{" "}
                <span className="code">{formatCents(b.ceilingCents)}</span> · closes in <TimeLeft iso={b.closesAt} />
              </span>
            </li>
          ))}
        </Section>
        <Section id="due" title="Invoices to pay" empty={desk.due.length ? null : "Nothing to pay."}>
          {desk.due.map((w) => (
            <li key={w.invoiceId} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2">
              <span className="w-full min-w-0 sm:w-auto sm:flex-1">{w.title}</span>
              <span className="code">{formatCents(w.totalCents ?? 0)}</span>
              <span className="text-flash-600">
                due <When iso={w.dueAt} style="date" />
              </span>
              <Link href={`/invoices/${w.invoiceId}`} className="btn-primary min-h-10">
                Pay
              </Link>
            </li>
          ))}
        </Section>
        <Section id="won" title="Lots won" empty={desk.won.length ? null : "No lots won yet."}>
          {desk.won.map((w) => (
            <li key={w.saleLotId} className="flex flex-wrap items-baseline gap-x-3 py-2">
              <Link
                href={w.invoiceId ? `/invoices/${w.invoiceId}` : lotHref(w)}
                className="w-full min-w-0 sm:w-auto sm:flex-1 underline underline-offset-2"
              >
                {w.title}
              </Link>
              <span className="code">{formatCents(w.hammerCents)}</span>
              <span className="text-flash-600">
                {w.invoiceState ? (INVOICE_STATE_WORDS[w.invoiceState] ?? w.invoiceState) : "Invoice on its way"}
              </span>
            </li>
          ))}
        </Section>
        <Section id="claims" title="Claims" empty={desk.claims.length ? null : "No claims."}>
          {desk.claims.map((c) => (
            <li key={c.id} className="flex flex-wrap gap-x-3 py-2">
              <Link href={`/disputes/${c.id}`} className="code underline">
                {c.number}
              </Link>
              <span className="w-full min-w-0 sm:w-auto sm:flex-1">{c.lotTitle}</span>
              <span className="text-flash-600">{STATE_WORDS[c.state]}</span>
            </li>
          ))}
        </Section>
        <Section
          id="watch"
          title="Lots I follow"
          empty={
            desk.watching.length ? null : "Nothing followed yet: open a lot in a sale and choose “Follow on my desk”."
          }
        >
          {desk.watching.map((w) => (
            <li key={w.saleLotId} className="flex flex-wrap items-baseline gap-x-3 py-2">
              <Link href={lotHref(w)} className="w-full min-w-0 sm:w-auto sm:flex-1 underline underline-offset-2">
                {w.title}
              </Link>
              <span className="code">{w.bidCount ? formatCents(w.priceCents) : "no bids"}</span>
              <span className="text-flash-600">
                {w.phase === "open" ? (
                  <>
                    closes <When iso={w.closesAt} style="datetime" />
                  </>
                ) : (
                  <TimeLeft iso={w.closesAt} phase={w.phase} />
                )}
              </span>
            </li>
          ))}
        </Section>
        <Section
          id="wants"
          title="Want lists"
          empty={wants.length ? null : "No want lists yet: search the catalogue for a type and save the search."}
        >
          {wants.slice(0, 8).map((w) => (
            <li key={w.id} className="flex flex-wrap items-baseline gap-x-3 py-2">
              <Link
                href={`/catalogue?q=${encodeURIComponent(w.criteria.designation)}`}
                className="min-w-0 flex-1 font-medium underline underline-offset-2"
              >
                {w.name}
              </Link>
              <span className="text-flash-700">
                {w.paused ? "paused" : `${w.hits} lot${w.hits === 1 ? "" : "s"} matched`}
              </span>
            </li>
          ))}
          {wants.length ? (
            <li className="py-2">
              <Link href="/dealer/want-lists" className="underline">
                All want lists
              </Link>
            </li>
          ) : null}
        </Section>
      </div>
    </DeskHome>
  );
}
