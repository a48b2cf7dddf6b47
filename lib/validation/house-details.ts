/**
 * The house's own business details, printed as the sender on its papers (the invoice's "From", the packing slip's
 * sender block, the web invoice). Part of the versioned house settings, so a sale's papers keep the details of the
 * version frozen on that sale. The postal address has the shape and checks of a buyer's or consignor's address
 * (lib/validation/address.ts) without its recipient line: the trading name heads the block instead.
 */
import { z } from "zod";
import { addressBlock, AddressSchema, type AddressBlock } from "./address";
import { lineText } from "./text";

/** The address lines of the house: a person's address shape, the trading name standing in for the recipient. */
export const HouseAddressSchema = AddressSchema.omit({ name: true });

export const HouseDetailsSchema = z.object({
  tradingName: lineText()
    .trim()
    .min(2, "Give the house's trading name")
    .max(100, "Trading name: at most 100 characters"),
  address: HouseAddressSchema,
  paperworkEmail: lineText()
    .trim()
    .toLowerCase()
    .max(254, "E-mail: at most 254 characters")
    .pipe(z.email("Enter a valid e-mail address")),
});
export type HouseDetails = z.infer<typeof HouseDetailsSchema>;

/** The details the exchange starts with: an invented place in the demo's invented world [SUG demo data]. */
export const INITIAL_HOUSE_DETAILS: HouseDetails = {
  tradingName: "Getterline Exchange",
  address: {
    line1: "Flashfield Works, Unit 4",
    line2: "27 Anode Street",
    city: "Glowmere",
    region: "",
    postalCode: "GM4 7EX",
    country: "GB",
  },
  paperworkEmail: "paperwork@house.getterline.test",
};

/** The house as a print block: its trading name, its address lines, then where paperwork questions go. */
export function houseBlock(d: HouseDetails): NonNullable<AddressBlock> {
  const block = addressBlock({ name: d.tradingName, ...d.address })!;
  return { name: block.name, lines: [...block.lines, d.paperworkEmail] };
}
