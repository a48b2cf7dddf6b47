import { DeskHome } from "@/components/DeskHome";
import { requirePageViewer } from "@/lib/auth/guards";

export const metadata = { title: "House desk" };

export default async function HouseHome() {
  const viewer = await requirePageViewer("house.manage", "/house");
  return (
    <DeskHome
      title={`House desk · ${viewer.name}`}
      intro="Run the exchange: accounts and roles, the reference data every grade is measured against, and the maker registry behind source codes."
      actions={[
        {
          href: "/house/review",
          title: "Review queue",
          text: "Submitted lots waiting for a decision: ask for changes, approve with an agreed reserve, or decline.",
        },
        {
          href: "/house/sales/new",
          title: "Schedule a sale",
          text: "Offer approved lots in a live sale with staggered closing times.",
        },
        {
          href: "/house/finance",
          title: "Finance",
          text: "Invoices, escrow, the ledger and its reconciliation with the payment processor.",
        },
        {
          href: "/house/settings",
          title: "House settings",
          text: "Premium, commission, bidding, payment, inspection, claims, shipping zones and tax; every change kept.",
        },
        {
          href: "/house/users",
          title: "Accounts and roles",
          text: "Grant mediator and house roles; see who has joined.",
        },
        {
          href: "/house/reference",
          title: "Reference data",
          text: "Correct the published figures readings are graded against; every change is kept.",
        },
        {
          href: "/house/makers",
          title: "Maker registry",
          text: "Source codes and their makers; import from CSV with a preview.",
        },
        { href: "/reference", title: "Valve reference", text: "What dealers see when they look a type up." },
      ]}
    />
  );
}
