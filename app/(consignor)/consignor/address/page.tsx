import { AddressForm } from "@/components/account/AddressForm";
import { requirePageViewer } from "@/lib/auth/guards";
import { myAddress } from "@/lib/services/addresses";

export const metadata = { title: "Shipping address" };

export default async function ConsignorAddressPage() {
  const viewer = await requirePageViewer("lots.consign", "/consignor/address");
  const address = await myAddress(viewer);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Shipping address</h1>
      <p className="max-w-3xl text-flash-700">
        Your lots ship from here; buyers&apos; shipping is priced from it. Invoices keep a copy of the address as it was
        when they were issued.
      </p>
      <AddressForm initial={address} purpose="Your lots ship from here; buyers' shipping is priced from it." />
    </div>
  );
}
