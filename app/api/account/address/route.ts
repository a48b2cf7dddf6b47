// GET /api/account/address — the signed-in buyer's or consignor's shipping address; PUT adds or replaces it
import { readJson, route } from "@/lib/api/route";
import { myAddress, saveMyAddress } from "@/lib/services/addresses";
import { AddressSchema } from "@/lib/validation/address";

export const GET = route({ permission: "address.keep" }, async ({ viewer }) => ({ address: await myAddress(viewer) }));

export const PUT = route({ permission: "address.keep" }, async ({ req, viewer }) => ({
  address: await saveMyAddress(viewer, await readJson(req, AddressSchema)),
}));
