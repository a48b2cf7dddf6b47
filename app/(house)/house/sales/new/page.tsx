import { SaleForm } from "@/components/house/SaleForm";
import { requirePageViewer } from "@/lib/auth/guards";
import { currentSettings } from "@/lib/services/house-settings";
import { offerableLots } from "@/lib/services/sales";

export const metadata = { title: "Schedule a sale" };

export default async function NewSalePage() {
  await requirePageViewer("house.manage", "/house/sales/new");
  const { version, settings } = await currentSettings();
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Schedule a sale</h1>
      <p className="max-w-3xl text-flash-700">
        Lots close one after another, the gap apart. The opening price may not exceed the reserve the consignor agreed;
        the reserve stays hidden from bidders. The sale keeps house settings version {version} (buyer&apos;s premium{" "}
        {settings.buyersPremiumBp / 100} %) whatever changes later.
      </p>
      <SaleForm lots={await offerableLots()} softCloseSeconds={settings.softClose.windowSeconds} />
    </div>
  );
}
