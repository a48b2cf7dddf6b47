import { DeskHome } from "@/components/DeskHome";
import { requirePageViewer } from "@/lib/auth/guards";

export const metadata = { title: "Mediation" };

export default async function MediationHome() {
  const viewer = await requirePageViewer("disputes.mediate", "/mediation");
  return (
    <DeskHome
      title={`Mediation · ${viewer.name}`}
      intro="Weigh a buyer's evidence against what a listing claimed: codes, construction and readings, item by item, and record a reasoned decision."
      actions={[
        { href: "/shelf", title: "Attribution workbench", text: "Rank candidate makers for a set of construction features and codes." },
        { href: "/reference", title: "Valve reference", text: "Designations, equivalents, nominal figures and date codes." },
      ]}
    />
  );
}
