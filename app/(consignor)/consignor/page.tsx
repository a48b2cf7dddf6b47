import { CautionStrip } from "@/components/CautionStrip";
import { DeskHome } from "@/components/DeskHome";
import { requirePageViewer } from "@/lib/auth/guards";

export const metadata = { title: "My consignments" };

export default async function ConsignorHome() {
  const viewer = await requirePageViewer("lots.consign", "/consignor");
  return (
    <DeskHome
      title={`My consignments · ${viewer.name}`}
      intro="Turn a box of valves into a lot a dealer can trust: what each tube is, how it tested, the codes on its glass and who really made it."
      actions={[
        { href: "/reference", title: "Valve reference", text: "Check how a designation decodes and what a code on the glass means before you list it." },
        { href: "/cautions", title: "Safety cautions", text: "Read these before testing or packing tubes." },
      ]}
    >
      <CautionStrip anchor="high-voltage">
        Tube testers and amplifiers carry lethal voltages. Getterline never asks you to power equipment; list what you know.
      </CautionStrip>
    </DeskHome>
  );
}
