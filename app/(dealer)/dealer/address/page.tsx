import { AddressForm } from "@/components/account/AddressForm";
import { requirePageViewer } from "@/lib/auth/guards";
import { myAddress } from "@/lib/services/addresses";

export const metadata = { title: "Shipping address" };

export default async function DealerAddressPage() {
  const viewer = await requirePageViewer("lots.bid", "/dealer/address");
  const address = await myAddress(viewer);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Shipping address</h1>
      <p className="max-w-3xl text-flash-700">
        Lots you win ship here; shipping and tax on new invoices follow it. Invoices keep a copy of the address as it
        was when they were issued.
      </p>
      <AddressForm initial={address} purpose="Lots you win ship here; shipping and tax on new invoices follow it." />
    </div>
  );
}
