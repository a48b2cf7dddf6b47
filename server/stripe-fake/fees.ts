// The fake's own processing-fee rule, used for every captured card charge. It is a stand-in chosen for
// tests, not a quote of any provider's price list: 2.9 % of the captured amount, rounded half up to a
// whole minor unit, plus a fixed 30 minor units (30 cents for usd), in the charge's currency.
// Refunds return no fee; transfers and transfer reversals carry no fee.

/** Percentage part of the fake fee, in tenths of a percent (29 = 2.9 %). */
export const FEE_PERMILLE = 29;
/** Fixed part of the fake fee, in minor units. */
export const FEE_FIXED = 30;
/** How the rule reads in fee_details[].description. */
export const FEE_DESCRIPTION = "Local fake processing fee: 2.9% + 30 minor units";

/** The fake fee for a captured amount in minor units: round_half_up(amount × 2.9 %) + 30. */
export function processingFee(amount: number): number {
  return Math.floor((amount * FEE_PERMILLE + 500) / 1000) + FEE_FIXED;
}
