/**
 * Shipping addresses: a buyer's (where lots go) and a consignor's (where lots leave from), one per person, and the
 * copies an invoice keeps from the moment it was issued.
 */
import { QueryTypes, type Transaction } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { addressBlock, AddressSchema, type Address, type AddressBlock } from "../validation/address";
import { houseBlock } from "../validation/house-details";
import { db, UserAddress } from "../../models";
import { settingsForInvoice } from "./house-settings";

/** A person's address, or null when they have not given one. */
export async function addressOf(userId: string, t?: Transaction): Promise<Address | null> {
  db();
  const row = await UserAddress.findByPk(userId, { transaction: t });
  return row ? row.toAddress() : null;
}

/** The viewer's own address. */
export async function myAddress(viewer: Viewer): Promise<Address | null> {
  return addressOf(viewer.id);
}

/** Add or replace the viewer's address (the same input twice leaves one row: an upsert by person). */
export async function saveMyAddress(viewer: Viewer, input: Address): Promise<Address> {
  db();
  await UserAddress.upsert({ userId: viewer.id, ...input });
  return (await addressOf(viewer.id))!;
}

/** Reads a snapshot stored on an invoice; anything malformed reads as no address. */
function snapshot(raw: unknown): Address | null {
  if (raw == null) return null;
  const r = AddressSchema.safeParse(raw);
  return r.success ? r.data : null;
}

/** The addresses an invoice was issued with, as print blocks: where the lot ships to and where it ships from. */
export type InvoiceAddresses = { buyer: AddressBlock | null; origin: AddressBlock | null };

/** The pure half of {@link invoiceAddresses}: print blocks from the stored snapshots. */
export function invoiceAddressBlocks(row: { buyer_address: unknown; origin_address: unknown }): InvoiceAddresses {
  return { buyer: addressBlock(snapshot(row.buyer_address)), origin: addressBlock(snapshot(row.origin_address)) };
}

/**
 * The buyer's address snapshotted on an invoice, as `{ name, lines }` or null (for the invoice PDF's address block);
 * the origin (the consignor's address) alongside. Access is the caller's business: check the viewer first.
 */
export async function invoiceAddresses(invoiceId: string): Promise<InvoiceAddresses> {
  const [row] = await db().query<{ buyer_address: unknown; origin_address: unknown }>(
    `SELECT buyer_address, origin_address FROM invoices WHERE id = :invoiceId`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT },
  );
  if (!row) throw new ApiError("not_found", "No such invoice");
  return invoiceAddressBlocks(row);
}

/**
 * The house as the sender on an invoice's papers: its details in the settings version the invoice follows (its own,
 * else the one frozen on its sale), so a later change of the house's address leaves a sale's papers as they were.
 */
export async function invoiceHouseBlock(invoiceId: string, t?: Transaction): Promise<NonNullable<AddressBlock>> {
  return houseBlock((await settingsForInvoice(invoiceId, t)).house);
}
