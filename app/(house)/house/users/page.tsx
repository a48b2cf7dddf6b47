import { AccountsTable } from "@/components/house/AccountsTable";
import { requirePageViewer } from "@/lib/auth/guards";

export const metadata = { title: "Accounts and roles" };

export default async function HouseUsersPage() {
  const viewer = await requirePageViewer("users.manage", "/house/users");
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Accounts and roles</h1>
      <p className="text-flash-700">
        People sign up as consignors or dealers. Grant mediator and house roles here; a person may hold several.
      </p>
      <AccountsTable selfId={viewer.id} />
    </div>
  );
}
