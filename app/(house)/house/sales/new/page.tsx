import { SaleForm } from "@/components/house/SaleForm";
import { requirePageViewer } from "@/lib/auth/guards";
import { offerableLots } from "@/lib/services/sales";

export const metadata = { title: "Schedule a sale" };

export default async function NewSalePage() {
  await requirePageViewer("house.manage", "/house/sales/new");
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Schedule a sale</h1>
      <p className="max-w-3xl text-flash-700">
        Lots close one after another, the gap apart. The opening price may not exceed the reserve the consignor agreed;
        the reserve stays hidden from bidders.
      </p>
      <SaleForm lots={await offerableLots()} />
    </div>
  );
}
