/** Our own words for an invoice's way through escrow. */
export const INVOICE_STATE_WORDS: Record<string, string> = {
  "awaiting-payment": "Awaiting payment",
  "paid-held": "Paid, held by the house",
  shipped: "Shipped",
  delivered: "Delivered, inspection open",
  released: "Released to the consignor",
  disputed: "Claim open: payment held",
  refunded: "Refunded",
  cancelled: "Cancelled",
};
