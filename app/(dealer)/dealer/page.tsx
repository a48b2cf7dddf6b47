import { DeskHome } from "@/components/DeskHome";
import { requirePageViewer } from "@/lib/auth/guards";

export const metadata = { title: "Dealer desk" };

export default async function DealerHome() {
  const viewer = await requirePageViewer("lots.bid", "/dealer");
  return (
    <DeskHome
      title={`Dealer desk · ${viewer.name}`}
      intro="Read a lot's evidence before you bid: decode designations and codes, check readings against published figures, and rank the likely makers of tubes you cannot yet confirm."
      actions={[
        { href: "/reference", title: "Valve reference", text: "Decode a designation, list its equivalents and nominal figures, or read a date code." },
        { href: "/shelf", title: "Unconfirmed shelf", text: "Tubes whose maker is not yet confirmed, with their best candidate makers." },
        { href: "/cautions", title: "Safety cautions", text: "High voltage in testers and amplifiers, glass, and hazardous tube materials." },
      ]}
    />
  );
}
