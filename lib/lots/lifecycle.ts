/**
 * A consigned lot's whole life in one word ([SUG] our own stage names):
 * from the consignor's draft through the house, a sale, payment, shipping
 * and release, to a claim. Pure: plain data in, a stage and figures out.
 */
export type LotStage =
  | "draft"
  | "with-house"
  | "changes-asked"
  | "declined"
  | "approved"
  | "scheduled"
  | "in-sale"
  | "unsold"
  | "withdrawn"
  | "sold-awaiting-payment"
  | "paid"
  | "shipped"
  | "delivered"
  | "released"
  | "claim"
  | "refunded"
  | "cancelled";

export interface LifeInput {
  lotState: "draft" | "in-review" | "needs-changes" | "approved" | "declined" | string;
  sale: { phase: "open" | "sold" | "unsold" | "withdrawn"; startsAtMs: number } | null;
  invoiceState: string | null;
  claimOpen: boolean;
  nowMs: number;
}

export const STAGE_WORDS: Record<LotStage, string> = {
  draft: "Draft",
  "with-house": "With the house",
  "changes-asked": "House asked for changes",
  declined: "Declined by the house",
  approved: "Approved, waiting for a sale",
  scheduled: "In a sale that has not started",
  "in-sale": "Taking bids",
  unsold: "Closed unsold",
  withdrawn: "Withdrawn from the sale",
  "sold-awaiting-payment": "Sold, buyer paying",
  paid: "Paid, held by the house",
  shipped: "Shipped to the buyer",
  delivered: "Delivered, buyer inspecting",
  released: "Released to you",
  claim: "Claim open",
  refunded: "Refunded to the buyer",
  cancelled: "Sale cancelled",
};

/** The stage a lot is at now. */
export function lotStage(i: LifeInput): LotStage {
  if (i.lotState === "draft") return "draft";
  if (i.lotState === "in-review") return "with-house";
  if (i.lotState === "needs-changes") return "changes-asked";
  if (i.lotState === "declined") return "declined";
  if (!i.sale) return "approved";
  if (i.sale.phase === "open") return i.nowMs < i.sale.startsAtMs ? "scheduled" : "in-sale";
  if (i.sale.phase === "unsold") return "unsold";
  if (i.sale.phase === "withdrawn") return "withdrawn";
  if (i.claimOpen || i.invoiceState === "disputed") return "claim";
  switch (i.invoiceState) {
    case "paid-held":
      return "paid";
    case "shipped":
      return "shipped";
    case "delivered":
      return "delivered";
    case "released":
      return "released";
    case "refunded":
      return "refunded";
    case "cancelled":
      return "cancelled";
    default:
      return "sold-awaiting-payment";
  }
}

/** The consignor's figures on one sold lot, in cents. */
export interface ProceedsInput {
  hammerCents: number;
  commissionCents: number;
  hammerRefundedCents: number;
  commissionReturnedCents: number;
  cancelled: boolean;
}

/**
 * Net proceeds = hammer − commission − hammer refunded to the buyer + commission
 * the house gave back ([SUG] our settlement rule; the buyer's premium and
 * shipping are the buyer's and the house's, not the consignor's).
 */
export function netProceeds(p: ProceedsInput): number {
  if (p.cancelled) return 0;
  return p.hammerCents - p.commissionCents - p.hammerRefundedCents + p.commissionReturnedCents;
}

/** Sum per sale: `{ saleId → cents }`, from lots that carry a sale and a net figure. */
export function proceedsBySale(
  rows: readonly { saleId: string | null; netCents: number | null }[],
): Map<string, number> {
  const out = new Map<string, number>();
  for (const r of rows) if (r.saleId && r.netCents != null) out.set(r.saleId, (out.get(r.saleId) ?? 0) + r.netCents);
  return out;
}

/** Whether the consignor may ask for the lot to be offered again. */
export function canRelist(stage: LotStage): boolean {
  return stage === "unsold" || stage === "withdrawn";
}
