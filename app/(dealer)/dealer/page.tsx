import { DeskHome } from "@/components/DeskHome";
import Link from "next/link";
import { requirePageViewer } from "@/lib/auth/guards";
import { formatCents } from "@/lib/money/cents";
import { watchlist } from "@/lib/services/sales";

export const metadata = { title: "Dealer desk" };

export default async function DealerHome() {
  const viewer = await requirePageViewer("lots.bid", "/dealer");
  const watching = await watchlist(viewer);
  return (
    <DeskHome
      title={`Dealer desk · ${viewer.name}`}
      intro="Read a lot's evidence before you bid: decode designations and codes, check readings against published figures, and rank the likely makers of tubes you cannot yet confirm."
      actions={[
        { href: "/sales", title: "Live sales", text: "Bid on lots as they close; a late bid extends the close." },
        { href: "/lots", title: "Approved lots", text: "Every approved lot with its evidence and summary." },
        { href: "/reference", title: "Valve reference", text: "Decode a designation, list its equivalents and nominal figures, or read a date code." },
        { href: "/shelf", title: "Unconfirmed shelf", text: "Tubes whose maker is not yet confirmed, with their best candidate makers." },
        { href: "/cautions", title: "Safety cautions", text: "High voltage in testers and amplifiers, glass, and hazardous tube materials." },
      ]}
    >
      <section aria-labelledby="watch-h" className="space-y-2">
        <h2 id="watch-h" className="text-lg font-semibold">Watchlist</h2>
        {watching.length ? (
          <ul className="space-y-1 text-sm">
            {watching.map((w) => (
              <li key={w.saleLotId}>
                <Link href={`/sales/${w.saleId}/lots/${w.saleLotId}`} className="underline">{w.title}</Link>{" "}
                <span className="text-flash-600">· {w.phase === "open" ? `${w.bidCount ? formatCents(w.priceCents) : "no bids"}, closes ${w.closesAt.slice(11, 16)} UTC` : w.phase}</span>
              </li>
            ))}
          </ul>
        ) : <p className="text-sm text-flash-600">Nothing watched yet: open a lot in a sale and choose “Watch this lot”.</p>}
      </section>
    </DeskHome>
  );
}
