import { QueryTypes } from "sequelize";
import type { Viewer } from "../../auth/guards";
import { ApiError } from "../../api/errors";
import type { AddressBlock } from "../../documents/layout";
import type { InvoiceDoc } from "../../documents/invoice";
import type { PackingDoc } from "../../documents/packing-slip";
import { db, LotItem } from "../../../models";
import { invoiceAddresses, invoiceHouseBlock } from "../addresses";
import { getInvoice } from "../invoices";
import { presentItem } from "../lots";
import { summaryFor } from "../lot-summary";
import { paperCautions } from "./cautions";

type Kind = "invoice" | "packing-slip";

/**
 * The invoice as a document may be read by its buyer and the house; the invoice itself also by the mediator
 * of its claim (as the web invoice allows), never the packing slip. The consignor sees the web invoice but
 * gets no buyer's paper (403); anyone else is told there is no such invoice (404).
 */
async function readable(viewer: Viewer, invoiceId: string, kind: Kind) {
  const inv = await getInvoice(viewer, invoiceId);
  const house = viewer.roles.includes("admin");
  const mediator = "readOnly" in inv && inv.readOnly;
  if (!(house || inv.isBuyer || (kind === "invoice" && mediator)))
    throw new ApiError("forbidden", "Only the buyer and the house print this invoice's papers");
  const [extra] = await db().query<{ created_at: Date; buyer: string; sale_title: string }>(
    `SELECT i.created_at, u.display_name AS buyer, s.title AS sale_title
       FROM invoices i JOIN users u ON u.id = i.buyer_id JOIN sale_lots sl ON sl.id = i.sale_lot_id JOIN sales s ON s.id = sl.sale_id
      WHERE i.id = :invoiceId`,
    { replacements: { invoiceId }, type: QueryTypes.SELECT },
  );
  return { inv, extra: extra! };
}

/** Postal blocks for the invoice's papers: the buyer's address as it stood when the invoice was issued. */
export type InvoiceAddresses = { buyer: AddressBlock; house: AddressBlock };

/**
 * The buyer's block comes from the invoice's own snapshot; the house's from the settings version frozen for the sale.
 * Where the lot ships from (the consignor's address) stays off the buyer's papers, as on the web invoice.
 */
async function papersAddresses(invoiceId: string): Promise<InvoiceAddresses> {
  const [{ buyer }, house] = await Promise.all([invoiceAddresses(invoiceId), invoiceHouseBlock(invoiceId)]);
  return { buyer, house };
}

/** The invoice document's data, for a viewer allowed to print it. Money lines are the invoice row's own. */
export async function invoiceDocument(viewer: Viewer, invoiceId: string): Promise<InvoiceDoc> {
  const { inv, extra } = await readable(viewer, invoiceId, "invoice");
  const addresses = await papersAddresses(invoiceId);
  return {
    number: inv.number,
    state: inv.state,
    lotTitle: inv.title,
    saleTitle: extra.sale_title,
    tubeCount: inv.tubeCount,
    issuedAt: extra.created_at.toISOString(),
    dueAt: inv.dueAt,
    paidAt: inv.paidAt,
    hammerCents: inv.hammerCents,
    premiumBp: inv.premiumBp,
    premiumCents: inv.premiumCents,
    shippingCents: inv.shippingCents,
    taxCents: inv.taxCents,
    totalCents: inv.totalCents,
    refundedCents: inv.refundedCents,
    buyerName: extra.buyer,
    addresses,
  };
}

/** The packing slip's data: the lot's items by type, condition and count, and the cautions its types need. */
export async function packingSlipDocument(viewer: Viewer, invoiceId: string): Promise<PackingDoc> {
  const { inv, extra } = await readable(viewer, invoiceId, "packing-slip");
  const addresses = await papersAddresses(invoiceId);
  db();
  const items = (await LotItem.findAll({ where: { lotId: inv.lotId }, order: [["position", "ASC"]] })).map(presentItem);
  const { summary } = await summaryFor(items);
  const lines: PackingDoc["lines"] = [];
  for (const i of items) {
    const designation = i.designation || i.designationTyped;
    const same = lines.find((l) => l.designation === designation && l.condition === i.condition);
    if (same) same.tubes += i.quantity;
    else lines.push({ designation, condition: i.condition, tubes: i.quantity });
  }
  return {
    invoiceNumber: inv.number,
    lotTitle: inv.title,
    saleTitle: extra.sale_title,
    buyerName: extra.buyer,
    shipTo: addresses.buyer,
    from: addresses.house,
    preparedAt: new Date().toISOString(),
    lines,
    cautions: paperCautions(summary.hazards),
  };
}
